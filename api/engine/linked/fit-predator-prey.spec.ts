import { fitPredatorPrey, compareLinkedFits } from './fit-predator-prey';
import { bootstrapLinked, linkedIntervals } from './linked-assessment';
import type { StockSeries } from '../data/series';

// Truth simulated here with a classical fourth-order Runge-Kutta scheme (200 steps a year), not the
// engine's odex path, and lognormal survey errors from a small linear congruential generator
// (Numerical Recipes constants, Press et al. 2007) with Box-Muller normals.
function rk4Year(f: (y: number[]) => number[], y: number[]): number[] {
  const n = 200, dt = 1 / n;
  for (let i = 0; i < n; i++) {
    const k1 = f(y), k2 = f(y.map((v, j) => v + (dt / 2) * k1[j]!)), k3 = f(y.map((v, j) => v + (dt / 2) * k2[j]!)), k4 = f(y.map((v, j) => v + dt * k3[j]!));
    y = y.map((v, j) => v + (dt / 6) * (k1[j]! + 2 * k2[j]! + 2 * k3[j]! + k4[j]!));
  }
  return y;
}
function lcg(seed: number) {
  let s = seed >>> 0;
  const u = () => { s = (Math.imul(1664525, s) + 1013904223) >>> 0; return (s + 0.5) / 4294967296; };
  return () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
}

const truth = { r: 1.2, K: 250_000, a: 1.6e-5, e: 0.25, m: 0.3 };
const hTrue = 0.5 / (truth.a * truth.K);
function simulate(): StockSeries {
  const norm = lcg(4242);
  const years = Array.from({ length: 36 }, (_, i) => 1990 + i);
  const preyC = years.map((_, i) => Math.round(24_000 * (i < 16 ? 0.15 + 0.85 * (i / 15) : i < 20 ? 1 : 0.6)));
  const predC = years.map((_, i) => Math.round(3_600 * (i < 16 ? 0.15 + 0.85 * (i / 15) : i < 20 ? 1 : 0.6)));
  let y = [0.5 * truth.K, 40_000];
  const prey: number[] = [], pred: number[] = [];
  for (let t = 0; t < years.length; t++) {
    prey.push(y[0]!); pred.push(y[1]!);
    const f = ([N, P]: number[]) => {
      const eat = (truth.a * N! * P!) / (1 + truth.a * hTrue * N!);
      return [truth.r * N! * (1 - N! / truth.K) - eat - preyC[t]!, truth.e * eat - truth.m * P! - predC[t]!];
    };
    y = rk4Year(f, y);
  }
  return {
    years, catches: preyC, predatorCatches: predC,
    indices: [
      { name: 'prey_index', values: prey.map((b) => 1.1e-3 * b * Math.exp(0.15 * norm())), cv: null },
      { name: 'predator_index', values: pred.map((b) => 2.4e-3 * b * Math.exp(0.15 * norm())), cv: null },
    ],
  };
}

describe('predator-prey fit', () => {
  const series = simulate();
  const fit = fitPredatorPrey(series, { model: 'rosenzweig-macarthur' });

  it('recovers simulated truth within its bootstrap intervals (Efron & Tibshirani 1993, percentile intervals)', async () => {
    const reps = await bootstrapLinked(series, { model: 'rosenzweig-macarthur' }, fit, { replicates: 30, seed: 3, workers: 2 });
    expect(reps.length).toBe(30);
    const iv = linkedIntervals(reps);
    for (const [k, v] of [['r', truth.r], ['K', truth.K], ['a', truth.a], ['m', truth.m]] as const) {
      expect(v).withContext(`${k} in ${iv[k]}`).toBeGreaterThan(iv[k]![0]);
      expect(v).withContext(`${k} in ${iv[k]}`).toBeLessThan(iv[k]![1]);
    }
  });

  it('reports lnL, AIC = 2k − 2 lnL and AICc = AIC + 2k(k+1)/(n − k − 1) (Burnham & Anderson 2002)', () => {
    const k = 6 + 4;
    expect(fit.nParams).toBe(k);
    expect(fit.nObs).toBe(72);
    expect(fit.aic).toBeCloseTo(2 * k - 2 * fit.logLik, 9);
    expect(fit.aicc).toBeCloseTo(fit.aic + (2 * k * (k + 1)) / (72 - k - 1), 9);
  });

  it('gives both surveys fitted values q̂·B and log residuals that average zero (Polacheck, Hilborn & Punt 1993)', () => {
    expect(fit.indices.map((i) => i.species)).toEqual(['prey', 'predator']);
    for (const ix of fit.indices) {
      const biomass = ix.species === 'prey' ? fit.prey : fit.predator;
      ix.fitted.forEach((v, t) => expect(v).toBeCloseTo(ix.q * biomass[t]!, 6));
      const res = ix.residuals.filter((v): v is number => v !== null);
      expect(res.length).toBe(36);
      expect(res.reduce((s, v) => s + v, 0)).toBeCloseTo(0, 9);
      ix.residuals.forEach((v, t) => expect(v!).toBeCloseTo(Math.log(ix.observed[t]! / ix.fitted[t]!), 9));
    }
  });

  it('lists the fixed conversion efficiency and saturation with value and reason', () => {
    expect(fit.fixed.map((f) => [f.name, f.value])).toEqual([['Conversion efficiency e', 0.25], ['Saturation a·h·K', 0.5]]);
    expect(fit.fixed.every((f) => f.reason.length > 40)).toBeTrue();
    const handling = fit.estimates.find((x) => x.name === 'handling')!.value;
    const a = fit.estimates.find((x) => x.name === 'attack')!.value, K = fit.estimates.find((x) => x.name === 'K')!.value;
    expect(handling).toBeCloseTo(0.5 / (a * K), 12);
  });

  it('fixes e where the assessor sets it, and warns when an estimated e and saturation cannot be identified', () => {
    const set = fitPredatorPrey(series, { model: 'rosenzweig-macarthur', conversion: 0.15, initial: fit.free });
    expect((set.spec.params as { e: number }).e).toBe(0.15);
    expect(set.fixed[0]!.reason).toContain('assessor');
    const est = fitPredatorPrey(series, { model: 'rosenzweig-macarthur', conversion: 'estimate', saturation: 'estimate' });
    expect(est.fixed.length).toBe(0);
    expect(est.nParams).toBe(12);
    expect(est.convergence.warnings.some((w) => /cannot identify the (conversion|saturation)/.test(w))).toBeTrue();
  });

  it('compares Lotka-Volterra with Rosenzweig-MacArthur by AICc', () => {
    const lv = fitPredatorPrey(series, { model: 'lotka-volterra' });
    const cmp = compareLinkedFits([fit, lv]);
    expect(cmp.map((c) => c.model)).toEqual(['rosenzweig-macarthur', 'lotka-volterra']);
    expect(Math.min(...cmp.map((c) => c.deltaAicc))).toBe(0);
    expect(cmp[1]!.deltaAicc - cmp[0]!.deltaAicc).toBeCloseTo(lv.aicc - fit.aicc, 9);
    expect(lv.fixed.some((f) => f.name === 'Functional response')).toBeTrue();
  });

  it('refuses a conversion efficiency outside (0, 1] and a single survey', () => {
    expect(() => fitPredatorPrey(series, { model: 'rosenzweig-macarthur', conversion: 1.5 })).toThrowError(/conversion efficiency/);
    expect(() => fitPredatorPrey({ ...series, indices: series.indices.slice(0, 1) }, { model: 'rosenzweig-macarthur' })).toThrowError(/predator survey/);
  });
});
