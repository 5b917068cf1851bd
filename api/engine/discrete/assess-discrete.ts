/** Entry point for discrete-generation stocks: fit, bootstrap, cascades, proposed harvest rate and regime warnings. */
import { quantile } from '../uncertainty/bootstrap';
import type { StockSeries } from '../data/series';
import { cascade, type Cascade, type OrbitColumn } from './cascade';
import { bootstrapStockRecruit, fitStockRecruit, stockRecruitPairs, type SrFit, type SrPairs } from './fit-stock-recruit';
import { longRun } from './periodic-orbit';
import { discreteModel, nextStock, nextStockSlope, type DiscreteModel, type DiscreteParams } from './stock-recruit';

export interface DiscreteAssessOptions {
  model: string;
  bootstrap: number;
  seed: number;
  /** The proposed harvest rate is this quantile of the bootstrap u_MSY (a "P*"-style buffer, common practice). */
  risk: number;
  steps?: number;
  onProgress?: (fraction: number, stage: string) => void;
}

export interface ProposedRate {
  rate: number;
  /** 90% bootstrap band of the harvest rate at MSY. */
  band: [number, number] | null;
  /** Long-run regime at the proposed rate under the point estimates. */
  regime: OrbitColumn['regime'];
  period: number | null;
  /** Share of bootstrap replicates whose stock cycles or is chaotic at the proposed rate. */
  shareNotStable: number | null;
}

export interface DiscreteAssessment {
  kind: 'discrete';
  pairs: SrPairs;
  fit: SrFit;
  bootstrap: { replicates: number; uMsy: [number, number]; sMsy: [number, number]; msy: [number, number] } | null;
  harvestCascade: Cascade;
  productivityCascade: Cascade;
  proposal: ProposedRate;
  warnings: string[];
}

// why: a rate within this distance of a cycling regime is "next to" it (chosen margin, common practice in spirit)
export const REGIME_MARGIN = 0.02;

function regimeAt(model: DiscreteModel, params: DiscreteParams, u: number): { regime: OrbitColumn['regime']; period: number | null } {
  const scale = params[model.scale] ?? 1;
  const run = longRun({ f: (x) => nextStock(model, params, u, x), df: (x) => nextStockSlope(model, params, u, x) }, 0.5 * scale, scale);
  if (run.collapsed) return { regime: 'collapse', period: null };
  if (run.period === 1) return { regime: 'stable', period: 1 };
  return { regime: run.period !== null || run.lyapunov < 1e-3 ? 'cycle' : 'chaos', period: run.period };
}

/** Warnings when a rate or its band lies in or next to a cycling, chaotic or collapsing regime. */
export function regimeWarnings(c: Cascade, rate: number, band: [number, number] | null): string[] {
  const lo = Math.min(rate, band?.[0] ?? rate) - REGIME_MARGIN;
  const hi = Math.max(rate, band?.[1] ?? rate) + REGIME_MARGIN;
  const near = c.columns.filter((col) => col.c >= lo && col.c <= hi && col.regime !== 'stable');
  const out: string[] = [];
  const pct = (v: number) => `${(100 * v).toFixed(1)}%`;
  const at = c.columns.reduce((b, col) => (Math.abs(col.c - rate) < Math.abs(b.c - rate) ? col : b), c.columns[0]!);
  if (at.regime !== 'stable') out.push(`At the proposed harvest rate ${pct(rate)} the stock does not settle: ${describe(at)}.`);
  else if (near.length) {
    const kinds = [...new Set(near.map(describe))].join('; ');
    out.push(`The proposed harvest rate ${pct(rate)} or its bootstrap band lies within ${pct(REGIME_MARGIN)} of harvest rates where the stock does not settle (${kinds}).`);
  }
  if (c.collapseAt !== null && hi >= c.collapseAt) out.push(`Harvest rates from ${pct(c.collapseAt)} drive the stock to zero; the band reaches within ${pct(REGIME_MARGIN)} of it.`);
  return out;
}

function describe(col: OrbitColumn): string {
  if (col.regime === 'cycle') return col.period ? `cycles of period ${col.period}` : 'long cycles';
  if (col.regime === 'chaos') return 'chaotic fluctuations';
  return 'collapse';
}

/** Fits the model to the series' spawner/recruit pairs and places a proposed harvest rate in its cascade. */
export function assessDiscrete(series: StockSeries, o: DiscreteAssessOptions): DiscreteAssessment {
  const model = discreteModel(o.model);
  const pairs = stockRecruitPairs(series);
  o.onProgress?.(0.05, 'Fitting the stock-recruitment model');
  const fit = fitStockRecruit(model, pairs.spawners, pairs.recruits);
  const reps = o.bootstrap > 0
    ? bootstrapStockRecruit(model, pairs.spawners, fit, o.bootstrap, o.seed, (d) => o.onProgress?.(0.1 + (0.6 * d) / o.bootstrap, `Bootstrap ${d} of ${o.bootstrap}`))
    : [];
  const q = (xs: number[], lo: number, hi: number): [number, number] => [quantile(xs, lo), quantile(xs, hi)];
  const bootstrap = reps.length
    ? { replicates: reps.length, uMsy: q(reps.map((r) => r.uMsy), 0.05, 0.95), sMsy: q(reps.map((r) => r.sMsy), 0.05, 0.95), msy: q(reps.map((r) => r.msy), 0.05, 0.95) }
    : null;
  o.onProgress?.(0.75, 'Following the cascade against the harvest rate');
  const uTop = Math.min(0.99, fit.reference.uCollapse);
  const harvestCascade = cascade(model, fit.params, { control: 'harvest', from: 0, to: uTop, steps: o.steps ?? 200 });
  const rate = reps.length ? quantile(reps.map((r) => r.uMsy), o.risk) : fit.reference.uMsy;
  o.onProgress?.(0.88, 'Following the cascade against productivity');
  const prod = fit.params[model.productivity]!;
  const spec = model.params.find((s) => s.name === model.productivity)!;
  const productivityCascade = cascade(model, fit.params, { control: 'productivity', from: Math.max(spec.lower, 0.25 * prod), to: Math.min(spec.upper, 2 * prod), steps: o.steps ?? 200, harvest: rate });
  const here = regimeAt(model, fit.params, rate);
  const shareNotStable = reps.length ? reps.filter((r) => ['cycle', 'chaos'].includes(regimeAt(model, r.params, rate).regime)).length / reps.length : null;
  const proposal: ProposedRate = { rate, band: bootstrap?.uMsy ?? null, regime: here.regime, period: here.period, shareNotStable };
  const warnings = regimeWarnings(harvestCascade, rate, proposal.band);
  if (shareNotStable !== null && shareNotStable > 0 && here.regime === 'stable') warnings.push(`In ${(100 * shareNotStable).toFixed(0)}% of bootstrap replicates the stock cycles or fluctuates at the proposed rate.`);
  if (!fit.converged) warnings.push('The fit stopped at its iteration limit; the estimates may not be the best.');
  o.onProgress?.(0.98, 'Done');
  return { kind: 'discrete', pairs, fit, bootstrap, harvestCascade, productivityCascade, proposal, warnings };
}
