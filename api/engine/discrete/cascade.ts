/**
 * The period-doubling cascade of a harvested stock-recruitment map against the harvest rate or the
 * productivity: the long-run states on a grid (orbit diagram), the doubling points found by following
 * each periodic orbit until its multiplier passes −1, the onset of chaos and the periodic windows in it.
 */
import { hasShorterPeriod, longRun, multiplier, periodicPoint, type LongRun, type Map1 } from './periodic-orbit';
import { nextStock, nextStockSlope, type DiscreteModel, type DiscreteParams } from './stock-recruit';

/** Feigenbaum's δ (Feigenbaum 1978, J. Stat. Phys. 19:25), used only to predict the next doubling. */
export const FEIGENBAUM_DELTA = 4.669201609102990;

export type CascadeControl = 'harvest' | 'productivity';
export type Regime = 'stable' | 'cycle' | 'chaos' | 'collapse';

export interface CascadeOptions {
  control: CascadeControl;
  from: number;
  to: number;
  steps?: number;
  /** Harvest rate held fixed when the control is productivity. */
  harvest?: number;
  /** Longest period followed (doublings up to this period are resolved). */
  maxPeriod?: number;
}

export interface OrbitColumn {
  c: number;
  states: number[];
  period: number | null;
  lyapunov: number;
  regime: Regime;
}

export interface PeriodicWindow {
  period: number;
  from: number;
  to: number;
}

export interface Cascade {
  control: CascadeControl;
  /** Control values of the successive doublings: period 1→2, 2→4, …, in the order met. */
  doublings: number[];
  /** Periods born at each doubling. */
  periods: number[];
  /** Ratios of successive doubling intervals (estimates of Feigenbaum's δ). */
  deltaEstimates: number[];
  /** Accumulation point of the doublings: the onset of chaos (null when no cascade is resolved). */
  chaosOnset: number | null;
  /** Which side of the first doubling the cycles lie on: 'above' larger control values. */
  cyclesWhere: 'above' | 'below' | null;
  windows: PeriodicWindow[];
  /** Harvest rate above which the stock declines to zero (harvest control only). */
  collapseAt: number | null;
  columns: OrbitColumn[];
}

interface Family {
  at(c: number): Map1;
  scale: number;
}

function familyFor(model: DiscreteModel, params: DiscreteParams, o: CascadeOptions): Family {
  const scale = model.scale ? params[model.scale]! : 1;
  if (o.control === 'harvest') {
    return { scale, at: (u) => ({ f: (x) => nextStock(model, params, u, x), df: (x) => nextStockSlope(model, params, u, x) }) };
  }
  const u = o.harvest ?? 0;
  return {
    scale,
    at: (c) => {
      const p = { ...params, [model.productivity]: c };
      return { f: (x) => nextStock(model, p, u, x), df: (x) => nextStockSlope(model, p, u, x) };
    },
  };
}

