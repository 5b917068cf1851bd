// Recovery of known truth. The data are simulated here, from the invented scenario of
// ../shared/scenario.md, with a plain fixed-step classical Runge-Kutta integrator written in this file
// (RK4, e.g. Press et al., Numerical Recipes, 3rd ed., §17.1) at 1/2000 of a year, so neither the
// engine's exact Schaefer step nor its odex wrapper takes part in making the data they are fitted to.
// A fit must then contain the truth in its 95% intervals (which holds for about 95% of data sets:
// the seeds are fixed, so the check is repeatable).
import { assessSurplus, bootstrapFit } from '../assessment';
import { quantile } from '../uncertainty/bootstrap';
import { fitPredatorPrey } from '../linked/fit-predator-prey';
import type { StockSeries } from '../data/series';
import { catchHistory, SINGLE_STOCKS, SPRAT_COD_TRUTH } from '../../../seeders/series-generator';

type Rhs = (y: number[], catchOfYear: number[]) => number[];

/** States at the start of each year, stepping each year with RK4 at a fixed step; catches are constant rates within a year. */
function rk4Years(f: Rhs, y0: number[], catches: number[][], stepsPerYear = 2000): number[][] {
  const out = [y0];
  let y = y0;
  const h = 1 / stepsPerYear;
  for (const c of catches) {
    for (let s = 0; s < stepsPerYear; s++) {
      const k1 = f(y, c);
      const k2 = f(y.map((v, i) => v + (h / 2) * k1[i]!), c);
      const k3 = f(y.map((v, i) => v + (h / 2) * k2[i]!), c);
      const k4 = f(y.map((v, i) => v + h * k3[i]!), c);
      y = y.map((v, i) => v + (h / 6) * (k1[i]! + 2 * k2[i]! + 2 * k3[i]! + k4[i]!));
    }
    if (y.some((v) => !(v > 0))) throw new Error('the simulated history collapses');
    out.push(y);
  }
  return out;
}

/** Normal deviates from a small seeded generator of this file (mulberry32 and Box-Muller). */
function normals(seed: number): () => number {
  let a = seed >>> 0;
  const u = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}

const YEARS = Array.from({ length: 36 }, (_, i) => 1990 + i);

/** A Schaefer stock of the scenario: dB/dt = rB(1 − B/K) − C (Schaefer 1954), index q·B·e^{σε}. */
function schaeferSeries(code: string, seed: number): StockSeries {
  const t = SINGLE_STOCKS.find((s) => s.code === code)!;
  const catches = catchHistory(t.catchPeak, YEARS.length).map((c) => Math.round(c));
  const path = rk4Years(([B], [C]) => [t.r * B! * (1 - B! / t.K) - C!], [t.d0 * t.K], catches.map((c) => [c]));
  const eps = normals(seed);
  return { years: YEARS, catches, indices: [{ name: t.indexName, values: catches.map((_, i) => t.q * path[i]![0]! * Math.exp(t.sd * eps())), cv: null }] };
}

/** The sprat and ridge cod pair, Rosenzweig-MacArthur with catches of both (Rosenzweig & MacArthur 1963). */
function spratCodSeries(seed: number): StockSeries {
  const t = SPRAT_COD_TRUTH;
  const { r, K, a, h, e, m } = t.params;
  const preyC = catchHistory(t.preyCatchPeak).map((c) => Math.round(c));
  const predC = catchHistory(t.predatorCatchPeak).map((c) => Math.round(c));
  const path = rk4Years(([N, P], [cn, cp]) => {
    const eaten = (a * N! * P!) / (1 + a * h * N!);
    return [r * N! * (1 - N! / K) - eaten - cn!, e * eaten - m * P! - cp!];
  }, [...t.start], preyC.map((c, i) => [c, predC[i]!]));
  const eps = normals(seed);
  return {
    years: YEARS, catches: preyC, predatorCatches: predC,
    indices: [
      { name: 'prey_index', values: preyC.map((_, i) => t.qPrey * path[i]![0]! * Math.exp(t.sd * eps())), cv: null },
      { name: 'predator_index', values: preyC.map((_, i) => t.qPredator * path[i]![1]! * Math.exp(t.sd * eps())), cv: null },
    ],
  };
}

describe('recovering a known truth from independently simulated data', () => {
  it('the RK4 of this file reproduces the logistic closed form N(10) = 355.460987 (r 0.4, K 1000, N0 10)', () => {
    // ../shared/check-values.md, ODE integrator checks: a check on the check
    const path = rk4Years(([N]) => [0.4 * N! * (1 - N! / 1000)], [10], Array.from({ length: 10 }, () => [0]));
    expect(path[10]![0]!).toBeCloseTo(355.460987, 5);
  });

  for (const [code, seed] of [['blue-lip-crab', 101], ['red-grouse', 202]] as const) {
    it(`recovers the true r, K and MSY = rK/4 of ${code} within the 95% bootstrap and Hessian intervals`, async () => {
      const truth = SINGLE_STOCKS.find((s) => s.code === code)!;
      const series = schaeferSeries(code, seed);
      const { fit } = assessSurplus(series, { model: 'schaefer' });
      expect(fit.convergence.converged).toBeTrue();
      expect(fit.convergence.gradientNorm).toBeLessThan(1e-2);
      const reps = await bootstrapFit(series, { model: 'schaefer' }, fit, { replicates: 300, seed: 11, workers: 2 });
      expect(reps.length).toBe(300);
      const within = (v: number, xs: number[]) => v >= quantile(xs, 0.025) && v <= quantile(xs, 0.975);
      expect(within(truth.r, reps.map((r) => r.r))).withContext(`r ${truth.r}`).toBeTrue();
      expect(within(truth.K, reps.map((r) => r.K))).withContext(`K ${truth.K}`).toBeTrue();
      expect(within((truth.r * truth.K) / 4, reps.map((r) => r.msy))).withContext('MSY').toBeTrue();
      for (const [name, value] of [['r', truth.r], ['K', truth.K]] as const) {
        const ci = fit.estimates.find((e) => e.name === name)!.ci95!;
        expect(value).withContext(name).toBeGreaterThan(ci[0]);
        expect(value).withContext(name).toBeLessThan(ci[1]);
      }
    });
  }

  it('recovers the sprat and ridge cod truth within the Hessian intervals of a Rosenzweig-MacArthur fit', () => {
    const fit = fitPredatorPrey(spratCodSeries(303), { model: 'rosenzweig-macarthur', conversion: SPRAT_COD_TRUTH.params.e });
    const t = SPRAT_COD_TRUTH.params;
    for (const [name, value] of [['r', t.r], ['K', t.K], ['attack', t.a], ['mortality', t.m]] as const) {
      const est = fit.estimates.find((x) => x.name === name)!;
      expect(est.ci95).withContext(name).not.toBeNull();
      expect(value).withContext(name).toBeGreaterThan(est.ci95![0]);
      expect(value).withContext(name).toBeLessThan(est.ci95![1]);
    }
    expect(fit.equilibrium!.stable).toBeTrue();
  });
});
