import { modelName, proposalStart, sig } from './format';

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

  it('starts a proposal below its bound, never above it', () => {
    // 2,346.6 is a fold-risk bound: rounding to 2,347 would need the board's override.
    expect(proposalStart(2346.6)).toBe(2346);
    expect(proposalStart(2347)).toBe(2347);
    expect(proposalStart(0.2389, 'F')).toBe(0.238);
    expect(proposalStart(Number.NaN)).toBe(0);
  });
});
