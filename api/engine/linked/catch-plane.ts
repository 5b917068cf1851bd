/**
 * The catch plane of a predator-prey model: constant prey catch H_N against constant predator catch
 * H_P. Curves where the stable equilibrium folds (det J = 0), turns into a limit cycle (Hopf:
 * tr J = 0 with det J > 0) or loses the predator (transcritical, on the H_N axis), found by
 * continuation in H_N at each H_P and refined by Newton's method on the extended systems
 * {F = 0, det J = 0} and {F = 0, tr J = 0} (Kuznetsov, Elements of Applied Bifurcation Theory, §10.2).
 * Margins of a proposed pair of catches: along each catch axis and along the ray from no catch.
 */
import { continueBranch, type Branch } from '../numerics/continuation';
import { det, solveLinear } from '../numerics/linear';
import { harvestBifurcations, interiorEquilibrium, jacobianAt, predatorPreyRhs, type PredatorPreySpec } from './predator-prey';

export type CurveKind = 'fold' | 'hopf' | 'transcritical';

export interface CatchPlanePoint { preyCatch: number; predatorCatch: number; prey: number; predator: number }

export interface CatchPlane {
  curves: { kind: CurveKind; points: CatchPlanePoint[] }[];
  /** The unharvested interior equilibrium is stable (false: the stock already cycles without catch). */
  stableAtZero: boolean;
  preyMax: number;
  predatorMax: number;
}

export interface Crossing {
  kind: CurveKind | 'none';
  /** Catch pair where the ray from (0, 0) through the proposal first meets a curve (null: none within 3× the proposal). */
  at: { preyCatch: number; predatorCatch: number } | null;
  /** Fraction of the proposal at which it is met (1 = at the proposal; below 1: the proposal lies beyond it). */
  rayFraction: number | null;
}

export interface PairMargins {
  crossing: Crossing;
  /** First curve met raising the prey catch at the proposed predator catch, and raising the predator catch at the proposed prey catch. */
  preyAxis: { kind: CurveKind | 'none'; at: number | null; margin: number | null };
  predatorAxis: { kind: CurveKind | 'none'; at: number | null; margin: number | null };
}

const kindOf = (k: 'fold' | 'hopf' | 'boundary'): CurveKind => (k === 'boundary' ? 'transcritical' : k);

/** Stable interior equilibrium at a pair of catches, found by following the catches up from zero along their ray. */
export function equilibriumAt(spec: PredatorPreySpec, preyCatch: number, predatorCatch: number): { x: [number, number]; crossing: Crossing } | null {
  const eq0 = interiorEquilibrium(spec);
  if (!(eq0[0] > 0 && eq0[1] > 0)) return null;
  const sys = {
    n: 2,
    F: ([N, P]: number[], s: number) => predatorPreyRhs(spec, { preyCatch: s * preyCatch, predatorCatch: s * predatorCatch })(0, [N!, P!]),
    scale: [eq0[0], eq0[1], 1],
  };
  const branch = continueBranch(sys, eq0, 0, { ds: 0.01, hMin: -1e-9, hMax: 3, maxSteps: 3000 });
  const first = branch.events[0];
  const crossing: Crossing = first
    ? { kind: kindOf(first.kind), at: { preyCatch: first.h * preyCatch, predatorCatch: first.h * predatorCatch }, rayFraction: first.h }
    : { kind: 'none', at: null, rayFraction: null };
  if (first && first.h <= 1) return { x: [NaN, NaN], crossing };
  const pts = branch.points;
  const i = pts.findIndex((p) => p.h >= 1);
  if (i <= 0) return { x: [NaN, NaN], crossing };
  const w = (1 - pts[i - 1]!.h) / (pts[i]!.h - pts[i - 1]!.h);
  const guess = [0, 1].map((k) => pts[i - 1]!.x[k]! + w * (pts[i]!.x[k]! - pts[i - 1]!.x[k]!));
  const x = newton2(spec, preyCatch, predatorCatch, guess);
  return { x: x ?? (guess as [number, number]), crossing };
}

