/**
 * Beverton-Holt (1957) stock-recruitment: R = R₀·S/(1 + (R₀ − 1)S/K), R₀ > 1 recruits per spawner
 * at low stock, K the unfished equilibrium. The map is increasing and saturating, so it never cycles.
 * Under a harvest rate before spawning: S_MSY = (√R₀ − 1)/β with β = (R₀ − 1)/K, u_MSY = 1 − 1/√R₀
 * (from f'(S) = 1; Quinn & Deriso 1999, §3.1).
 */
import type { DiscreteModel, DiscreteParams } from './stock-recruit';

export const bevertonHolt: DiscreteModel = {
  name: 'beverton-holt',
  label: 'Beverton-Holt',
  params: [
    { name: 'R', label: 'recruits per spawner at low stock R₀', lower: 1.000001, upper: 1e4 },
    { name: 'K', label: 'unfished equilibrium K', lower: 1e-9, upper: 1e15 },
  ],
  productivity: 'R',
  scale: 'K',
  recruits: (S, { R, K }) => (S <= 0 ? 0 : (R! * S) / (1 + ((R! - 1) * S) / K!)),
  slope: (S, { R, K }) => R! / (1 + ((R! - 1) * S) / K!) ** 2,
  reference(p: DiscreteParams) {
    const { R, K } = p as { R: number; K: number };
    const beta = (R - 1) / K;
    const sMsy = (Math.sqrt(R) - 1) / beta;
    const nMsy = (R * sMsy) / (1 + beta * sMsy);
    return { sMsy, nMsy, msy: nMsy - sMsy, uMsy: 1 - 1 / Math.sqrt(R), n0: K, uCollapse: 1 - 1 / R };
  },
  start(S, R) {
    const ratio = S.map((s, i) => R[i]! / s).sort((a, b) => b - a);
    const R0 = Math.max(1.5, ratio[Math.floor(ratio.length / 4)]!);
    return { R: R0, K: Math.max(...R) };
  },
};
