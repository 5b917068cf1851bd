import { errorFunction, probit } from 'simple-statistics';
import { mase, mohnsRho, truncateSeries, hindcast, type PeelPath } from './retrospective';
import { qqPoints, residualCheck, runsTest } from './residual-checks';
import { PROFILE_DROP, profileParameter } from './likelihood-profile';
import { jitterFit } from './jitter';
import { diagnoseSurplus } from './diagnose';
import { assessSurplus } from '../assessment';
import { fitSurplusRaw } from '../surplus/fit-surplus';
import { biomassPath } from '../surplus/surplus';
import { demoSeries } from '../../../seeders/series-generator';
import type { StockSeries } from '../data/series';

describe("Mohn's rho", () => {
  it('matches a worked example computed by hand', () => {
    // Mohn (1999) ICES J. Mar. Sci. 56:473, rho = mean over peels of (X_peel(T_p) − X_full(T_p)) / X_full(T_p).
    // Full fit over 6 years: 100, 90, 80, 70, 60, 50.
    // Peel 1 ends in year 5 (full 60) with 66 → +0.10; peel 2 ends in year 4 (full 70) with 63 → −0.10;
    // peel 3 ends in year 3 (full 80) with 96 → +0.20. Mean = (0.10 − 0.10 + 0.20) / 3 = 0.0666…
    const full = [100, 90, 80, 70, 60, 50];
    const rho = mohnsRho(full, [
      { peel: 1, values: [100, 90, 80, 70, 66] },
      { peel: 2, values: [100, 90, 80, 63] },
      { peel: 3, values: [100, 90, 96] },
    ]);
    expect(rho).toBeCloseTo(0.2 / 3, 12);
  });
});

describe('mean absolute scaled error', () => {
  it('matches a hand-computed hindcast to 1e-12', () => {
    // Hyndman & Koehler (2006) Int. J. Forecasting 22:679, scaled by the naive (last value) forecast.
    // observed 10, 12, 9, 11; predicted 11, 11.5, 10, 10.5 → |e| = 1, 0.5, 1, 0.5, sum 3.
    // naive (previous observation) 8, 10, 12, 9 → |e| = 2, 2, 3, 2, sum 9. MASE = 3/9 = 1/3.
    expect(mase([10, 12, 9, 11], [11, 11.5, 10, 10.5], [8, 10, 12, 9])).toBeCloseTo(1 / 3, 12);
    expect(Math.abs(mase([10, 12, 9, 11], [11, 11.5, 10, 10.5], [8, 10, 12, 9])! - 1 / 3)).toBeLessThan(1e-12);
    expect(mase([5, 5], [4, 6], [5, 5])).toBeNull();
  });

  it('scores one-step predictions of the year after each peel against the last value seen', () => {
    const series: StockSeries = { years: [1, 2, 3, 4, 5], catches: [1, 1, 1, 1, 1], indices: [{ name: 'a', values: [4, null, 6, 8, 7], cv: null }] };
    const peel = (p: number, bNext: number): PeelPath => ({ peel: p, years: [], biomass: [], F: [], bOverBmsy: [], fOverFmsy: [], bNext, q: [0.5] });
    // peel 1 predicts year 5 (obs 7) as 0.5·16 = 8, naive 8; peel 2 predicts year 4 (obs 8) as 0.5·12 = 6, naive 6;
    // peel 3 predicts year 3 (obs 6) as 0.5·10 = 5, naive 4 (year 2 unobserved). MASE = (1 + 2 + 1) / (1 + 2 + 2) = 0.8.
    const [h] = hindcast(series, [peel(1, 16), peel(2, 12), peel(3, 10)]);
    expect(h!.points.map((p) => p.year)).toEqual([3, 4, 5]);
    expect(h!.mase).toBeCloseTo(0.8, 12);
  });
});

