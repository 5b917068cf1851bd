/**
 * Predation-induced depensation: g(B) = rB(1 − B/K) − cB²/(a² + B²), a generalist predator with a
 * type III functional response (Ludwig, Jones & Holling 1978, J. Anim. Ecol. 47:315; May 1977,
 * Nature 269:471; Noy-Meir 1975, J. Ecol. 63:459). For some parameters two stable states, two folds
 * and a hysteresis loop. The fit estimates γ = c/(rK) and β = a/K, so the shape is scale-free.
 */
import type { ProductionModel } from './production-model';

export const predation: ProductionModel = {
  name: 'predation',
  shape: [
    {
      name: 'c', label: 'c/(rK)', lo: 1e-3, hi: 0.5, log: true, starts: [0.02, 0.08],
      toNatural: (rel, r, K) => rel * r * K, toRelative: (c, r, K) => c / (r * K),
    },
    {
      name: 'a', label: 'a/K', lo: 0.005, hi: 1, log: true, starts: [0.05, 0.15],
      toNatural: (rel, _r, K) => rel * K, toRelative: (a, _r, K) => a / K,
    },
  ],
  depensation: true,
  stepper: 'rk4',
  g: ({ r, K, c = 0, a = 1 }, B) => (B <= 0 ? 0 : r * B * (1 - B / K) - (c * B * B) / (a * a + B * B)),
  // d/dB of cB²/(a² + B²) = 2ca²B/(a² + B²)²
  perCapitaAtZero: ({ r }) => r,
  dg: ({ r, K, c = 0, a = 1 }, B) => r * (1 - (2 * B) / K) - (2 * c * a * a * B) / (a * a + B * B) ** 2,
};
