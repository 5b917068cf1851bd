/**
 * A state-space likelihood for a surplus-production model: process error on log biomass and
 * observation error on the log survey index, integrated over the unobserved biomass by an extended
 * Kalman filter (Harvey 1989, Forecasting, Structural Time Series Models and the Kalman Filter, §3.7;
 * for stock assessment, Meyer & Millar 1999, CJFAS 56:1078, and Pedersen & Berg 2017, Fish Fish.
 * 18:226, in a Bayesian and a Laplace form). State x_t = ln B_t:
 *   x_{t+1} = ln S(B_t, C_t) − σ_p²/2 + η_t,  η_t ~ N(0, σ_p²);   ln I_t = ln q + x_t + ε_t,  ε_t ~ N(0, σ_o²).
 * The negative log-likelihood includes Σ ln I_t, so it is on the same footing as the
 * observation-error likelihood and the two compare by AIC.
 */

export interface StateSpaceInput {
  /** One year's deterministic step S(B, C): biomass a year later, or null when the stock collapses. */
  step(B: number, C: number): number | null;
  catches: number[];
  /** The survey index per year (null where not observed). */
  index: (number | null)[];
  B0: number;
  q: number;
  sdProc: number;
  sdObs: number;
}

export interface StateSpaceResult {
  nll: number;
  /** Filtered biomass e^{x̂_t|t} at the start of each year. */
  filtered: number[];
}

/** The filter's negative log-likelihood; Infinity when a predicted stock collapses. */
export function stateSpaceNll(s: StateSpaceInput): StateSpaceResult {
  let x = Math.log(s.B0);
  let P = 0;
  let nll = 0;
  const lnq = Math.log(s.q);
  const vo = s.sdObs ** 2, vp = s.sdProc ** 2;
  const filtered: number[] = [];
  for (let t = 0; t <= s.catches.length; t++) {
    const I = s.index[t];
    if (I !== null && I !== undefined && t < s.index.length) {
      const y = Math.log(I);
      const v = y - lnq - x;
      const F = P + vo;
      nll += 0.5 * (Math.log(2 * Math.PI * F) + (v * v) / F) + y;
      const gain = P / F;
      x += gain * v;
      P *= 1 - gain;
    }
    filtered.push(Math.exp(x));
    if (t === s.catches.length) break;
    const B = Math.exp(x);
    const S = s.step(B, s.catches[t]!);
    if (S === null || !(S > 0)) return { nll: Infinity, filtered };
    const h = 1e-5;
    const up = s.step(B * (1 + h), s.catches[t]!), down = s.step(B * (1 - h), s.catches[t]!);
    // d ln S / d ln B by central differences (a one-sided difference where the lower step collapses)
    const a = up !== null && down !== null && down > 0 ? (Math.log(up) - Math.log(down)) / (2 * h) : up !== null ? (Math.log(up) - Math.log(S)) / h : 1;
    x = Math.log(S) - vp / 2;
    P = a * a * P + vp;
  }
  return { nll, filtered };
}