describe('residual checks', () => {
  it('counts runs and gives the normal-approximation p-value of Wald & Wolfowitz (1940)', () => {
    // signs + + − − − + − + + − : runs 6, n1 = 5, n2 = 5, n = 10.
    // μ = 2·5·5/10 + 1 = 6; σ² = 2·25·(50 − 10)/(100·9) = 2000/900 = 2.2222; z = 0 → p = 1.
    const t = runsTest([0.3, 0.1, -0.2, -0.4, -0.1, 0.2, -0.3, 0.1, 0.5, -0.2])!;
    expect(t.runs).toBe(6);
    expect(t.expected).toBe(6);
    expect(t.p).toBeCloseTo(1, 12);
    // signs + + + + − − − − + + + + − − − − : runs 4, n1 = n2 = 8, μ = 9, σ² = 2·64·112/(256·15) = 3.7333,
    // z = (4 − 9)/1.93218 = −2.58775; two-sided p = 1 − erf(|z|/√2) from simple-statistics (reference library).
    const x = [1, 1, 1, 1, -1, -1, -1, -1, 1, 1, 1, 1, -1, -1, -1, -1];
    const r = runsTest(x)!;
    const z = (4 - 9) / Math.sqrt((2 * 64 * 112) / (256 * 15));
    expect(r.z).toBeCloseTo(z, 12);
    expect(r.p).toBeCloseTo(1 - errorFunction(Math.abs(z) / Math.SQRT2), 6);
    expect(r.p).toBeLessThan(0.01);
    expect(runsTest([0.1, 0.2, 0.3])).toBeNull();
  });

  it('gives QQ points at Blom positions against the normal quantile of simple-statistics', () => {
    const x = [0.2, -0.1, 0.05, -0.3, 0.15];
    const sd = Math.sqrt(x.reduce((s, v) => s + v * v, 0) / x.length);
    const qq = qqPoints(x);
    // Blom (1958): (i − 3/8)/(n + 1/4); the smallest of 5 sits at Φ⁻¹(0.625/5.25). simple-statistics'
    // probit is an approximation good to about 1e-3, hence the tolerance.
    expect(qq[0]![0]).toBeCloseTo(probit(0.625 / 5.25), 3);
    expect(qq[4]![0]).toBeCloseTo(probit(4.625 / 5.25), 3);
    expect(qq[2]![0]).toBeCloseTo(0, 12);
    expect(qq[0]![1]).toBeCloseTo(-0.3 / sd, 12);
  });

  it('counts residuals beyond 3σ and the lag-1 autocorrelation of the check-values series', () => {
    const e = [...Array(30).fill(0).map((_, i) => 0.1 * Math.sin(i)), 1.5];
    const c = residualCheck('a', e.map((_, i) => 2000 + i), e);
    expect(c.outside3Sigma).toBeCloseTo(1 / 31, 12);
    // Scheffer et al. (2009) / ../shared/check-values.md: lag-1 autocorrelation −0.392590
    const w = residualCheck('b', Array.from({ length: 12 }, (_, i) => i), [2, 4, 3, 5, 4, 7, 5, 8, 4, 9, 3, 10]);
    expect(w.lag1!).toBeCloseTo(-0.39259, 5);
    expect(w.outside3Sigma).toBe(0);
  });
});

describe('likelihood profiles', () => {
  const series = demoSeries()['blue-lip-crab']!;
  const { fit } = assessSurplus(series, { model: 'schaefer' });

  it('give the r interval that a brute-force profile on a grid of r finds (Schaefer)', () => {
    // Standard likelihood theory: the 95% interval is where −ln L rises χ²₁(0.95)/2 = 1.92 above its minimum.
    expect(PROFILE_DROP).toBeCloseTo(3.841458820689 / 2, 9);
    const prof = profileParameter(series, { model: 'schaefer' }, fit, 'r', [0.005, 3]);
    const nll0 = -fit.logLik;
    // brute force: a full multi-start refit at each of 61 values of r, no warm starts
    const grid = Array.from({ length: 61 }, (_, i) => Math.exp(Math.log(0.2) + (i / 60) * Math.log(0.6 / 0.2)));
    const rise = grid.map((r) => fitSurplusRaw(series, { model: 'schaefer', fixed: { r } }).nll - nll0);
    const crossing = (from: number, to: number) => {
      for (let i = from; i !== to; i += Math.sign(to - from)) {
        const j = i + Math.sign(to - from);
        if (rise[i]! < 1.92 && rise[j]! >= 1.92) return grid[i]! + ((1.920729 - rise[i]!) / (rise[j]! - rise[i]!)) * (grid[j]! - grid[i]!);
      }
      return NaN;
    };
    const best = rise.indexOf(Math.min(...rise));
    const lo = crossing(best, 0), hi = crossing(best, grid.length - 1);
    expect(Math.abs(prof.interval[0]! / lo - 1)).toBeLessThan(0.01);
    expect(Math.abs(prof.interval[1]! / hi - 1)).toBeLessThan(0.01);
    expect(prof.interval[0]!).toBeLessThan(fit.params.r);
    expect(prof.interval[1]!).toBeGreaterThan(fit.params.r);
  });

  it('runs every diagnostic with progress and reports h* with the MSY profile', () => {
    const stages: string[] = [];
    const d = diagnoseSurplus(series, { model: 'schaefer' }, fit, { peel: 3, jitter: 4, seed: 3, onProgress: (_f, s) => stages.push(s) });
    expect(d.retrospective!.peels.map((p) => p.peel)).toEqual([0, 1, 2, 3]);
    expect(d.retrospective!.peels[3]!.years.length).toBe(series.years.length - 3);
    expect(d.hindcast[0]!.points.length).toBe(3);
    expect(d.profiles.map((p) => p.name)).toEqual(['r', 'K', 'MSY', 'h*']);
    expect(d.profiles[3]!.interval).toEqual(d.profiles[2]!.interval);
    expect(d.jitter!.starts).toBe(4);
    expect(stages[stages.length - 1]).toBe('Diagnostics done');
    expect(stages.some((s) => s.startsWith('Retrospective'))).toBeTrue();
  });
});

