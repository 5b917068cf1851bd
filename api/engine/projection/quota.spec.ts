import type { Replicate } from '../uncertainty/bootstrap';
import { quantile } from '../uncertainty/bootstrap';
import { project } from './projection';
import { proposeQuota, rampCatch } from './quota';

function reps(hs: number[]): Replicate[] {
  // Schaefer replicates with r = 0.4, K chosen so that MSY = rK/4 equals each h*.
  return hs.map((h) => ({ r: 0.4, K: h * 10, p: 1, d0: 1, msy: h, bMsy: h * 5, fMsy: 0.2, hStar: h, bEnd: h * 7, converged: true }));
}

describe('quota proposal', () => {
  it('takes the chosen risk quantile of the fold-harvest distribution (type-7 quantile, as R)', () => {
    const hs = Array.from({ length: 101 }, (_, i) => 1000 + i);
    const p = proposeQuota(reps(hs), { B: 1e9, bMsy: 1, fMsy: 1 }, 0.05, { limit: 0.4, trigger: 0.8, fTargetOverFmsy: 1 });
    expect(p.foldLimitedCatch).toBeCloseTo(1005, 10);
    expect(p.proposed).toBeCloseTo(1005, 10);
    expect(p.bindingConstraint).toBe('fold-risk');
    expect(p.hStar.median).toBe(1050);
    expect(p.marginToFold.absolute).toBeCloseTo(45, 10);
    expect(p.marginToFold.fraction).toBeCloseTo(45 / 1050, 12);
    expect(p.pPassFold).toBeCloseTo(5 / 101, 12);
  });

  it('the ramp rule allows nothing below the limit, a straight ramp to the trigger, full F above it', () => {
    const rule = { limit: 0.4, trigger: 0.8, fTargetOverFmsy: 0.9 };
    expect(rampCatch(rule, 300, 1000, 0.2)).toBe(0);
    expect(rampCatch(rule, 600, 1000, 0.2)).toBeCloseTo(0.9 * 0.2 * 0.5 * 600, 12);
    expect(rampCatch(rule, 1200, 1000, 0.2)).toBeCloseTo(0.9 * 0.2 * 1200, 12);
  });

  it('caps the proposal by the ramp rule when the stock is depleted', () => {
    const p = proposeQuota(reps([1000, 1010, 1020]), { B: 500, bMsy: 1000, fMsy: 0.2 }, 0.05, { limit: 0.4, trigger: 0.8, fTargetOverFmsy: 1 });
    expect(p.bindingConstraint).toBe('ramp-rule');
    expect(p.proposed).toBeCloseTo(0.2 * 0.25 * 500, 10);
  });

  it('refuses a risk outside (0, 0.5) and a trigger not above the limit', () => {
    expect(() => proposeQuota(reps([1]), { B: 1, bMsy: 1, fMsy: 1 }, 0.7, { limit: 0.4, trigger: 0.8, fTargetOverFmsy: 1 })).toThrowError(/risk/);
    expect(() => proposeQuota(reps([1]), { B: 1, bMsy: 1, fMsy: 1 }, 0.05, { limit: 0.8, trigger: 0.4, fTargetOverFmsy: 1 })).toThrowError(/ramp rule/);
  });

  it('projections: no process noise and a catch below every fold keep every replicate above its threshold', () => {
    const r = project({ model: 'schaefer', replicates: reps([1000, 1100, 1200]), catchLevel: 500, years: 80, processSd: 0, limitFraction: 0.5, seed: 1 });
    expect(r.pPassFold).toBe(0);
    expect(r.pCollapse).toBe(0);
    // from Clark (1990): N+ = (K/2)(1 + √(1 − h/h*)); the middle replicate (K = 11000, h* = 1100)
    expect(r.median[80]!).toBeCloseTo(5500 * (1 + Math.sqrt(1 - 500 / 1100)), 3);
    expect(r.returnRate).toBeCloseTo(0.4 * Math.sqrt(1 - 500 / 1100), 10);
  });

  it('projections: a catch above every fold harvest collapses every replicate', () => {
    const r = project({ model: 'schaefer', replicates: reps([1000, 1100]), catchLevel: 1500, years: 40, processSd: 0.05, limitFraction: 0.5, seed: 2 });
    expect(r.pPassFold).toBe(1);
    expect(r.pCollapse).toBe(1);
    expect(r.returnRate).toBe(0);
    expect(quantile([3, 1, 2], 0.5)).toBe(2);
  });
});
