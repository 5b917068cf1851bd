import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { assessSurplus, bootstrapFit } from '../assessment';
import { quantile, runBootstrap } from '../uncertainty/bootstrap';
import { BootstrapCancelled, bootstrapInWorkers } from '../uncertainty/bootstrap-pool';
import { formatStockCsv } from '../data/csv';
import { fitPredatorPrey } from '../linked/fit-predator-prey';
import { demoSeries, SINGLE_STOCKS, SPRAT_COD_TRUTH } from '../../../seeders/series-generator';

// The truth is the invented scenario of ../shared/scenario.md; the data are simulated from it with a
// fixed seed (seeders/series-generator.ts). A fit must recover it within its intervals.
describe('fitting the demo scenario', () => {
  const data = demoSeries();

  for (const code of ['blue-lip-crab', 'red-grouse']) {
    it(`recovers the true r and K of ${code} within the 95% bootstrap intervals (400 replicates, 2 workers)`, async () => {
      const truth = SINGLE_STOCKS.find((s) => s.code === code)!;
      const series = data[code]!;
      const { fit } = assessSurplus(series, { model: 'schaefer' });
      expect(fit.convergence.converged).toBeTrue();
      expect(fit.convergence.gradientNorm).toBeLessThan(1e-2);
      const reps = await bootstrapFit(series, { model: 'schaefer' }, fit, { replicates: 400, seed: 11, workers: 2 });
      expect(reps.length).toBe(400);
      const within = (v: number, xs: number[]) => v >= quantile(xs, 0.025) && v <= quantile(xs, 0.975);
      expect(within(truth.r, reps.map((r) => r.r))).withContext(`r ${truth.r}`).toBeTrue();
      expect(within(truth.K, reps.map((r) => r.K))).withContext(`K ${truth.K}`).toBeTrue();
      const rCi = fit.estimates.find((e) => e.name === 'r')!.ci95!;
      expect(truth.r).toBeGreaterThan(rCi[0]);
      expect(truth.r).toBeLessThan(rCi[1]);
    });
  }

  it('warns that the Pella-Tomlinson shape is poorly determined on the smelt series, and not when p is fixed', () => {
    const free = assessSurplus(data['silver-smelt']!, { model: 'pella-tomlinson' }).fit;
    expect(free.convergence.warnings.some((w) => w.includes('shape p is poorly determined'))).toBeTrue();
    const fixed = assessSurplus(data['silver-smelt']!, { model: 'pella-tomlinson', shape: 0.6 }).fit;
    expect(fixed.convergence.warnings.some((w) => w.includes('shape p'))).toBeFalse();
  });

  it('reports AIC = 2k − 2 lnL and AICc with the small-sample term', () => {
    const { fit } = assessSurplus(data['blue-lip-crab']!, { model: 'schaefer' });
    expect(fit.nParams).toBe(5);
    expect(fit.aic).toBeCloseTo(2 * 5 - 2 * fit.logLik, 10);
    expect(fit.aicc).toBeCloseTo(fit.aic + (2 * 5 * 6) / (fit.nObs - 6), 10);
    expect(fit.hStar).toBeCloseTo(fit.reference.msy, 6);
  });

  it('recovers the sprat and ridge cod truth within the Hessian intervals of a Rosenzweig-MacArthur fit', () => {
    const fit = fitPredatorPrey(data['sprat-ridge-cod']!, { model: 'rosenzweig-macarthur', conversion: SPRAT_COD_TRUTH.params.e });
    const t = SPRAT_COD_TRUTH.params;
    for (const [name, value] of [['r', t.r], ['K', t.K], ['attack', t.a], ['mortality', t.m]] as const) {
      const e = fit.estimates.find((x) => x.name === name)!;
      expect(e.ci95).withContext(name).not.toBeNull();
      expect(value).withContext(name).toBeGreaterThan(e.ci95![0]);
      expect(value).withContext(name).toBeLessThan(e.ci95![1]);
    }
    expect(fit.equilibrium!.stable).toBeTrue();
  });
});

describe('bootstrap in worker threads', () => {
  const series = demoSeries()['red-grouse']!;
  const { fit } = assessSurplus(series, { model: 'schaefer' });
  const req = { series, options: { model: 'schaefer' as const }, fit, replicates: 30, seed: 5 };

  it('gives the same replicates as a run on this thread, and reports progress up to the total', async () => {
    const progress: number[] = [];
    const pooled = await bootstrapInWorkers(req, { workers: 2, onProgress: (d) => progress.push(d) });
    const serial = runBootstrap(req);
    expect(pooled.map((r) => r.K)).toEqual(serial.map((r) => r.K));
    expect(Math.max(...progress)).toBe(30);
  });

  it('stops and rejects when cancelled', async () => {
    const ac = new AbortController();
    const run = bootstrapInWorkers({ ...req, replicates: 100_000 }, { workers: 2, signal: ac.signal, onProgress: () => ac.abort() });
    await expectAsync(run).toBeRejectedWithError(BootstrapCancelled);
  });
});

describe('demo data generator', () => {
  it('reproduces the committed seeders/data files exactly from its seed', () => {
    for (const [code, series] of Object.entries(demoSeries())) {
      const file = readFileSync(resolve(import.meta.dirname, '..', '..', '..', 'seeders', 'data', `${code}.csv`), 'utf8');
      expect(formatStockCsv(series)).withContext(code).toBe(file);
    }
  });
});
