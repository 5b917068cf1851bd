/**
 * Pella & Tomlinson (1969) Bull. IATTC 13:419 in the (r/p)·B·(1 − (B/K)^p) form: B_MSY = K(1+p)^(−1/p),
 * MSY = rK(1+p)^(−(1+p)/p), F_MSY = r/(1+p); p = 1 is Schaefer.
 */
import type { ProductionModel } from './production-model';

export const pellaTomlinson: ProductionModel = {
  name: 'pella-tomlinson',
  shape: [{
    name: 'p', label: 'p', lo: 0.05, hi: 5, log: true, starts: [1],
    toNatural: (v) => v, toRelative: (v) => v,
  }],
  depensation: false,
  stepper: 'taylor',
  // (r/p)·B − (r/p)·K^(−p)·B^(1+p)
  taylor: ({ r, K, p = 1 }) => ({ a: r / p, b: (r / p) * Math.pow(K, -p), q: 1 + p, nonlinearity: 'power' }),
  g: ({ r, K, p = 1 }, B) => (B <= 0 ? 0 : (r / p) * B * (1 - Math.pow(B / K, p))),
  perCapitaAtZero: ({ r, p = 1 }) => r / p,
  dg: ({ r, K, p = 1 }, B) => (r / p) * (1 - (1 + p) * Math.pow(Math.max(B, 1e-300) / K, p)),
  reference: ({ r, K, p = 1 }) => ({ msy: r * K * Math.pow(1 + p, -(1 + p) / p), bMsy: K * Math.pow(1 + p, -1 / p), fMsy: r / (1 + p) }),
};
