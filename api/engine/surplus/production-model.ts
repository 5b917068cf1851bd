/**
 * What every surplus-production model provides: its production g(B) and slope, its shape parameters
 * beyond r and K (bounds and start values for fitting), and where known its reference points in
 * closed form. `registry.ts` is the one place a model is listed.
 */

export interface SurplusParams {
  r: number;
  K: number;
  /** Pella-Tomlinson shape p (1 = Schaefer). */
  p?: number;
  /** Allee threshold A (critical depensation), in biomass units. */
  A?: number;
  /** Predation: largest removal by the generalist predator c, and its half-saturation biomass a. */
  c?: number;
  a?: number;
}

export interface ReferencePoints {
  msy: number;
  bMsy: number;
  fMsy: number;
}

/** A shape parameter as the fit sees it: a scale-free value (relative to K or r·K), bounded. */
export interface ShapeParam {
  /** Name in SurplusParams. */
  name: 'p' | 'A' | 'c' | 'a';
  /** Name shown to the assessor. */
  label: string;
  lo: number;
  hi: number;
  log: boolean;
  /** Start values tried on the grid of starts. */
  starts: number[];
  /** Scale-free value → natural value for given r and K (e.g. A = α·K). */
  toNatural(rel: number, r: number, K: number): number;
  /** Natural value → scale-free value. */
  toRelative(value: number, r: number, K: number): number;
}

export interface ProductionModel {
  name: string;
  /** Shape parameters the fit estimates (beyond r, K and B0/K). */
  shape: ShapeParam[];
  /** Bounds of r for the fit when they differ from the common 0.005–3 (e.g. where r multiplies a large factor). */
  rBounds?: [number, number];
  /** Whether the production curve can be depensatory (per-capita growth rising with biomass somewhere). */
  depensation: boolean;
  /**
   * Stepping of the annual path: the exact logistic solution, odex, fixed-step RK4, or a Taylor
   * series (surplus-taylor.ts; needs `taylor`). The fast ones are held to odex in the specs.
   */
  stepper: 'logistic' | 'odex' | 'rk4' | 'taylor';
  /** g(B) = a·B − b·N(B) with N(B) = B^q ('power') or B·ln B ('log'): the form the Taylor stepper expands. */
  taylor?(p: SurplusParams): { a: number; b: number; q: number; nonlinearity: 'power' | 'log' };
  g(p: SurplusParams, B: number): number;
  dg(p: SurplusParams, B: number): number;
  /** lim g(B)/B as B → 0: the F at which extinction exchanges stability (Infinity when never). */
  perCapitaAtZero(p: SurplusParams): number;
  /** MSY, B_MSY, F_MSY in closed form, where a published form exists. */
  reference?(p: SurplusParams): ReferencePoints;
}
