/**
 * `cli reserve --params r=0.5,K=100,D=2 --coast 60 --reserve 20:40 [--fishing F] [--growth logistic|allee]
 *   [--cells N]`: persistence, critical reserve length and recovery front speed of a reserve on a coast.
 * Without --fishing, the reserve is surrounded by water where the stock cannot live.
 */
import { parseArgs } from 'node:util';
import { GROWTH, type SpatialGrowthName } from '../spatial/growth';
import { coastHabitat } from '../spatial/habitat';
import { criticalLength, evaluateDesign, fishingSweep } from '../spatial/reserve';
import { recoveryFront } from '../spatial/front';
import { numberOption, parseParamList, parseRange, UsageError } from './command-args';

export function reserveCommand(args: string[]): unknown {
  const { values: o } = parseArgs({
    args, strict: true,
    options: { params: { type: 'string' }, coast: { type: 'string' }, reserve: { type: 'string' }, fishing: { type: 'string' }, growth: { type: 'string' }, cells: { type: 'string' } },
  });
  const growthName = (o.growth ?? 'logistic') as SpatialGrowthName;
  if (!(growthName in GROWTH)) throw new UsageError(`--growth must be one of ${Object.keys(GROWTH).join(', ')}`);
  const growth = GROWTH[growthName];
  const raw = parseParamList(o.params, 'params');
  for (const k of Object.keys(raw)) if (!['r', 'K', 'D', 'A'].includes(k)) throw new UsageError(`--params: unknown parameter ${k} (use r, K, D${growthName === 'allee' ? ', A' : ''})`);
  const { r, K, D, A } = raw;
  if (!(r! > 0) || !(K! > 0) || !(D! > 0)) throw new UsageError('--params needs r > 0, K > 0 and D > 0');
  if (growthName === 'allee' && !(A! > 0 && A! < K!)) throw new UsageError('--params needs 0 < A < K for the Allee model');
  const params = { r: r!, K: K!, D: D!, ...(A !== undefined ? { A } : {}) };
  const coast = numberOption(o.coast, 'coast', NaN);
  if (!(coast > 0)) throw new UsageError('--coast L (km, positive) is required');
  if (!o.reserve) throw new UsageError('--reserve FROM:TO is required');
  const res = parseRange(o.reserve, 'reserve', false);
  if (res.from < 0 || res.to > coast) throw new UsageError('--reserve must lie within the coast [0, L]');
  const F = o.fishing === undefined ? null : numberOption(o.fishing, 'fishing', 0);
  if (F !== null && F < 0) throw new UsageError('--fishing must be zero or positive');
  const cells = numberOption(o.cells, 'cells', 400);
  if (!Number.isInteger(cells) || cells < 20 || cells > 20_000) throw new UsageError('--cells must be a whole number from 20 to 20000');
  const length = res.to - res.from;
  const hab = F === null
    ? coastHabitat(length, Math.max(20, Math.round((cells * length) / coast)), [[0, length]], 'lethal')
    : coastHabitat(coast, cells, [[res.from, res.to]]);
  const design = evaluateDesign(hab, growth, params, F ?? 0);
  const crit = growthName === 'logistic' ? criticalLength(params, { coast, centre: (res.from + res.to) / 2, F }) : null;
  const frontHab = coastHabitat(coast, cells, [[res.from, res.to]]);
  const stretch = Math.max(res.from, coast - res.to);
  const cStar = 2 * Math.sqrt(params.r * params.D);
  const front = recoveryFront(frontHab, growth, params, { F: 0, years: (1.1 * stretch) / cStar + 5 / params.r, dt: Math.min(0.02, 0.05 / params.r) });
  const sweep = F === null ? null : fishingSweep(hab, growth, params, Math.max(2 * params.r, 2 * F), 24);
  return {
    growth: growthName, params, coast, reserve: [res.from, res.to], fishing: F,
    persists: design.persists, criticalLength: crit, frontSpeed: front.speed, frontSpeedTheory: front.theory,
    sparseGrowthRate: design.sparseGrowthRate, total: design.total, yield: design.yield, spillover: design.spillover,
    criticalFishing: sweep?.criticalF ?? null, lossKind: sweep?.kind ?? null,
  };
}
