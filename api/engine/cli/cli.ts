/**
 * Command line for scripted runs:
 *   npm run --silent cli -- fit   --model schaefer --input FILE.csv [--shape P] [--bootstrap N] [--seed S]
 *   npm run --silent cli -- fold  --model schaefer|pella-tomlinson|fox|allee|predation --input FILE.csv
 *   npm run --silent cli -- fold  --model predation --params r=0.6,K=12,c=1,a=1   (no data: the diagram of given parameters)
 *   npm run --silent cli -- rebuild --model schaefer --input FILE.csv [--replicates 500] [--candidates 0,500] [--control catch|F]
 *        [--horizon 30] [--process-sd 0.1] [--seed S]
 *   npm run --silent cli -- quota --model schaefer --input FILE.csv [--risk 0.05] [--replicates 1000]
 *        [--limit 0.4] [--trigger 0.8] [--ftarget 1] [--candidates 1000,1500] [--years 10] [--process-sd 0.1] [--control catch|F]
 *   npm run --silent cli -- diagnose --model schaefer --input FILE.csv [--peel 5] [--jitter 20] [--seed S]
 *   npm run --silent cli -- cascade --model ricker --params r=2.8,K=1000 [--harvest FROM:TO:STEP]   (cascade-command.ts)
 *   npm run --silent cli -- reserve --params r=0.5,K=100,D=2 --coast 60 --reserve 20:40 [--fishing F]   (reserve-command.ts)
 * Linked files (prey_catch, predator_catch): fit and fold with --model rosenzweig-macarthur|lotka-volterra
 *        [--conversion 0.25|estimate] [--saturation 0.5|estimate] [--bootstrap N]
 *   npm run --silent cli -- horizon --model food-chain --params r=2,K=50000,yScale=20000,zScale=1000[,a1=5,...]
 *        [--start X,Y,Z] [--rates F1,F2,F3] [--error 0.05]
 * Prints JSON on standard output; on bad input prints the problems on standard error and exits 2.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { assessSurplus, bootstrapFit, ENGINE_VERSION, quotaStudy } from '../assessment';
import { parseStockCsv } from '../data/csv';
import { diagnoseSurplus } from '../diagnostics/diagnose';
import { SURPLUS_MODEL_NAMES, type SurplusModelName } from '../surplus/registry';
import { foldFromParams, foldReport } from './surplus-command';
import { UsageError } from './command-args';
import { cascadeCommand } from './cascade-command';
import { reserveCommand } from './reserve-command';
import { linkedCommand, horizonCommand, LINKED_MODELS } from './cli-linked';

const MODELS: SurplusModelName[] = SURPLUS_MODEL_NAMES;

function num(v: string | undefined, name: string, def: number): number {
  if (v === undefined) return def;
  const n = Number(v);
  if (!Number.isFinite(n)) throw new UsageError(`--${name} must be a number, not "${v}"`);
  return n;
}

async function main(argv: string[]): Promise<unknown> {
  const [command, ...rest] = argv;
  if (command === 'cascade') return { engine: ENGINE_VERSION, ...cascadeCommand(rest) as object };
  if (command === 'reserve') return { engine: ENGINE_VERSION, ...reserveCommand(rest) as object };
  if (command === 'horizon') return horizonCommand(rest);
  if (!command || !['fit', 'fold', 'quota', 'diagnose', 'rebuild'].includes(command)) throw new UsageError('usage: cli fit|fold|quota|rebuild|diagnose --model MODEL --input FILE.csv [options] | cli fold --model MODEL --params r=...,K=... | cli horizon ... | cli cascade ... | cli reserve ...');
  const { values: o } = parseArgs({
    args: rest, strict: true,
    options: {
      model: { type: 'string' }, input: { type: 'string' }, shape: { type: 'string' }, bootstrap: { type: 'string' },
      seed: { type: 'string' }, risk: { type: 'string' }, replicates: { type: 'string' }, limit: { type: 'string' },
      trigger: { type: 'string' }, ftarget: { type: 'string' }, candidates: { type: 'string' }, years: { type: 'string' },
      'process-sd': { type: 'string' }, workers: { type: 'string' }, peel: { type: 'string' }, jitter: { type: 'string' },
      conversion: { type: 'string' }, saturation: { type: 'string' }, params: { type: 'string' }, control: { type: 'string' },
      horizon: { type: 'string' }, 'allow-above-k': { type: 'boolean' },
    },
  });
  const model = o.model as SurplusModelName;
  const linkedModel = (LINKED_MODELS as readonly string[]).includes(o.model ?? '');
  if (!MODELS.includes(model) && !linkedModel) throw new UsageError(`--model must be one of ${[...MODELS, ...LINKED_MODELS].join(', ')}`);
  if (o.params !== undefined) {
    if (command !== 'fold' || linkedModel) throw new UsageError('--params works with fold on a single-stock model');
    if (o.input) throw new UsageError('give --params or --input, not both');
    return { engine: ENGINE_VERSION, ...foldFromParams(model, o.params) };
  }
  if (o.control !== undefined && o.control !== 'catch' && o.control !== 'F') throw new UsageError('--control must be catch or F');
  const control = (o.control ?? 'catch') as 'catch' | 'F';
  if (!o.input) throw new UsageError('--input FILE.csv (or, for fold, --params) is required');
  let text: string;
  try { text = readFileSync(o.input, 'utf8'); } catch { throw new UsageError(`cannot read ${o.input}`); }
  const parsed = parseStockCsv(text);
  if (!parsed.ok) throw new UsageError(`${o.input} has ${parsed.errors.length} problem(s):\n` + parsed.errors.map((e) => `  line ${e.line}${e.column ? `, ${e.column}` : ''}: ${e.problem} ${e.fix}`).join('\n'));
  if (linkedModel !== (parsed.kind === 'predator-prey')) {
    throw new UsageError(linkedModel ? `${o.input} is a single-stock file: ${o.model} needs prey_catch, predator_catch and two surveys` : `${o.input} is a linked predator-prey file: use --model ${LINKED_MODELS.join(' or ')}`);
  }
  if (linkedModel) {
    if (command !== 'fit' && command !== 'fold') throw new UsageError(`${command} works on single stocks; for linked stocks use fit (with --bootstrap) and fold`);
    const { 'allow-above-k': _flag, ...textOptions } = o;
    return linkedCommand(command as 'fit' | 'fold', parsed.series, textOptions, (v, name) => num(v, name, 0));
  }
  const opts = { model, shape: o.shape === undefined ? undefined : num(o.shape, 'shape', 1), allowAboveK: o['allow-above-k'] ?? false };
  const seed = num(o.seed, 'seed', 1);
  const { fit, fold } = assessSurplus(parsed.series, opts);
  if (command === 'diagnose') {
    const peel = num(o.peel, 'peel', 5);
    if (!Number.isInteger(peel) || peel < 1 || peel > 10) throw new UsageError('--peel must be a whole number from 1 to 10');
    const d = diagnoseSurplus(parsed.series, opts, fit, { peel, jitter: num(o.jitter, 'jitter', 20), seed });
    const byIndex = <T>(f: (i: number) => T) => Object.fromEntries(d.residuals.map((r, i) => [r.index, f(i)]));
    return {
      engine: ENGINE_VERSION, model, peels: d.retrospective ? d.retrospective.peels.length - 1 : 0,
      mohnsRho: d.retrospective?.mohnsRho ?? null,
      mase: Object.fromEntries(d.hindcast.map((h) => [h.index, h.mase])),
      runsTest: byIndex((i) => ({ p: d.residuals[i]!.runsTest?.p ?? null, runs: d.residuals[i]!.runsTest?.runs ?? null, expected: d.residuals[i]!.runsTest?.expected ?? null })),
      lag1: byIndex((i) => d.residuals[i]!.lag1),
      outside3Sigma: byIndex((i) => d.residuals[i]!.outside3Sigma),
      profiles: Object.fromEntries(d.profiles.map((p) => [p.name, p.interval])),
      jitter: d.jitter && { starts: d.jitter.starts, reachingBest: d.jitter.reachingBest, bestNll: d.jitter.bestNll, fitNll: d.jitter.fitNll },
    };
  }
  if (command === 'fold') return { engine: ENGINE_VERSION, model, ...foldReport(fold) };
  const workers = o.workers === undefined ? undefined : num(o.workers, 'workers', 2);
  if (command === 'fit') {
    const n = num(o.bootstrap, 'bootstrap', 0);
    const reps = n > 0 ? await bootstrapFit(parsed.series, opts, fit, { replicates: n, seed, workers }) : null;
    return {
      engine: ENGINE_VERSION, model, estimates: fit.estimates, logLik: fit.logLik, aic: fit.aic, aicc: fit.aicc,
      msy: fit.reference.msy, bMsy: fit.reference.bMsy, fMsy: fit.reference.fMsy, foldHarvest: fold.hStar, status: fit.status,
      indices: fit.indices.map((i) => ({ name: i.name, q: i.q, sigma: i.sigma })), convergence: fit.convergence,
      bootstrap: reps ? quotaStudy(model, fit, reps, { risk: 0.05, rule: { limit: 0.4, trigger: 0.8, fTargetOverFmsy: 1 }, candidates: [], years: 1, processSd: 0, limitFraction: 0.5, seed }).intervals : null,
    };
  }
  const reps = await bootstrapFit(parsed.series, opts, fit, { replicates: num(o.replicates, 'replicates', command === 'rebuild' ? 500 : 1000), seed, workers });
  const candidates = (o.candidates ?? '').split(',').filter(Boolean).map((c) => num(c, 'candidates', 0));
  const limit = num(o.limit, 'limit', 0.4);
  const horizon = num(o.horizon, 'horizon', 30);
  if (!(Number.isInteger(horizon) && horizon >= 1 && horizon <= 200)) throw new UsageError('--horizon must be a whole number of years from 1 to 200');
  const study = quotaStudy(model, fit, reps, {
    risk: num(o.risk, 'risk', 0.05),
    rule: { limit, trigger: num(o.trigger, 'trigger', 0.8), fTargetOverFmsy: num(o.ftarget, 'ftarget', 1) },
    candidates, years: num(o.years, 'years', 10), processSd: num(o['process-sd'], 'process-sd', 0.1), limitFraction: limit, seed, control, rebuildYears: horizon,
  });
  if (command === 'rebuild') {
    return { engine: ENGINE_VERSION, model, control, bMsy: fit.reference.bMsy, current: fit.biomass[fit.biomass.length - 1], horizon, rebuild: study.rebuild };
  }
  return { engine: ENGINE_VERSION, model, foldHarvest: fold.hStar, msy: fit.reference.msy, ...study };
}

try {
  console.log(JSON.stringify(await main(process.argv.slice(2)), null, 2));
} catch (err) {
  const message = err instanceof UsageError || (err as { code?: string }).code?.startsWith('ERR_PARSE_ARGS') ? (err as Error).message : `engine failure: ${(err as Error).message}`;
  console.error(`brinkmark: ${message}`);
  process.exit(2);
}
