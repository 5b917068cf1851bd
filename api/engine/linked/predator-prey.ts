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

/** Jacobian of the right-hand side at (N, P) (analytic; a constant catch does not enter it). */
export function jacobianAt(spec: PredatorPreySpec, harvest: Harvest, N: number, P: number): number[][] {
  const fn = harvest.preyRate ?? 0, fp = harvest.predatorRate ?? 0;
  if (spec.model === 'lotka-volterra') {
    const { a, b, c, d, K } = spec.params;
    return [[a * (1 - (2 * N) / K) - b * P - fn, -b * N], [d * P, -c + d * N - fp]];
  }
  const { r, K, a, h, e, m } = spec.params;
  const den = 1 + a * h * N;
  return [[r * (1 - (2 * N) / K) - (a * P) / (den * den) - fn, -(a * N) / den], [(e * a * P) / (den * den), (e * a * N) / den - m - fp]];
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

/**
 * Start-of-year populations under annual catches of both species. A species that reaches zero stays
 * at zero; the other goes on with its own dynamics (a prey without predators grows logistically).
 * `collapseYear` is the first year in which either species reached zero (null when neither did).
 */
export function predatorPreyPath(spec: PredatorPreySpec, y0: [number, number], preyCatch: number[], predatorCatch: number[], tol = 1e-8) {
  const prey = [y0[0]], predator = [y0[1]];
  let y: number[] = [Math.max(y0[0], 0), Math.max(y0[1], 0)];
  let collapseYear: number | null = y[0] === 0 || y[1] === 0 ? 0 : null;
  const extinct: [number | null, number | null] = [y[0] === 0 ? 0 : null, y[1] === 0 ? 0 : null];
  for (let i = 0; i < preyCatch.length; i++) {
    y = yearStep(spec, y, preyCatch[i]!, predatorCatch[i]!, tol);
    for (const k of [0, 1] as const) if (y[k] === 0 && extinct[k] === null) extinct[k] = i;
    if (collapseYear === null && (y[0] === 0 || y[1] === 0)) collapseYear = i;
    prey.push(y[0]!);
    predator.push(y[1]!);
  }
  return { prey, predator, collapseYear, preyExtinctYear: extinct[0], predatorExtinctYear: extinct[1] };
}

/** One year under constant catches; a species reaching zero is held at zero for the rest of the year. */
export function yearStep(spec: PredatorPreySpec, y0: number[], preyCatch: number, predatorCatch: number, tol = 1e-8): number[] {
  const f = predatorPreyRhs(spec, { preyCatch, predatorCatch });
  const y = y0.map((v) => Math.max(v, 0));
  let t = 0;
  while (t < 1) {
    const alive = [0, 1].filter((k) => y[k]! > 0);
    if (alive.length === 0) break;
    // integrate the living species only: a dead one contributes neither growth, food nor catch
    const full = (z: number[]) => { const w = [0, 0]; alive.forEach((k, i) => { w[k] = z[i]!; }); return w; };
    const g = (tt: number, z: number[]) => { const d = f(tt, full(z)); return alive.map((k) => d[k]!); };
    const res = integrate(g, t, alive.map((k) => y[k]!), 1, { tol, stopAtZero: true, initialStep: Math.min(0.25, 1 - t) });
    alive.forEach((k, i) => { y[k] = res.y[i]! > 0 ? res.y[i]! : 0; });
    if (!res.collapsed) break;
    t = res.t;
  }
  return y;
}