function newton2(spec: PredatorPreySpec, hn: number, hp: number, guess: number[]): [number, number] | null {
  const f = predatorPreyRhs(spec, { preyCatch: hn, predatorCatch: hp });
  const y = guess.slice();
  for (let it = 0; it < 30; it++) {
    const F = f(0, y);
    const dy = solveLinear(jacobianAt(spec, {}, y[0]!, y[1]!), F.map((v) => -v));
    y[0]! += dy[0]!; y[1]! += dy[1]!;
    if (Math.abs(dy[0]!) < 1e-12 * Math.abs(y[0]!) && Math.abs(dy[1]!) < 1e-12 * Math.abs(y[1]!)) return [y[0]!, y[1]!];
  }
  return null;
}

/** Margins of a proposed pair: the ray crossing and the first curve along each catch axis. */
export function pairMargins(spec: PredatorPreySpec, preyCatch: number, predatorCatch: number, preyMax: number, predatorMax: number): PairMargins {
  const none = { kind: 'none' as const, at: null, margin: null };
  const atP = equilibriumAt(spec, 0, predatorCatch);
  const atN = equilibriumAt(spec, preyCatch, 0);
  const ray = equilibriumAt(spec, preyCatch, predatorCatch);
  const axis = (start: { x: [number, number]; crossing: Crossing } | null, base: { preyCatch?: number; predatorCatch?: number }, vary: 'preyCatch' | 'predatorCatch', proposed: number, max: number) => {
    if (!start) return none;
    // the other catch alone already lies beyond a curve: no catch of this species keeps the equilibrium
    if (!Number.isFinite(start.x[0])) return { kind: start.crossing.kind, at: 0, margin: -proposed };
    const b = harvestBifurcations(spec, base, vary, start.x, max);
    const e = b.events[0];
    return e ? { kind: kindOf(e.kind), at: e.h, margin: e.h - proposed } : none;
  };
  return {
    crossing: ray?.crossing ?? { kind: 'none', at: null, rayFraction: null },
    preyAxis: axis(atP, { predatorCatch }, 'preyCatch', preyCatch, Math.max(preyMax, 2 * preyCatch)),
    predatorAxis: axis(atN, { preyCatch }, 'predatorCatch', predatorCatch, Math.max(predatorMax, 2 * predatorCatch)),
  };
}

/** Newton on {F(N, P; H_N, H_P) = 0, test(J) = 0} for (N, P, H_N) at fixed H_P. */
function refine(spec: PredatorPreySpec, kind: 'fold' | 'hopf', hp: number, guess: { x: number[]; h: number }): CatchPlanePoint | null {
  const test = (J: number[][]) => (kind === 'fold' ? det(J) : J[0]![0]! + J[1]![1]!);
  const sc = [Math.abs(guess.x[0]!) || 1, Math.abs(guess.x[1]!) || 1, Math.abs(guess.h) || 1];
  const G = (z: number[]) => {
    const [N, P, H] = z.map((v, i) => v * sc[i]!) as [number, number, number];
    const F = predatorPreyRhs(spec, { preyCatch: H, predatorCatch: hp })(0, [N, P]);
    return [F[0]! / sc[0]!, F[1]! / sc[1]!, test(jacobianAt(spec, {}, N, P))];
  };
  const z = [1, 1, 1];
  for (let it = 0; it < 40; it++) {
    const g = G(z);
    const A = [0, 1, 2].map(() => [0, 0, 0]);
    for (let k = 0; k < 3; k++) {
      const step = 1e-7;
      const a = z.slice(); const b = z.slice();
      a[k]! += step; b[k]! -= step;
      const ga = G(a), gb = G(b);
      for (let i = 0; i < 3; i++) A[i]![k] = (ga[i]! - gb[i]!) / (2 * step);
    }
    let dz: number[];
    try { dz = solveLinear(A, g.map((v) => -v)); } catch { return null; }
    for (let k = 0; k < 3; k++) z[k]! += dz[k]!;
    if (!z.every(Number.isFinite)) return null;
    if (Math.max(...dz.map(Math.abs)) < 1e-13) break;
  }
  const [N, P, H] = z.map((v, i) => v * sc[i]!) as [number, number, number];
  if (!(N > 0 && P > 0 && H >= -1e-9)) return null;
  if (kind === 'hopf' && det(jacobianAt(spec, {}, N, P)) <= 0) return null;
  return { preyCatch: Math.max(H, 0), predatorCatch: hp, prey: N, predator: P };
}

