/** Fox (1970) Trans. Am. Fish. Soc. 99:80 in the rB·ln(K/B) form: B_MSY = K/e, MSY = rK/e, F_MSY = r. */
import type { ProductionModel } from './production-model';

export const fox: ProductionModel = {
  name: 'fox',
  shape: [],
  depensation: false,
  stepper: 'taylor',
  // r·ln K·B − r·B·ln B
  taylor: ({ r, K }) => ({ a: r * Math.log(K), b: r, q: 1, nonlinearity: 'log' }),
  g: ({ r, K }, B) => (B <= 0 ? 0 : r * B * Math.log(K / B)),
  perCapitaAtZero: () => Infinity,
  dg: ({ r, K }, B) => r * (Math.log(K / Math.max(B, 1e-300)) - 1),
  reference: ({ r, K }) => ({ msy: (r * K) / Math.E, bMsy: K / Math.E, fMsy: r }),
};
