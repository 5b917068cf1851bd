/** Schaefer (1954) Bull. IATTC 1:27: g(B) = rB(1 − B/K); MSY = rK/4 at B_MSY = K/2, F_MSY = r/2. */
import type { ProductionModel } from './production-model';

export const schaefer: ProductionModel = {
  name: 'schaefer',
  shape: [],
  depensation: false,
  stepper: 'logistic',
  g: ({ r, K }, B) => (B <= 0 ? 0 : r * B * (1 - B / K)),
  perCapitaAtZero: ({ r }) => r,
  dg: ({ r, K }, B) => r * (1 - (2 * Math.max(B, 0)) / K),
  reference: ({ r, K }) => ({ msy: (r * K) / 4, bMsy: K / 2, fMsy: r / 2 }),
};
