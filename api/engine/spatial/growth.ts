/**
 * Local growth terms of the spatial model (per unit area): logistic (Verhulst; Fisher 1937) and the
 * strong Allee effect g(u) = r·u·(u/A − 1)(1 − u/K) (Lewis & Kareiva 1993), with their derivatives.
 */

export interface SpatialParams {
  /** Intrinsic growth rate (1/yr). */
  r: number;
  /** Carrying capacity (density, t/km² on a grid, t/km on a coast). */
  K: number;
  /** Diffusion coefficient (km²/yr). */
  D: number;
  /** Allee threshold (density), for the depensation model. */
  A?: number;
}

export interface Growth {
  name: SpatialGrowthName;
  label: string;
  g(u: number, p: SpatialParams): number;
  dg(u: number, p: SpatialParams): number;
  /** Pulled fronts: spreading and persistence follow the linearisation at zero (KPP type). */
  linearDetermined: boolean;
}

export type SpatialGrowthName = 'logistic' | 'allee';

export const GROWTH: Record<SpatialGrowthName, Growth> = {
  logistic: {
    name: 'logistic', label: 'logistic', linearDetermined: true,
    g: (u, { r, K }) => r * u * (1 - u / K),
    dg: (u, { r, K }) => r * (1 - (2 * u) / K),
  },
  allee: {
    name: 'allee', label: 'strong Allee effect', linearDetermined: false,
    g: (u, { r, K, A }) => r * u * (u / A! - 1) * (1 - u / K),
    dg: (u, { r, K, A }) => r * ((2 * u) / A! - 1 - (3 * u * u) / (A! * K) + (2 * u) / K),
  },
};
