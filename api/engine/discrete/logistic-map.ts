/**
 * The logistic map x' = a·x(1 − x) (May 1976, Nature 261:459), stock as a fraction of the largest
 * stock the habitat can hold. Recruitment is zero for S ≥ 1 (the stock is wiped out).
 */
import type { DiscreteModel, DiscreteParams } from './stock-recruit';

export const logisticMap: DiscreteModel = {
  name: 'logistic-map',
  label: 'logistic map',
  params: [{ name: 'a', label: 'growth factor a', lower: 1e-6, upper: 4 }],
  productivity: 'a',
  scale: '',
  recruits: (S, { a }) => (S <= 0 || S >= 1 ? 0 : a! * S * (1 - S)),
  slope: (S, { a }) => a! * (1 - 2 * S),
  reference(p: DiscreteParams) {
    const a = p['a']!;
    const sMsy = a > 1 ? (a - 1) / (2 * a) : 0;
    const nMsy = a * sMsy * (1 - sMsy);
    return { sMsy, nMsy, msy: nMsy - sMsy, uMsy: nMsy > 0 ? 1 - sMsy / nMsy : 0, n0: Math.max(0, 1 - 1 / a), uCollapse: Math.max(0, 1 - 1 / a) };
  },
  start: () => ({ a: 2.5 }),
};
