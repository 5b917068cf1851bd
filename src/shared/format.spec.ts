import { modelName, sig } from './format';

describe('display formats', () => {
  it('rounds to four significant figures with separators', () => {
    expect(sig(20535.1641)).toBe('20,540');
    expect(sig(0.363344)).toBe('0.3633');
    expect(sig(1865.33)).toBe('1,865');
    expect(sig(null)).toBe('—');
  });

  it('names models as published', () => {
    expect(modelName('pella-tomlinson')).toBe('Pella-Tomlinson');
    expect(modelName('rosenzweig-macarthur')).toBe('Rosenzweig-MacArthur');
  });
});
