import { surplusFold } from './fold';
import { fitSurplusRaw } from './fit-surplus';
import { biomassPath, production, referencePoints } from './surplus';

// Formulas and numbers: ../shared/check-values.md. Schaefer (1954) Bull. IATTC 1:27; Pella &
// Tomlinson (1969) Bull. IATTC 13:419 in the (r/p)·B·(1 − (B/K)^p) form; Fox (1970) Trans. Am.
// Fish. Soc. 99:80 in the rB·ln(K/B) form.
describe('surplus-production reference points and folds', () => {
  const r = 0.4, K = 1000;

  it('Schaefer: MSY = rK/4, B_MSY = K/2, F_MSY = r/2', () => {
    expect(referencePoints('schaefer', { r, K })).toEqual({ msy: 100, bMsy: 500, fMsy: 0.2 });
  });

  it('Pella-Tomlinson p = 0.5 and p = 2 match the published B_MSY/K and MSY', () => {
    const a = referencePoints('pella-tomlinson', { r, K, p: 0.5 });
    expect(a.bMsy / K).toBeCloseTo(0.444444, 6);
    expect(a.msy).toBeCloseTo(118.519, 3);
    expect(a.fMsy).toBeCloseTo(r / 1.5, 12);
    const b = referencePoints('pella-tomlinson', { r, K, p: 2 });
    expect(b.bMsy / K).toBeCloseTo(0.57735, 5);
    expect(b.msy).toBeCloseTo(76.98, 3);
  });

  it('Fox: B_MSY = K/e, MSY = rK/e, F_MSY = r', () => {
    const f = referencePoints('fox', { r, K });
    expect(f.bMsy).toBeCloseTo(K / Math.E, 10);
    expect(f.msy).toBeCloseTo((r * K) / Math.E, 10);
    expect(f.fMsy).toBe(r);
  });

  it('Pella-Tomlinson at p = 1 is Schaefer: same production, same path, same fit', () => {
    for (const B of [1, 100, 500, 999]) expect(production('pella-tomlinson', { r, K, p: 1 }, B)).toBeCloseTo(production('schaefer', { r, K }, B), 9);
    const catches = [40, 80, 110, 90, 70];
    const s = biomassPath('schaefer', { r, K }, 800, catches).biomass;
    const p = biomassPath('pella-tomlinson', { r, K, p: 1 }, 800, catches).biomass;
    p.forEach((v, i) => expect(v).toBeCloseTo(s[i]!, 6));
    const years = Array.from({ length: 20 }, (_, i) => 2000 + i);
    const cs = years.map((_, i) => 30 + 6 * i);
    const truth = biomassPath('schaefer', { r, K }, 900, cs).biomass;
    const series = { years, catches: cs, indices: [{ name: 'i', values: years.map((_, i) => 0.01 * truth[i]! * Math.exp(0.05 * Math.sin(3 * i))), cv: null }] };
    const fs = fitSurplusRaw(series, { model: 'schaefer' });
    const fp = fitSurplusRaw(series, { model: 'pella-tomlinson', shape: 1 });
    expect(fp.nll).toBeCloseTo(fs.nll, 4);
    expect(fp.problem.decode(fp.u).r).toBeCloseTo(fs.problem.decode(fs.u).r, 3);
  });

  it('numerical continuation finds the logistic fold h* = rK/4 at B = K/2 (the exact case)', () => {
    const f = surplusFold('schaefer', { r, K });
    expect(f.hStar).toBeCloseTo(100, 8);
    expect(f.bFold).toBeCloseTo(500, 4);
    const half = f.table[f.table.length / 2 | 0]!;
    expect(half.stable).toBeCloseTo((K / 2) * (1 + Math.sqrt(1 - half.h / 100)), 6);
    expect(half.unstable).toBeCloseTo((K / 2) * (1 - Math.sqrt(1 - half.h / 100)), 6);
  });

  it('continuation puts the Pella-Tomlinson and Fox folds at their MSY and B_MSY', () => {
    for (const [model, p] of [['pella-tomlinson', 0.5], ['pella-tomlinson', 2], ['fox', 1]] as const) {
      const f = surplusFold(model, { r, K, p });
      const ref = referencePoints(model, { r, K, p });
      expect(f.hStar).withContext(`${model} ${p}`).toBeCloseTo(ref.msy, 6);
      expect(f.bFold).withContext(`${model} ${p}`).toBeCloseTo(ref.bMsy, 3);
    }
  });

  it('the return rate along the stable branch falls to zero at the fold', () => {
    const f = surplusFold('fox', { r, K });
    const rates = f.table.map((t) => t.returnRate);
    for (let i = 1; i < rates.length; i++) expect(rates[i]!).toBeLessThanOrEqual(rates[i - 1]! + 1e-12);
    expect(rates[rates.length - 1]!).toBeLessThan(1e-4);
    expect(rates[0]!).toBeCloseTo(r, 6);
  });
});
