import { linearRegression } from 'simple-statistics';
import { lambertW0 } from '../numerics/lambert-w';
import { createRng } from '../numerics/random';
import { fitStockRecruit } from './fit-stock-recruit';
import { DISCRETE_MODELS, checkParams } from './stock-recruit';

const ricker = DISCRETE_MODELS.ricker;
const bh = DISCRETE_MODELS['beverton-holt'];

/** Golden-section maximum of g on [a, b] (Kiefer 1953), independent of the closed forms. */
function argmax(g: (x: number) => number, a: number, b: number): number {
  const phi = (Math.sqrt(5) - 1) / 2;
  let lo = a, hi = b;
  for (let i = 0; i < 200; i++) {
    const x1 = hi - phi * (hi - lo), x2 = lo + phi * (hi - lo);
    if (g(x1) > g(x2)) hi = x2; else lo = x1;
  }
  return (lo + hi) / 2;
}

describe('Lambert W₀', () => {
  it('gives the omega constant at 1, 1 at e, −1 at −1/e and solves w·e^w = x across the range', () => {
    // omega constant W(1) = 0.5671432904097838 (Corless et al. 1996, Adv. Comput. Math. 5:329)
    expect(lambertW0(1)).toBeCloseTo(0.5671432904097838, 15);
    expect(lambertW0(Math.E)).toBeCloseTo(1, 14);
    expect(lambertW0(-1 / Math.E)).toBe(-1);
    for (const x of [-0.3678, -0.2, -1e-6, 1e-8, 0.3, 2, 7, 50, 1e5, 1e20]) {
      const w = lambertW0(x);
      expect(Math.abs(w * Math.exp(w) - x)).toBeLessThan(1e-13 * Math.max(1, Math.abs(x)));
    }
    expect(() => lambertW0(-0.5)).toThrowError(RangeError);
  });
});

describe('stock-recruitment reference points under a harvest rate before spawning', () => {
  it('puts the Ricker S_MSY from Lambert W at the numerical maximum of f(S) − S', () => {
    // Scheuerell 2016, PeerJ 4:e1623: S_MSY = (1 − W(e^(1−a)))/b for R = S·e^(a − bS)
    for (const [r, K] of [[0.8, 1000], [1.6, 52_000], [3.1, 7]] as const) {
      const ref = ricker.reference({ r, K });
      const numeric = argmax((s) => ricker.recruits(s, { r, K }) - s, 0, K);
      expect(Math.abs(ref.sMsy - numeric) / K).toBeLessThan(1e-7);
      expect(ref.msy).toBeCloseTo(ricker.recruits(numeric, { r, K }) - numeric, 6);
      expect(ref.uMsy).toBeCloseTo(1 - numeric / ricker.recruits(numeric, { r, K }), 7);
    }
  });

  it('differs from the usual approximation S_MSY ≈ (a/b)(0.5 − 0.07a) by more than the exact error', () => {
    // Hilborn 1985 approximation, as quoted by Scheuerell 2016 (the 0.07 coefficient from memory)
    const a = 3, K = 1000, b = a / K;
    const approx = (a / b) * (0.5 - 0.07 * a);
    const exact = ricker.reference({ r: a, K }).sMsy;
    const numeric = argmax((s) => ricker.recruits(s, { r: a, K }) - s, 0, K);
    expect(Math.abs(exact - numeric)).toBeLessThan(1e-4);
    expect(Math.abs(approx - numeric)).toBeGreaterThan(1);
  });

  it('puts the Beverton-Holt S_MSY at the numerical maximum of f(S) − S', () => {
    const p = { R: 6, K: 2000 };
    const numeric = argmax((s) => bh.recruits(s, p) - s, 0, p.K);
    expect(Math.abs(bh.reference(p).sMsy - numeric)).toBeLessThan(1e-4);
    expect(bh.reference(p).uMsy).toBeCloseTo(1 - 1 / Math.sqrt(6), 12);
  });

  it('rejects parameters outside their bounds by name', () => {
    expect(checkParams(ricker, { r: -1, K: 10 })).toEqual(['r must lie in [0.000001, 10], not -1']);
    expect(checkParams(ricker, { r: 1 })).toEqual(['K is missing']);
    expect(checkParams(ricker, { r: 1, K: 5, z: 1 })).toEqual(['ricker has no parameter z']);
  });
});

describe('stock-recruitment fit with lognormal error', () => {
  it('matches the least-squares line of ln(R/S) on S for Ricker (the lognormal MLE)', () => {
    // ln(R/S) = a − bS + ε is linear: OLS is the maximum-likelihood fit (Hilborn & Walters 1992, §7.5);
    // the line comes from simple-statistics
    const rng = createRng(42);
    const S = Array.from({ length: 30 }, () => 100 + 1900 * rng.uniform());
    const R = S.map((s) => ricker.recruits(s, { r: 1.7, K: 1500 }) * Math.exp(0.3 * rng.normal()));
    const line = linearRegression(S.map((s, i) => [s, Math.log(R[i]! / s)]));
    const fit = fitStockRecruit(ricker, S, R);
    expect(fit.params['r']!).toBeCloseTo(line.b, 5);
    expect(fit.params['K']! / (line.b / -line.m)).toBeCloseTo(1, 5);
    expect(fit.converged).toBeTrue();
  });

  it('recovers Beverton-Holt parameters from simulated pairs', () => {
    const rng = createRng(7);
    const S = Array.from({ length: 200 }, () => 50 + 3000 * rng.uniform());
    const R = S.map((s) => bh.recruits(s, { R: 5, K: 2500 }) * Math.exp(0.1 * rng.normal()));
    const fit = fitStockRecruit(bh, S, R);
    expect(fit.params['R']!).toBeGreaterThan(4.3);
    expect(fit.params['R']!).toBeLessThan(5.8);
    expect(Math.abs(fit.params['K']! / 2500 - 1)).toBeLessThan(0.05);
    expect(fit.sigma).toBeCloseTo(0.1, 1);
  });
});