/** The positive fixed point of the map, by bisection on f(x) − x, or null when there is none. */
export function positiveFixedPoint(m: Map1, scale: number): number | null {
  let lo = 1e-9 * scale;
  let hi = 100 * scale;
  if (m.f(lo) - lo <= 0) return null;
  if (m.f(hi) - hi >= 0) return null;
  for (let i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (m.f(mid) - mid > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

function classify(run: LongRun): Regime {
  if (run.collapsed) return 'collapse';
  if (run.period === 1) return 'stable';
  if (run.period !== null || run.lyapunov < 1e-3) return 'cycle';
  return 'chaos';
}

/** Bisection in c for the point where the period-p orbit's multiplier equals −1; x follows the orbit. */
function refineFlip(fam: Family, p: number, a: { c: number; x: number }, b: { c: number; x: number }): { c: number; x: number } | null {
  const phi = (c: number, guess: number) => {
    const m = fam.at(c);
    const x = periodicPoint(m, p, guess, fam.scale);
    return x === null ? null : { x, v: multiplier(m, p, x) + 1 };
  };
  let lo = a;
  let hi = b;
  for (let i = 0; i < 200; i++) {
    if (Math.abs(hi.c - lo.c) <= 2e-16 * Math.max(1, Math.abs(lo.c))) break;
    const c = 0.5 * (lo.c + hi.c);
    const r = phi(c, lo.x);
    if (!r) return null;
    if (r.v > 0) lo = { c, x: r.x };
    else hi = { c, x: r.x };
  }
  return { c: 0.5 * (lo.c + hi.c), x: lo.x };
}

/** Follows the period-p orbit from (c0, x0) to c1 in small steps; null when it is lost. */
function follow(fam: Family, p: number, c0: number, x0: number, c1: number, steps = 16): { c: number; x: number; v: number }[] | null {
  const out: { c: number; x: number; v: number }[] = [];
  let x = x0;
  for (let i = 1; i <= steps; i++) {
    const c = c0 + ((c1 - c0) * i) / steps;
    const m = fam.at(c);
    const nx = periodicPoint(m, p, x, fam.scale);
    if (nx === null || hasShorterPeriod(m, p, nx, fam.scale)) return out.length ? out : null;
    x = nx;
    out.push({ c, x, v: multiplier(m, p, x) + 1 });
  }
  return out;
}

/** The first doubling: where the fixed point's multiplier passes −1 on the grid, refined by bisection. */
function firstDoubling(fam: Family, grid: number[]): { c: number; x: number; dir: 1 | -1 } | null {
  let prev: { c: number; x: number; v: number } | null = null;
  for (const c of grid) {
    const m = fam.at(c);
    const x = positiveFixedPoint(m, fam.scale);
    if (x === null) { prev = null; continue; }
    const v = m.df(x) + 1;
    if (prev && (prev.v > 0) !== (v > 0)) {
      const stable = prev.v > 0 ? prev : { c, x, v };
      const flipped = prev.v > 0 ? { c, x, v } : prev;
      const r = refineFlip(fam, 1, stable, flipped);
      if (r) return { ...r, dir: flipped.c > stable.c ? 1 : -1 };
    }
    prev = { c, x, v };
  }
  return null;
}

/** Resolves the doublings after the first by following each new orbit until its multiplier passes −1. */
function laterDoublings(fam: Family, first: { c: number; x: number; dir: 1 | -1 }, limit: number, maxPeriod: number): number[] {
  const cs = [first.c];
  let step = 0.05 * Math.abs(limit - first.c);
  for (let p = 2; p <= maxPeriod; p *= 2) {
    const ck = cs[cs.length - 1]!;
    const guess = cs.length >= 2 ? Math.abs(ck - cs[cs.length - 2]!) / FEIGENBAUM_DELTA : step;
    if (guess < 1e-13 * Math.max(1, Math.abs(ck))) break;
    // start inside the stable interval of the new orbit, where iterating the map finds it quickly
    const cStart = ck + first.dir * 0.35 * guess;
    const m = fam.at(cStart);
    const run = longRun(m, 0.7 * first.x, fam.scale, { transient: 20000, keep: 4 * p, maxPeriod: p });
    const x0 = periodicPoint(m, p, run.last, fam.scale);
    if (x0 === null || hasShorterPeriod(m, p, x0, fam.scale)) break;
    let found: number | null = null;
    let from = { c: cStart, x: x0 };
    for (let span = 1.5 * guess; Math.abs(span) < 40 * guess && found === null; span *= 1.6) {
      const end = ck + first.dir * span;
      if ((end - limit) * first.dir > 0) break;
      const path = follow(fam, p, from.c, from.x, end);
      if (!path) break;
      const flip = path.findIndex((q) => q.v <= 0);
      if (flip >= 0) {
        const before = flip === 0 ? from : path[flip - 1]!;
        const r = refineFlip(fam, p, before, path[flip]!);
        if (r) found = r.c;
        break;
      }
      from = path[path.length - 1]!;
    }
    if (found === null) break;
    cs.push(found);
    step = Math.abs(found - ck);
  }
  return cs;
}

/** Orbit diagram, doublings, chaos onset and periodic windows of a model over a range of the control. */
export function cascade(model: DiscreteModel, params: DiscreteParams, o: CascadeOptions): Cascade {
  const steps = o.steps ?? 200;
  const fam = familyFor(model, params, o);
  const grid = Array.from({ length: steps + 1 }, (_, i) => o.from + ((o.to - o.from) * i) / steps);
  const columns: OrbitColumn[] = [];
  let x = 0.5 * fam.scale;
  for (const c of grid) {
    const run = longRun(fam.at(c), x > 0 ? x : 0.5 * fam.scale, fam.scale);
    if (!run.collapsed) x = run.last;
    columns.push({ c, states: run.states, period: run.period, lyapunov: run.lyapunov, regime: classify(run) });
  }
  const first = firstDoubling(fam, grid);
  const limit = first ? (first.dir > 0 ? Math.max(o.from, o.to) : Math.min(o.from, o.to)) : 0;
  const doublings = first ? laterDoublings(fam, first, limit, o.maxPeriod ?? 64) : [];
  const deltaEstimates: number[] = [];
  for (let i = 2; i < doublings.length; i++) deltaEstimates.push((doublings[i - 1]! - doublings[i - 2]!) / (doublings[i]! - doublings[i - 1]!));
  const n = doublings.length;
  // accumulation point of a geometric sequence of intervals with ratio δ (Feigenbaum 1978)
  const chaosOnset = n >= 3 ? doublings[n - 1]! + (doublings[n - 1]! - doublings[n - 2]!) / (FEIGENBAUM_DELTA - 1) : null;
  return {
    control: o.control,
    doublings,
    periods: doublings.map((_, i) => 2 ** (i + 1)),
    deltaEstimates,
    chaosOnset,
    cyclesWhere: first ? (first.dir > 0 ? 'above' : 'below') : null,
    windows: chaosOnset === null || !first ? [] : windowsIn(columns, chaosOnset, first.dir),
    collapseAt: o.control === 'harvest' ? model.reference(params).uCollapse : null,
    columns,
  };
}

// why: windows of longer period are narrower than any useful grid; they read as chaos on the diagram
const MAX_WINDOW_PERIOD = 16;

/** Runs of grid columns beyond the onset of chaos that settle on a cycle. */
function windowsIn(columns: OrbitColumn[], onset: number, dir: 1 | -1): PeriodicWindow[] {
  const out: PeriodicWindow[] = [];
  const beyond = columns.filter((col) => (col.c - onset) * dir > 0);
  const ordered = dir > 0 ? beyond : beyond.slice().reverse();
  let open: PeriodicWindow | null = null;
  let seenChaos = false;
  for (const col of ordered) {
    if (col.regime === 'chaos') seenChaos = true;
    const periodic = seenChaos && col.period !== null && col.period > 1 && col.period <= MAX_WINDOW_PERIOD && col.lyapunov < 0;
    if (periodic && open && open.period === col.period) open.to = col.c;
    else {
      if (open) out.push(open);
      open = periodic ? { period: col.period!, from: col.c, to: col.c } : null;
    }
  }
  if (open) out.push(open);
  return out;
}
