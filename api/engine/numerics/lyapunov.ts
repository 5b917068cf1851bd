/**
 * Lyapunov spectrum of a flow by the method of Benettin, Galgani, Giorgilli & Strelcyn (1980,
 * Meccanica 15:9): the state and n tangent vectors are integrated together (variational equations
 * dQ/dt = J(y)·Q, with odex), and every `interval` time units the tangent vectors are
 * re-orthonormalised by a QR factorisation (modified Gram-Schmidt); the exponents are the time
 * averages of ln R_ii. Shimada & Nagashima (1979), Prog. Theor. Phys. 61:1605.
 */
import { integrate, type Rhs } from './ode';

export interface LyapunovOptions {
  /** Time discarded before averaging, to settle on the attractor (default 100). */
  transient?: number;
  /** Averaging time (default 1000). */
  time?: number;
  /** Time between re-orthonormalisations (default 1). */
  interval?: number;
  /** ODE tolerance (default 1e-9). */
  tol?: number;
  /** Called with the fraction done, now and then. */
  onProgress?: (fraction: number) => void;
}

export interface LyapunovResult {
  /** Exponents, largest first, per unit of the system's time. */
  exponents: number[];
  /** State at the end (on the attractor). */
  state: number[];
  time: number;
}

/** Modified Gram-Schmidt on the columns of Q (n×n, as an array of columns); returns the diagonal of R. */
export function orthonormalise(cols: number[][]): number[] {
  const n = cols.length;
  const diag: number[] = [];
  for (let j = 0; j < n; j++) {
    const v = cols[j]!;
    for (let i = 0; i < j; i++) {
      const u = cols[i]!;
      let dot = 0;
      for (let k = 0; k < v.length; k++) dot += u[k]! * v[k]!;
      for (let k = 0; k < v.length; k++) v[k]! -= dot * u[k]!;
    }
    const norm = Math.hypot(...v);
    diag.push(norm);
    for (let k = 0; k < v.length; k++) v[k]! /= norm;
  }
  return diag;
}

/** The full Lyapunov spectrum of y' = f(y) with Jacobian J(y), from the state y0. */
export function lyapunovSpectrum(f: Rhs, jac: (y: number[]) => number[][], y0: number[], opts: LyapunovOptions = {}): LyapunovResult {
  const n = y0.length;
  const tol = opts.tol ?? 1e-9;
  const transient = opts.transient ?? 100;
  const time = opts.time ?? 1000;
  const tau = opts.interval ?? 1;
  let y = y0.slice();
  if (transient > 0) y = integrate(f, 0, y, transient, { tol, maxSteps: 1_000_000 }).y;
  // augmented state: y, then the n tangent vectors one after the other
  const aug: Rhs = (t, z) => {
    const s = z.slice(0, n);
    const J = jac(s);
    const out = f(t, s);
    for (let c = 0; c < n; c++) {
      for (let i = 0; i < n; i++) {
        let v = 0;
        for (let k = 0; k < n; k++) v += J[i]![k]! * z[n + c * n + k]!;
        out.push(v);
      }
    }
    return out;
  };
  let cols: number[][] = Array.from({ length: n }, (_, c) => Array.from({ length: n }, (_, k) => (k === c ? 1 : 0)));
  const sums = new Array<number>(n).fill(0);
  const steps = Math.round(time / tau);
  for (let s = 0; s < steps; s++) {
    const z = integrate(aug, 0, [...y, ...cols.flat()], tau, { tol, maxSteps: 100_000 }).y;
    y = z.slice(0, n);
    cols = Array.from({ length: n }, (_, c) => z.slice(n + c * n, n + (c + 1) * n));
    const d = orthonormalise(cols);
    for (let i = 0; i < n; i++) sums[i]! += Math.log(d[i]!);
    if (opts.onProgress && s % 50 === 0) opts.onProgress(s / steps);
  }
  const total = steps * tau;
  return { exponents: sums.map((v) => v / total).sort((a, b) => b - a), state: y, time: total };
}
