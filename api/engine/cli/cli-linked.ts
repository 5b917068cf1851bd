/** Command-line commands for linked stocks: predator-prey fit and fold, and the food chain's predictability horizon. */
import { parseArgs } from 'node:util';
import type { StockSeries } from '../data/series';
import { assessLinked, bootstrapLinked, chainStudy, linkedIntervals } from '../linked/linked-assessment';
import type { LinkedModelName, PredatorPreyFitOptions } from '../linked/fit-predator-prey';
import { HASTINGS_POWELL, type FoodChainParams } from '../linked/food-chain';
import { UsageError } from './command-args';
import { ENGINE_VERSION } from '../assessment';

export const LINKED_MODELS = ['rosenzweig-macarthur', 'lotka-volterra'] as const;


function fixedOrEstimate(v: string | undefined, name: string, lo: number, hi: number): number | 'estimate' | undefined {
  if (v === undefined || v === 'estimate') return v;
  const n = Number(v);
  if (!Number.isFinite(n) || n < lo || n > hi) throw new UsageError(`--${name} must be "estimate" or a number from ${lo} to ${hi}, not "${v}"`);
  return n;
}

/** `fit` and `fold` on a linked file. */
export async function linkedCommand(command: 'fit' | 'fold', series: StockSeries, o: Record<string, string | undefined>, num: (v: string | undefined, name: string) => number) {
  const opts: PredatorPreyFitOptions = {
    model: o.model as LinkedModelName,
    conversion: fixedOrEstimate(o.conversion, 'conversion', 0.001, 1),
    saturation: fixedOrEstimate(o.saturation, 'saturation', 0, 20),
  };
  const a = assessLinked(series, opts);
  const f = a.fit;
  if (command === 'fold') {
    return {
      engine: ENGINE_VERSION, model: f.model, equilibrium: f.equilibrium,
      events: { preyCatch: a.bifurcations.preyCatch.events, predatorCatch: a.bifurcations.predatorCatch.events },
      catchPlane: a.catchPlane,
    };
  }
  const n = o.bootstrap === undefined ? 0 : num(o.bootstrap, 'bootstrap');
  const seed = o.seed === undefined ? 1 : num(o.seed, 'seed');
  const reps = n > 0 ? await bootstrapLinked(series, opts, f, { replicates: n, seed, workers: o.workers === undefined ? 2 : num(o.workers, 'workers') }) : null;
  return {
    engine: ENGINE_VERSION, model: f.model, estimates: f.estimates, fixed: f.fixed, logLik: f.logLik, aic: f.aic, aicc: f.aicc,
    nParams: f.nParams, nObs: f.nObs, comparison: a.comparison, equilibrium: f.equilibrium,
    indices: f.indices.map((i) => ({ name: i.name, species: i.species, q: i.q, sigma: i.sigma, residuals: i.residuals })),
    convergence: f.convergence, bootstrap: reps ? { replicates: reps.length, intervals: linkedIntervals(reps) } : null,
  };
}

function numbers(v: string, name: string, count: number): number[] {
  const xs = v.split(',').map((s) => Number(s.trim()));
  if (xs.length !== count || !xs.every((x) => Number.isFinite(x) && x >= 0)) throw new UsageError(`--${name} needs ${count} numbers ≥ 0 separated by commas, not "${v}"`);
  return xs;
}

/** Parses `r=2,K=50000,...`: r, K, yScale and zScale are required; the shape defaults to Hastings & Powell (1991). */
export function parseChainParams(text: string): FoodChainParams {
  const out: Record<string, number> = { ...HASTINGS_POWELL };
  const known = ['r', 'K', 'yScale', 'zScale', 'a1', 'b1', 'a2', 'b2', 'd1', 'd2'];
  for (const part of text.split(',').map((s) => s.trim()).filter(Boolean)) {
    const [k, v] = part.split('=');
    if (!k || v === undefined || !known.includes(k)) throw new UsageError(`--params: "${part}" is not one of ${known.join(', ')} written key=value`);
    const n = Number(v);
    if (!(Number.isFinite(n) && n > 0)) throw new UsageError(`--params: ${k} must be a positive number, not "${v}"`);
    out[k] = n;
  }
  for (const k of ['r', 'K', 'yScale', 'zScale']) if (out[k] === undefined) throw new UsageError(`--params needs ${k}`);
  return out as unknown as FoodChainParams;
}

/** `horizon`: Lyapunov exponents (largest first) and the predictability horizon in years. */
export function horizonCommand(args: string[]) {
  const { values: o } = parseArgs({ args, strict: true, options: {
    model: { type: 'string' }, params: { type: 'string' }, start: { type: 'string' }, rates: { type: 'string' }, error: { type: 'string' },
  } });
  if (o.model !== 'food-chain') throw new UsageError('horizon needs --model food-chain');
  if (!o.params) throw new UsageError('horizon needs --params r=…,K=…,yScale=…,zScale=…');
  const p = parseChainParams(o.params);
  const start = o.start ? numbers(o.start, 'start', 3) : [0.76 * p.K, 0.16 * p.yScale, 9.9 * p.zScale];
  const rates = o.rates ? numbers(o.rates, 'rates', 3) as [number, number, number] : undefined;
  const error = o.error === undefined ? 0.05 : Number(o.error);
  if (!(error > 0 && error < 1)) throw new UsageError(`--error must be a relative error between 0 and 1, not "${o.error}"`);
  const s = chainStudy(p, start, { error, harvest: { rates } });
  return { engine: ENGINE_VERSION, model: 'food-chain', params: p, lyapunov: s.lyapunov, horizonYears: s.horizonYears, error, tolerance: s.tolerance, regime: s.regime };
}
