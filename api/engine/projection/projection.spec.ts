import type { Replicate } from '../uncertainty/bootstrap';
import { project } from './projection';

// Lognormal process noise B_{t+1} = S(B_t)·exp(σε − σ²/2), ε ~ N(0, 1): the −σ²/2 term makes the
// multiplier's mean exactly 1, since E[exp(σε)] = exp(σ²/2) (the lognormal mean; e.g. Hilborn &
// Mangel 1997, The Ecological Detective, ch. 7; Johnson, Kotz & Balakrishnan 1994, ch. 14). Its
// median is then exp(−σ²/2) and its upper 95% point exp(−σ²/2 + 1.6449σ).
describe('stochastic projection', () => {
  const K = 10_000;
  // Schaefer, unfished, starting at K: the deterministic path stays at K (S(K) = K with no catch)
  const atK: Replicate = { r: 0.5, K, p: 1, d0: 1, msy: 0.5 * K / 4, bMsy: K / 2, fMsy: 0.25, hStar: 0.5 * K / 4, bEnd: K, converged: true };
  const sd = 0.4;

  it('keeps the mean biomass one year on at the deterministic level K with process noise above zero and no catch', () => {
    // one replicate per projection, each with its own seed: the year-1 value of each is one draw
    const n = 6000;
    let sum = 0;
    for (let seed = 1; seed <= n; seed++) {
      sum += project({ model: 'schaefer', replicates: [atK], catchLevel: 0, years: 1, processSd: sd, limitFraction: 0.5, seed }).median[1]!;
    }
    // standard error of the mean: K·√(e^{σ²} − 1)/√n = 0.54% of K; without the correction the mean is
    // K·e^{σ²/2} = 1.083 K, with the sign reversed 0.923 K
    expect(sum / n / K).toBeGreaterThan(1 - 0.025);
    expect(sum / n / K).toBeLessThan(1 + 0.025);
  });

  it('spreads many replicates started at K as the lognormal: median K·e^{−σ²/2}, 5% and 95% at e^{∓1.6449σ} around it', () => {
    const r = project({ model: 'schaefer', replicates: Array.from({ length: 8000 }, () => atK), catchLevel: 0, years: 1, processSd: sd, limitFraction: 0.5, seed: 77 });
    expect(r.median[0]).toBe(K);
    const med = K * Math.exp(-(sd ** 2) / 2);
    // tolerances: about four standard errors of each sample quantile at n = 8000 (common practice)
    expect(Math.abs(r.median[1]! / med - 1)).toBeLessThan(0.02);
    expect(Math.abs(r.upper[1]! / (med * Math.exp(1.6449 * sd)) - 1)).toBeLessThan(0.03);
    expect(Math.abs(r.lower[1]! / (med * Math.exp(-1.6449 * sd)) - 1)).toBeLessThan(0.03);
    expect(r.pCollapse).toBe(0);
  });
});
