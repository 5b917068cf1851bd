/**
 * Equilibria of a one-dimensional production model under a constant harvest control u (a catch h,
 * or a fishing mortality F), followed along the equilibrium curve. Each biomass B is the equilibrium
 * of exactly one control value, u(B) = g(B) under a catch and u(B) = g(B)/B under F, so the curve is
 * continued in B; its turning points (du/dB = 0) are the folds (saddle-nodes), and an equilibrium is
 * stable exactly where du/dB < 0 (d/dB of g − h is g' = du/dB; of g − F·B it is B·du/dB). Under F,
 * the extinct state B = 0 exchanges stability with the curve at F = g'(0) (transcritical).
 * Kuznetsov, Elements of Applied Bifurcation Theory, ch. 3; Strogatz (1994) Nonlinear Dynamics and Chaos, §3.
 */
import type { ProductionModel, SurplusParams } from './production-model';

export type Control = 'catch' | 'F';

export interface Bifurcation {
  kind: 'fold' | 'transcritical';
  control: Control;
  /** Control value at the bifurcation (catch per year, or F per year). */
  at: number;
  /** Equilibrium biomass there. */
  biomass: number;
}

export interface EquilibriumPoint {
  B: number;
  stable: boolean;
}

export interface BranchSegment {
  stable: boolean;
  /** Points (control, biomass) along a monotone piece of the curve, in increasing B, control ≥ 0. */
  points: { u: number; B: number }[];
}

export interface EquilibriumAnalysis {
  control: Control;
  /** Largest equilibrium without harvest (K for most models; below K under predation), 0 if none. */
  unfished: number;
  /** Every fold at a non-negative control, and the transcritical point under F, in increasing control. */
  bifurcations: Bifurcation[];
  /** The curve in monotone pieces, each stable or unstable. */
  segments: BranchSegment[];
  /** Where the stable state reached from the unfished equilibrium ends as the control rises: null if it never does. */
  collapse: Bifurcation | null;
  /** Control range of a lower stable state of positive biomass, if one exists. */
  lower: { from: number; to: number } | null;
  /** Control below which a stock held on the lower state (or collapsed) returns to the upper branch. */
  recovery: Bifurcation | null;
  /** Plain statement of how the stock recovers after a collapse, or why it cannot. */
  recoveryNote: string;
  /** Raising then cutting the control follows different paths: collapse and recovery happen at different controls. */
  hysteresis: boolean;
}

const GRID = 900;

/** Sign changes of df on (lo, hi], located by bisection to machine precision. */
export function criticalPoints(df: (x: number) => number, lo: number, hi: number): number[] {
  const xs: number[] = [];
  for (let i = 1; i <= GRID; i++) xs.push(lo + ((hi - lo) * i) / GRID);
  for (let i = 0; i < 300; i++) xs.push(lo + (hi - lo) * Math.pow(10, -8 + (8 * i) / 300));
  xs.sort((a, b) => a - b);
  const roots: number[] = [];
  for (let i = 1; i < xs.length; i++) {
    const a = xs[i - 1]!, b = xs[i]!;
    const fa = df(a), fb = df(b);
    if (fa === 0 && i > 1) continue;
    if (Math.sign(fa) !== Math.sign(fb) && fb !== 0) roots.push(bisect(df, a, b));
    else if (fb === 0 && i < xs.length - 1 && Math.sign(df(xs[i + 1]!)) !== Math.sign(fa)) roots.push(b);
  }
  return roots;
}

/** Root of f between a and b where f changes sign (or is zero at an end), to machine precision. */
export function bisect(f: (x: number) => number, a: number, b: number): number {
  let lo = a, hi = b;
  let flo = f(lo);
  if (flo === 0) return lo;
  if (f(hi) === 0) return hi;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (mid <= lo || mid >= hi) break;
    const fm = f(mid);
    if (fm === 0) return mid;
    if (Math.sign(fm) === Math.sign(flo)) { lo = mid; flo = fm; } else hi = mid;
  }
  return (lo + hi) / 2;
}

/** The largest value of f on (lo, hi] and where it is taken (an interior critical point or hi). */
export function maximumOf(f: (x: number) => number, df: (x: number) => number, lo: number, hi: number): { at: number; value: number } {
  let best = { at: hi, value: f(hi) };
  for (const x of criticalPoints(df, lo, hi)) if (f(x) > best.value) best = { at: x, value: f(x) };
  return best;
}

