/**
 * Profile-likelihood intervals (Venzon & Moolgavkar 1988, Appl. Stat. 37:87; Pawitan 2001, In All
 * Likelihood, ch. 3): the 95% interval of a quantity is every value x whose profile, the least
 * negative log-likelihood over the other parameters with the quantity held at x, lies within
 * χ²₁(0.95)/2 = 1.92 of the minimum. Quantities: r, K, MSY, the fold harvest h*, or any free
 * parameter by its bound name (e.g. 'B0/K', 'p'). A side the likelihood does not close before the
 * parameter's range ends is reported open, never as a zero-width interval.
 */
import jstat from 'jstat';
import { minimise } from '../numerics/nelder-mead';
import { toFree, toNatural } from '../numerics/transforms';
import { referencePoints } from '../surplus/surplus';
import { analyseEquilibria } from '../surplus/equilibria';
import { productionModel } from '../surplus/registry';
import type { RawFit, SurplusProblem } from '../surplus/fit-surplus';

/** χ²₁(0.95)/2: the drop in log-likelihood that bounds a 95% profile interval (standard likelihood theory). */
export const PROFILE_DROP_95 = 3.841458820694124 / 2;

/**
 * A small-sample threshold: (n/2)·ln(1 + F₁,ₙ₋ₖ(0.95)/(n − k)), exact for a normal linear model
 * with σ concentrated out (it tends to 1.92 as n grows). Cox & Hinkley (1974) Theoretical
 * Statistics, §7.5; the F quantile from jStat.
 */
export function smallSampleDrop(n: number, k: number): number {
  const df = n - k;
  if (df < 1) return PROFILE_DROP_95;
  return (n / 2) * Math.log(1 + jstat.jStat.centralF.inv(0.95, 1, df) / df);
}

export type ProfileQuantity = 'r' | 'K' | 'MSY' | 'h*' | string;

export interface ProfilePoint {
  value: number;
  /** Profile negative log-likelihood minus the minimum. */
  drop: number;
}

export interface ProfileInterval {
  quantity: ProfileQuantity;
  estimate: number;
  lower: number;
  upper: number;
  /** The likelihood does not fall by the threshold on this side within the quantity's range (or the estimate sits on a bound). */
  lowerOpen: boolean;
  upperOpen: boolean;
  threshold: number;
  /** The profile points evaluated, in increasing value. */
  points: ProfilePoint[];
}

export interface ProfileOptions {
  /** Drop in log-likelihood that bounds the interval (default 1.92). */
  threshold?: number;
  /** First step away from the estimate, on the log scale (default 0.05; the Hessian's standard error is a good choice). */
  initialStep?: number;
}

interface Reparam {
  estimate: number;
  /** Free vector without the profiled coordinate. */
  reduced: number[];
  /** Full free vector for reduced v and quantity value x, or null when x is not reachable from v. */
  full(v: number[], x: number): number[] | null;
  /** The quantity's natural range. */
  range: [number, number];
}

/** h* (fold harvest under a constant catch) of a decoded parameter set. */
function foldHarvest(problem: SurplusProblem, u: number[]): number {
  return analyseEquilibria(productionModel(problem.model), problem.decode(u), 'catch').collapse?.at ?? 0;
}

function reparam(problem: SurplusProblem, u: number[], q: ProfileQuantity): Reparam {
  const rB = problem.bounds[0]!;
  if (q === 'MSY' || q === 'h*') {
    if (rB.name !== 'r') throw new Error(`cannot profile ${q} with r held fixed`);
    // MSY and h* scale as r times a function of the other (scale-free) parameters, so r = x / Q(r = 1)
    const Q = q === 'MSY' ? (w: number[]) => referencePoints(problem.model, problem.decode(w)).msy : (w: number[]) => foldHarvest(problem, w);
    const withR = (v: number[], r: number) => [toFree(rB, r), ...v];
    const unit = (v: number[]) => Q(withR(v, 1));
    return {
      estimate: Q(u), reduced: u.slice(1), range: [0, Infinity],
      full: (v, x) => {
        const q1 = unit(v);
        const r = x / q1;
        if (!(q1 > 0) || r < rB.lo * (1 + 1e-9) || r > rB.hi * (1 - 1e-9)) return null;
        return withR(v, r);
      },
    };
  }
  const i = problem.bounds.findIndex((b) => b.name === q);
  if (i < 0) throw new Error(`cannot profile "${q}": not a free parameter of this fit`);
  const b = problem.bounds[i]!;
  return {
    estimate: toNatural(b, u[i]!), reduced: [...u.slice(0, i), ...u.slice(i + 1)], range: [b.lo, b.hi],
    full: (v, x) => (x <= b.lo || x >= b.hi ? null : [...v.slice(0, i), toFree(b, x), ...v.slice(i)]),
  };
}

