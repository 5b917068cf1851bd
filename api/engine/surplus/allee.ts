/**
 * Critical depensation (strong Allee effect): g(B) = rB(B/A − 1)(1 − B/K), 0 < A < K (Lewis & Kareiva
 * 1993, Theor. Popul. Biol. 43:141; Courchamp, Berec & Gascoigne 2008, Allee Effects in Ecology and
 * Conservation). Below A the stock declines even unfished. The fit estimates α = A/K.
 */
import type { ProductionModel } from './production-model';

export const allee: ProductionModel = {
  name: 'allee',
  shape: [{
    name: 'A', label: 'A/K', lo: 0.005, hi: 0.6, log: true, starts: [0.05, 0.2],
    toNatural: (rel, _r, K) => rel * K, toRelative: (A, _r, K) => A / K,
  }],
  // why: with a small A the growth scales as r/A, so r itself can be far below the usual range
  rBounds: [1e-5, 3],
  depensation: true,
  stepper: 'rk4',
  g: ({ r, K, A = 0 }, B) => (B <= 0 ? 0 : r * B * (B / A - 1) * (1 - B / K)),
  // d/dB of (r/(AK))·B(B − A)(K − B) = (r/(AK))·(−3B² + 2(A + K)B − AK)
  perCapitaAtZero: ({ r }) => -r,
  dg: ({ r, K, A = 0 }, B) => (r / (A * K)) * (-3 * B * B + 2 * (A + K) * B - A * K),
};