/** Largest B > 0 with g(B) = 0 and g falling through it: the unfished equilibrium (0 when the stock cannot persist). */
export function unfishedEquilibrium(m: ProductionModel, p: SurplusParams): number {
  const K = p.K;
  if (Math.abs(m.g(p, K)) <= 1e-13 * p.r * K && m.dg(p, K) < 0) return K;
  for (let i = GRID; i >= 1; i--) {
    const B = (K * i) / GRID;
    if (m.g(p, B) > 0) return bisect((x) => m.g(p, x), B, i === GRID ? K * 1.5 : (K * (i + 1)) / GRID);
  }
  return 0;
}

/** Control value u(B) whose equilibrium is B, and its slope du/dB. */
export function controlCurve(m: ProductionModel, p: SurplusParams, control: Control): { u: (B: number) => number; du: (B: number) => number } {
  if (control === 'catch') return { u: (B) => m.g(p, B), du: (B) => m.dg(p, B) };
  return { u: (B) => m.g(p, B) / B, du: (B) => (m.dg(p, B) * B - m.g(p, B)) / (B * B) };
}

/** Folds, transcritical point, stable and unstable pieces, collapse, recovery and hysteresis under one control. */
export function analyseEquilibria(m: ProductionModel, p: SurplusParams, control: Control, samplesPerPiece = 60): EquilibriumAnalysis {
  const top = unfishedEquilibrium(m, p);
  const none: EquilibriumAnalysis = {
    control, unfished: 0, bifurcations: [], segments: [], collapse: null, lower: null, recovery: null, hysteresis: false,
    recoveryNote: 'The stock has no positive equilibrium even unfished.',
  };
  if (!(top > 0)) return none;
  const { u, du } = controlCurve(m, p, control);
  // why: the du sign scan works on (0, top]; a tiny offset keeps g/B finite at the origin
  const eps = 1e-9 * top;
  // F at B → 0 is g'(0): finite (transcritical with extinction) except for Fox (infinite)
  const u0 = control === 'F' ? m.perCapitaAtZero(p) : 0;
  const crit = criticalPoints(du, eps, top * (1 - 1e-12));
  const edges = [eps, ...crit, top];
  const segments: BranchSegment[] = [];
  const pieces: { lo: number; hi: number; stable: boolean }[] = [];
  for (let i = 1; i < edges.length; i++) {
    const lo = edges[i - 1]!, hi = edges[i]!;
    const stable = du((lo + hi) / 2) < 0;
    pieces.push({ lo, hi, stable });
    const points: { u: number; B: number }[] = [];
    for (let k = 0; k <= samplesPerPiece; k++) {
      const B = lo + ((hi - lo) * k) / samplesPerPiece;
      const v = B === eps && control === 'F' ? u0 : u(B);
      if (v >= 0 && Number.isFinite(v)) points.push({ u: v, B: B === eps ? 0 : B });
    }
    if (points.length > 1) segments.push({ stable, points });
  }
  const folds: Bifurcation[] = crit.filter((B) => u(B) >= 0).map((B) => ({ kind: 'fold', control, at: u(B), biomass: B }));
  const transcritical: Bifurcation | null = control === 'F' && Number.isFinite(u0) && u0 > 0
    ? { kind: 'transcritical', control, at: u0, biomass: 0 } : null;
  const bifurcations = [...folds, ...(transcritical ? [transcritical] : [])].sort((a, b) => a.at - b.at);

  const upper = pieces[pieces.length - 1]!;
  const collapse: Bifurcation | null = pieces.length > 1
    ? { kind: 'fold', control, at: u(upper.lo), biomass: upper.lo }
    : transcritical ?? (control === 'catch' ? { kind: 'fold', control, at: u(upper.lo), biomass: upper.lo } : null);
  const lowerPiece = pieces.slice(0, -1).reverse().find((pc) => pc.stable && Math.max(u(pc.lo === eps && control === 'F' ? eps : pc.lo), u(pc.hi)) > 0);
  const lower = lowerPiece ? rangeOf(lowerPiece, u, control, u0, eps) : null;
  const { recovery, recoveryNote } = describeRecovery(m, p, control, lowerPiece ?? null, u, transcritical);
  return {
    control, unfished: top, bifurcations, segments, collapse, lower, recovery, recoveryNote,
    hysteresis: recovery !== null && collapse !== null && recovery.at < collapse.at - 1e-12 * Math.abs(collapse.at),
  };
}