/** The profile interval of one quantity of a fit. */
export function profileInterval(fit: RawFit, quantity: ProfileQuantity, opts: ProfileOptions = {}): ProfileInterval {
  const threshold = opts.threshold ?? PROFILE_DROP_95;
  const rp = reparam(fit.problem, fit.u, quantity);
  const points: ProfilePoint[] = [{ value: rp.estimate, drop: 0 }];
  let best = fit.nll;
  const evalAt = (x: number, start: number[]): { drop: number; v: number[] } | null => {
    if (!rp.full(start, x)) return null;
    const f = (v: number[]) => {
      const w = rp.full(v, x);
      return w ? fit.problem.nll(w) : 1e12;
    };
    const m = minimise(f, start, 250 * start.length);
    if (m.fx >= 1e12) return null;
    best = Math.min(best, m.fx);
    points.push({ value: x, drop: m.fx - fit.nll });
    return { drop: m.fx - fit.nll, v: m.x };
  };
  const side = (dir: 1 | -1): { limit: number; open: boolean } => {
    const [lo, hi] = rp.range;
    const edge = dir > 0 ? hi : lo;
    if (!(rp.estimate > lo * (1 + 1e-6)) && dir < 0) return { limit: lo, open: true };
    if (!(rp.estimate < hi * (1 - 1e-6)) && dir > 0) return { limit: hi, open: true };
    let inside = { x: rp.estimate, v: rp.reduced, drop: 0 };
    let step = opts.initialStep ?? 0.05;
    for (let k = 0; k < 30; k++) {
      let x = inside.x * Math.exp(dir * step);
      const atEdge = (dir > 0 && x >= edge) || (dir < 0 && x <= edge);
      if (atEdge) x = dir > 0 ? edge * (1 - 1e-7) : edge * (1 + 1e-7);
      const e = evalAt(x, inside.v);
      if (!e) return { limit: inside.x, open: true };
      if (e.drop >= threshold) return { limit: refine(inside, { x, v: e.v, drop: e.drop }), open: false };
      if (atEdge || Math.abs(Math.log(x / rp.estimate)) > Math.log(1e4)) return { limit: x, open: true };
      // the profile is near quadratic in log x: aim the next step at the threshold, within limits
      const aim = Math.abs(Math.log(x / rp.estimate)) * Math.sqrt(threshold / Math.max(e.drop, 1e-6)) * 1.05;
      step = Math.min(Math.max(aim - Math.abs(Math.log(x / rp.estimate)), step * 0.5), step * 4);
      inside = { x, v: e.v, drop: e.drop };
    }
    return { limit: inside.x, open: true };
  };
  // regula falsi on √drop against log x (√drop is near linear in x around the optimum)
  const refine = (a: { x: number; v: number[]; drop: number }, b: { x: number; v: number[]; drop: number }): number => {
    const target = Math.sqrt(threshold);
    for (let i = 0; i < 6; i++) {
      const sa = Math.sqrt(Math.max(a.drop, 0)), sb = Math.sqrt(b.drop);
      const w = (target - sa) / (sb - sa);
      const x = Math.exp(Math.log(a.x) + Math.min(0.95, Math.max(0.05, w)) * (Math.log(b.x) - Math.log(a.x)));
      const e = evalAt(x, a.v);
      if (!e) return a.x;
      if (Math.abs(e.drop - threshold) < 0.005) return x;
      if (e.drop >= threshold) b = { x, v: e.v, drop: e.drop }; else a = { x, v: e.v, drop: e.drop };
    }
    const sa = Math.sqrt(Math.max(a.drop, 0)), sb = Math.sqrt(b.drop);
    return Math.exp(Math.log(a.x) + ((target - sa) / (sb - sa)) * (Math.log(b.x) - Math.log(a.x)));
  };
  const low = side(-1);
  const up = side(1);
  points.sort((a, b) => a.value - b.value);
  return { quantity, estimate: rp.estimate, lower: low.limit, upper: up.limit, lowerOpen: low.open, upperOpen: up.open, threshold, points };
}

/** Profile intervals of r, K, MSY and h* (or the quantities named). */
export function profileIntervals(fit: RawFit, quantities: ProfileQuantity[] = ['r', 'K', 'MSY', 'h*'], opts: ProfileOptions = {}): ProfileInterval[] {
  return quantities.filter((q) => q !== 'K' || fit.problem.bounds.some((b) => b.name === 'K')).map((q) => profileInterval(fit, q, opts));
}
