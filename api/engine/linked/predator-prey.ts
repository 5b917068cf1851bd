/**
 * Predator-prey models with harvest of either or both species:
 * Lotka-Volterra with logistic prey  dN = aN(1 − N/K) − bNP − H_N,  dP = −cP + dNP − H_P   (Volterra 1926)
 * Rosenzweig-MacArthur               dN = rN(1 − N/K) − aNP/(1 + ahN) − H_N,  dP = e·aNP/(1 + ahN) − mP − H_P
 * (Rosenzweig & MacArthur 1963, Am. Nat. 97:209). Harvest is a constant catch and/or a rate F·N.
 */
import { continueBranch, type Branch } from '../numerics/continuation';
import { eigenvalues, type Eigen } from '../numerics/linear';
import { integrate } from '../numerics/ode';

export type PredatorPreyModelName = 'lotka-volterra' | 'rosenzweig-macarthur';

export interface LvParams { a: number; b: number; c: number; d: number; K: number }
export interface RmParams { r: number; K: number; a: number; h: number; e: number; m: number }

export interface Harvest {
  preyCatch?: number;
  predatorCatch?: number;
  preyRate?: number;
  predatorRate?: number;
}

export type PredatorPreySpec =
  | { model: 'lotka-volterra'; params: LvParams }
  | { model: 'rosenzweig-macarthur'; params: RmParams };

/** Right-hand side [dN/dt, dP/dt]; populations at or below zero contribute no growth or harvest. */
export function predatorPreyRhs(spec: PredatorPreySpec, harvest: Harvest = {}): (t: number, y: number[]) => number[] {
  const hn = harvest.preyCatch ?? 0, hp = harvest.predatorCatch ?? 0;
  const fn = harvest.preyRate ?? 0, fp = harvest.predatorRate ?? 0;
  if (spec.model === 'lotka-volterra') {
    const { a, b, c, d, K } = spec.params;
    return (_t, [N, P]) => {
      const n = Math.max(N!, 0), p = Math.max(P!, 0);
      return [a * n * (1 - n / K) - b * n * p - fn * n - (n > 0 ? hn : 0), -c * p + d * n * p - fp * p - (p > 0 ? hp : 0)];
    };
  }
  const { r, K, a, h, e, m } = spec.params;
  return (_t, [N, P]) => {
    const n = Math.max(N!, 0), p = Math.max(P!, 0);
    const eat = (a * n * p) / (1 + a * h * n);
    return [r * n * (1 - n / K) - eat - fn * n - (n > 0 ? hn : 0), e * eat - m * p - fp * p - (p > 0 ? hp : 0)];
  };
}

/** Interior equilibrium without catch (rates allowed). LV: N = (c + F_P)/d, P = (a(1 − N/K) − F_N)/b; RM as in Rosenzweig (1971). */
export function interiorEquilibrium(spec: PredatorPreySpec, harvest: Harvest = {}): [number, number] {
  const fn = harvest.preyRate ?? 0, fp = harvest.predatorRate ?? 0;
  if (spec.model === 'lotka-volterra') {
    const { a, b, c, d, K } = spec.params;
    const N = (c + fp) / d;
    return [N, (a * (1 - N / K) - fn) / b];
  }
  const { r, K, a, h, e, m } = spec.params;
  const mm = m + fp;
  const N = mm / (a * (e - mm * h));
  return [N, ((r * (1 - N / K) - fn) * (1 + a * h * N)) / a];
}

/** Jacobian of the right-hand side at (N, P), by central differences. */
export function jacobianAt(spec: PredatorPreySpec, harvest: Harvest, N: number, P: number): number[][] {
  const f = predatorPreyRhs(spec, harvest);
  const J = [[0, 0], [0, 0]];
  const y = [N, P];
  for (let k = 0; k < 2; k++) {
    const s = 1e-6 * Math.max(1, Math.abs(y[k]!));
    const a = y.slice(); const b = y.slice();
    a[k]! += s; b[k]! -= s;
    const fa = f(0, a), fb = f(0, b);
    J[0]![k] = (fa[0]! - fb[0]!) / (2 * s);
    J[1]![k] = (fa[1]! - fb[1]!) / (2 * s);
  }
  return J;
}

/** Eigenvalues of the equilibrium, its stability and return rate. */
export function equilibriumStability(spec: PredatorPreySpec, harvest: Harvest, N: number, P: number): { eigen: Eigen; stable: boolean; returnRate: number } {
  const eigen = eigenvalues(jacobianAt(spec, harvest, N, P));
  const maxRe = Math.max(...eigen.re);
  return { eigen, stable: maxRe < 0, returnRate: -maxRe };
}

/** Hopf threshold of Rosenzweig-MacArthur without harvest: K_crit = 2N* + 1/(ah); stable for K < K_crit. */
export function rmHopfK(p: RmParams): number {
  const N = p.m / (p.a * (p.e - p.m * p.h));
  return 2 * N + 1 / (p.a * p.h);
}

/** Equilibrium branch as the catch of one species rises from its present value: folds, Hopf points, extinction. */
export function harvestBifurcations(spec: PredatorPreySpec, base: Harvest, vary: 'preyCatch' | 'predatorCatch', start: [number, number], hMax: number): Branch {
  const sys = {
    n: 2,
    F: ([N, P]: number[], h: number) => predatorPreyRhs(spec, { ...base, [vary]: h })(0, [N!, P!]),
    scale: [Math.max(start[0], 1e-9), Math.max(start[1], 1e-9), Math.max(hMax, 1e-9)],
  };
  return continueBranch(sys, start, base[vary] ?? 0, { ds: 0.01, hMin: -1e-9, hMax, maxSteps: 4000 });
}

/** Start-of-year populations under annual catches of both species; a species reaching zero stays at zero. */
export function predatorPreyPath(spec: PredatorPreySpec, y0: [number, number], preyCatch: number[], predatorCatch: number[], tol = 1e-8) {
  const prey = [y0[0]], predator = [y0[1]];
  let y: number[] = [y0[0], y0[1]];
  let collapseYear: number | null = null;
  for (let i = 0; i < preyCatch.length; i++) {
    if (collapseYear !== null) { prey.push(0); predator.push(0); continue; }
    const res = integrate(predatorPreyRhs(spec, { preyCatch: preyCatch[i], predatorCatch: predatorCatch[i] }), 0, y, 1, { tol, stopAtZero: true });
    if (res.collapsed) collapseYear = i;
    y = res.collapsed ? [0, 0] : res.y;
    prey.push(y[0]!);
    predator.push(y[1]!);
  }
  return { prey, predator, collapseYear };
}
