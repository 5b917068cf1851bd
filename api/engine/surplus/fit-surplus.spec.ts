import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { assessSurplus } from '../assessment';
import { runBootstrap } from '../uncertainty/bootstrap';
import { BootstrapCancelled, bootstrapInWorkers } from '../uncertainty/bootstrap-pool';
import { formatStockCsv } from '../data/csv';
import { demoSeries } from '../../../seeders/series-generator';

// The demo series of seeders/ (recovery of a known truth is in ../fit/recovery.spec.ts, on data simulated
// independently of the engine).
describe('fitting the demo scenario', () => {
  const data = demoSeries();

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
    // Schaefer (1954): MSY = rK/4; Clark (1990): the fold of rB(1 − B/K) − h sits at h* = rK/4
    const r = fit.estimates.find((e) => e.name === 'r')!.value, K = fit.estimates.find((e) => e.name === 'K')!.value;
    expect(fit.reference.msy).toBeCloseTo((r * K) / 4, 6);
    expect(fit.hStar).toBeCloseTo((r * K) / 4, 4);
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

// Change detector, not a check of correctness: the committed demo files were written by this generator,
// so this only says that the generator (and the engine paths it uses) still gives the same numbers.
describe('demo data generator (change detector)', () => {
  it('change detector: reproduces the committed seeders/data files exactly from its seed', () => {
    for (const [code, series] of Object.entries(demoSeries())) {
      const file = readFileSync(resolve(import.meta.dirname, '..', '..', '..', 'seeders', 'data', `${code}.csv`), 'utf8');
      expect(formatStockCsv(series)).withContext(code).toBe(file);
    }
  });
});