describe('data-poor options', () => {
  // A known truth, integrated with odex (forceOdex) rather than the closed form the fit uses.
  const truth = { r: 0.5, K: 1000, d0: 0.8, q: 0.01 };
  const catches = [40, 60, 80, 100, 110, 120, 110, 100, 90, 80, 80, 80];
  const B = biomassPath('schaefer', truth, truth.d0 * truth.K, catches, { forceOdex: true, tol: 1e-12 }).biomass;
  const cv = 0.2;
  const index = catches.map((_, t) => truth.q * B[t]! * Math.exp(0.15 * Math.sin(2.1 * t + 0.4)));
  const series: StockSeries = { years: catches.map((_, i) => 2000 + i), catches, indices: [{ name: 'survey', values: index, cv: catches.map(() => cv) }] };

  it('reproduces the truth’s log-likelihood when every parameter is fixed at the truth', () => {
    // lognormal density of I_t with median q·B_t and σ = √ln(1 + CV²), written out in full
    const s = Math.sqrt(Math.log(1 + cv * cv));
    const logLik = index.reduce((acc, I, t) => acc - Math.log(I * s * Math.sqrt(2 * Math.PI)) - (Math.log(I) - Math.log(truth.q * B[t]!)) ** 2 / (2 * s * s), 0);
    const { fit } = assessSurplus(series, { model: 'schaefer', fixed: { r: truth.r, K: truth.K, d0: truth.d0, q: { survey: truth.q } } });
    expect(fit.logLik).toBeCloseTo(logLik, 6);
    expect(fit.free).toEqual([]);
    expect(fit.fixed).toEqual(['r', 'K', 'B0/K', 'q (survey)']);
    expect(fit.indices[0]!.q).toBeCloseTo(truth.q, 14);
  });

  it('holds a fixed B0/K and estimates the rest', () => {
    const { fit } = assessSurplus(series, { model: 'schaefer', fixed: { d0: 0.8 } });
    expect(fit.params.d0).toBe(0.8);
    expect(fit.free.length).toBe(2);
    expect(fit.estimates.find((e) => e.name === 'B0/K')!.ci95).toBeNull();
    expect(fit.nParams).toBe(4);
  });

  it('turns priors into a penalised likelihood that a tight prior pulls to its median', () => {
    const free = assessSurplus(series, { model: 'schaefer' }).fit;
    const tight = assessSurplus(series, { model: 'schaefer', priors: { r: { kind: 'lognormal', median: 0.3, sdLog: 0.01 }, d0: { kind: 'beta', mean: 0.8, sd: 0.05 } } }).fit;
    expect(free.penalised).toBeFalse();
    expect(tight.penalised).toBeTrue();
    expect(Math.abs(tight.params.r / 0.3 - 1)).toBeLessThan(0.03);
    expect(tight.constraints).toContain('lognormal prior on r');
    // the data part alone cannot beat the unpenalised maximum
    expect(tight.logLik).toBeLessThan(free.logLik);
  });

  it('counts jitter starts that reach the best likelihood', () => {
    const { fit } = assessSurplus(series, { model: 'schaefer' });
    const j = jitterFit(series, { model: 'schaefer' }, fit.free, -fit.logLik, 6, 9);
    expect(j.values.length).toBe(6);
    expect(j.reachingBest).toBeGreaterThan(0);
    expect(j.bestNll).toBeLessThanOrEqual(j.fitNll);
  });

  it('cuts a series to its first years', () => {
    const cut = truncateSeries(series, 5);
    expect(cut.years).toEqual([2000, 2001, 2002, 2003, 2004]);
    expect(cut.indices[0]!.cv!.length).toBe(5);
  });
});