function rangeOf(pc: { lo: number; hi: number }, u: (B: number) => number, control: Control, u0: number, eps: number) {
  const a = pc.lo === eps && control === 'F' ? u0 : u(pc.lo);
  const b = u(pc.hi);
  return { from: Math.max(0, Math.min(a, b)), to: Math.max(a, b) };
}

function describeRecovery(
  m: ProductionModel, p: SurplusParams, control: Control,
  lowerPiece: { lo: number; hi: number; stable: boolean } | null, u: (B: number) => number, transcritical: Bifurcation | null,
): { recovery: Bifurcation | null; recoveryNote: string } {
  if (lowerPiece) {
    const at = u(lowerPiece.hi);
    if (at < 0) {
      return { recovery: null, recoveryNote: 'A stock held on the lower state stays there even with no harvest: cutting the harvest alone does not bring it back.' };
    }
    return {
      recovery: { kind: 'fold', control, at, biomass: lowerPiece.hi },
      recoveryNote: `A stock on the lower state returns to the upper branch only once the ${control === 'F' ? 'fishing mortality' : 'catch'} is cut below ${fmt(at)}.`,
    };
  }
  const threshold0 = stateAtControl(m, p, control, 0).threshold ?? 0;
  if (m.depensation && threshold0 > 0 && m.g(p, threshold0 / 2) < 0) {
    return { recovery: null, recoveryNote: `Below the threshold of ${fmt(threshold0)} the stock declines even unfished: once it has collapsed it does not recover by cutting the harvest.` };
  }
  if (control === 'F' && transcritical) {
    return { recovery: transcritical, recoveryNote: `No fold: the stock declines to extinction above F = ${fmt(transcritical.at)} and recovers as soon as F is cut below it (no hysteresis).` };
  }
  if (control === 'F') return { recovery: null, recoveryNote: 'No fold: under this model the stock persists at any constant F (the equilibrium only shrinks).' };
  return { recovery: null, recoveryNote: 'Past the fold a constant catch drives the stock to zero; cutting the catch recovers it only while biomass remains above the threshold.' };
}

const fmt = (v: number) => (Math.abs(v) >= 10 ? Math.round(v).toLocaleString('en-GB') : v.toPrecision(3));

/** Every equilibrium of positive biomass at control value `at`, in increasing B, with its stability. */
export function equilibriaAtControl(m: ProductionModel, p: SurplusParams, control: Control, at: number): EquilibriumPoint[] {
  const top = unfishedEquilibrium(m, p);
  if (!(top > 0)) return [];
  const { u, du } = controlCurve(m, p, control);
  const eps = 1e-9 * top;
  const edges = [eps, ...criticalPoints(du, eps, top * (1 - 1e-12)), top];
  const out: EquilibriumPoint[] = [];
  for (let i = 1; i < edges.length; i++) {
    const lo = edges[i - 1]!, hi = edges[i]!;
    const f = (B: number) => u(B) - at;
    if (Math.sign(f(lo)) !== Math.sign(f(hi)) || f(hi) === 0) {
      const B = bisect(f, lo, hi);
      if (!out.some((e) => Math.abs(e.B - B) < 1e-12 * top)) out.push({ B, stable: du((lo + hi) / 2) < 0 });
    }
  }
  if (at === 0 && !out.some((e) => e.B === top)) out.push({ B: top, stable: true });
  return out.sort((a, b) => a.B - b.B);
}

export interface StateAtControl {
  /** The stable equilibrium the stock settles to from above (the upper state), or null past the collapse point. */
  stable: number | null;
  /** The unstable threshold just below it: a stock pushed below it falls to the lower state or collapses. 0 when the only equilibrium below is extinction. */
  threshold: number | null;
  /** −d(g − removal)/dB at the stable state: how fast a small disturbance decays (per year); 0 at a fold. */
  returnRate: number;
}

/** Upper stable state, threshold below it and return rate at one control value. */
export function stateAtControl(m: ProductionModel, p: SurplusParams, control: Control, at: number): StateAtControl {
  const eq = equilibriaAtControl(m, p, control, at);
  const stables = eq.filter((e) => e.stable);
  const upper = stables[stables.length - 1];
  if (!upper) return { stable: null, threshold: null, returnRate: 0 };
  const below = eq.filter((e) => e.B < upper.B && !e.stable);
  const threshold = below.length ? below[below.length - 1]!.B : 0;
  const slope = m.dg(p, upper.B) - (control === 'F' ? at : 0);
  return { stable: upper.B, threshold, returnRate: Math.max(0, -slope) };
}