/** Fold, Hopf and transcritical curves over [0, preyMax] × [0, predatorMax]. */
export function catchPlane(spec: PredatorPreySpec, preyMax: number, predatorMax: number, steps = 40): CatchPlane {
  const eq0 = interiorEquilibrium(spec);
  const curves: CatchPlane['curves'] = [{ kind: 'fold', points: [] }, { kind: 'hopf', points: [] }, { kind: 'transcritical', points: [] }];
  if (!(eq0[0] > 0 && eq0[1] > 0)) return { curves, stableAtZero: false, preyMax, predatorMax };
  const stableAtZero = (() => { const J = jacobianAt(spec, {}, eq0[0], eq0[1]); return J[0]![0]! + J[1]![1]! < 0 && det(J) > 0; })();
  const along: Branch = harvestBifurcations(spec, {}, 'predatorCatch', eq0, predatorMax);
  const stop = along.events.find((e) => e.kind !== 'hopf')?.h ?? Infinity;
  for (let j = 0; j <= steps; j++) {
    const hp = (predatorMax * j) / steps;
    if (hp >= stop) break;
    const pts = along.points;
    const i = pts.findIndex((p) => p.h >= hp);
    if (i < 0) break;
    const w = i === 0 ? 0 : (hp - pts[i - 1]!.h) / (pts[i]!.h - pts[i - 1]!.h);
    const guess = i === 0 ? pts[0]!.x : [0, 1].map((k) => pts[i - 1]!.x[k]! + w * (pts[i]!.x[k]! - pts[i - 1]!.x[k]!));
    const start = newton2(spec, 0, hp, guess);
    if (!start) continue;
    const b = harvestBifurcations(spec, { predatorCatch: hp }, 'preyCatch', start, preyMax);
    if (hp === 0) {
      // the branch ends where the predator reaches zero; there the clamped right-hand side stops the corrector
      const t = transcritical(spec, b.points[b.points.length - 1]!.x[0]!);
      if (t && t.preyCatch <= preyMax) curves[2]!.points.push(t);
    }
    const seen = new Set<string>();
    for (const e of b.events) {
      const kind = kindOf(e.kind);
      if (seen.has(kind)) continue;
      seen.add(kind);
      if (kind === 'transcritical') {
        continue;
      }
      const p = refine(spec, kind, hp, e);
      if (p) curves[kind === 'fold' ? 0 : 1]!.points.push(p);
    }
  }
  return { curves, stableAtZero, preyMax, predatorMax };
}

/** Predator loss at zero predator catch: the predator's growth rate at P = 0 vanishes (J₂₂ = 0), prey in balance with its catch. */
function transcritical(spec: PredatorPreySpec, guess: number): CatchPlanePoint | null {
  let N = guess;
  for (let it = 0; it < 50; it++) {
    const g = jacobianAt(spec, {}, N, 0)[1]![1]!;
    const s = 1e-6 * N;
    const d = (jacobianAt(spec, {}, N + s, 0)[1]![1]! - jacobianAt(spec, {}, N - s, 0)[1]![1]!) / (2 * s);
    const step = g / d;
    N -= step;
    if (!(N > 0)) return null;
    if (Math.abs(step) < 1e-13 * N) break;
  }
  return { preyCatch: predatorPreyRhs(spec)(0, [N, 0])[0]!, predatorCatch: 0, prey: N, predator: 0 };
}
