/**
 * Ricker (1954) stock-recruitment: R = S·exp(r(1 − S/K)), i.e. R = S·e^(a − bS) with a = r, b = r/K.
 * Reference points are exact through the Lambert W function (Scheuerell 2016, PeerJ 4:e1623):
 * S_MSY = (1 − W(e^(1−a)))/b, u_MSY = 1 − W(e^(1−a)).
 */
import { lambertW0 } from '../numerics/lambert-w';
import type { DiscreteModel, DiscreteParams } from './stock-recruit';

export const ricker: DiscreteModel = {
  name: 'ricker',
  label: 'Ricker',
  params: [
    { name: 'r', label: 'productivity r (ln recruits per spawner at low stock)', lower: 1e-6, upper: 10 },
    { name: 'K', label: 'unfished equilibrium K', lower: 1e-9, upper: 1e15 },
  ],
  productivity: 'r',
  scale: 'K',
  recruits: (S, { r, K }) => (S <= 0 ? 0 : S * Math.exp(r! * (1 - S / K!))),
  slope: (S, { r, K }) => Math.exp(r! * (1 - S / K!)) * (1 - (r! * S) / K!),
  reference(p: DiscreteParams) {
    const { r, K } = p as { r: number; K: number };
    const b = r / K;
    const w = lambertW0(Math.exp(1 - r));
    const sMsy = (1 - w) / b;
    const nMsy = sMsy / w;
    return { sMsy, nMsy, msy: nMsy - sMsy, uMsy: 1 - w, n0: K, uCollapse: 1 - Math.exp(-r) };
  },
  start(S, R) {
    // ln(R/S) = a − bS: least squares line
    const y = S.map((s, i) => Math.log(R[i]! / s));
    const n = S.length;
    const ms = S.reduce((a, b) => a + b, 0) / n;
    const my = y.reduce((a, b) => a + b, 0) / n;
    let sxy = 0, sxx = 0;
    S.forEach((s, i) => { sxy += (s - ms) * (y[i]! - my); sxx += (s - ms) ** 2; });
    const b = sxx > 0 ? -sxy / sxx : 0;
    const a = my + b * ms;
    const r = Math.min(Math.max(a, 0.05), 8);
    const K = b > 0 ? r / b : 2 * Math.max(...S);
    return { r, K: Math.max(K, 1e-6) };
  },
};
