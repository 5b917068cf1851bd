/**
 * One year of a Pella-Tomlinson or Fox stock under a constant catch, by a high-order Taylor series
 * (the Taylor method with coefficients from automatic-differentiation recurrences: Moore 1966;
 * Jorba & Zou 2005, Experimental Mathematics 14). One exp/log per step instead of one per stage
 * and far longer steps than a Runge-Kutta pair, so these fits cost about what a Schaefer fit costs.
 * odex stays the reference: surplus-fast.spec.ts holds this path to it at 1e-8.
 *
 *   Pella-Tomlinson  y' = a·y − b·y^q − C,   a = r/p, b = a·K^(−p), q = 1 + p
 *   Fox              y' = r·L·y − r·y·ln y − C,   L = ln K
 */

/** Series order: high enough that one or two steps cover a year for the rates the fits explore. */
const ORDER = 18;
const y = new Float64Array(ORDER + 2);
const u = new Float64Array(ORDER + 2);

export interface YearStep {
  B: number;
  collapsed: boolean;
  steps: number;
}

/** Fills y[0..ORDER] with the Taylor coefficients of the solution through y0; `kind` picks the model. */
function coefficients(fox: boolean, a: number, b: number, q: number, C: number, y0: number): void {
  y[0] = y0;
  u[0] = fox ? Math.log(y0) : Math.exp(q * Math.log(y0)); // ln y (Fox) or y^q (Pella-Tomlinson)
  const inv = 1 / y0;
  for (let k = 0; k < ORDER; k++) {
    if (k > 0) {
      let s = 0;
      if (fox) {
        // (ln y)' = y'/y  ⇒  u_k = (y_k − (1/k)·Σ_{j=1}^{k−1} j·u_j·y_{k−j}) / y_0
        for (let j = 1; j < k; j++) s += j * u[j]! * y[k - j]!;
        u[k] = (y[k]! - s / k) * inv;
      } else {
        // (y^q)' = q·y^q·y'/y  ⇒  u_k = Σ_{j=0}^{k−1} (q(k−j) − j)·y_{k−j}·u_j / (k·y_0)
        for (let j = 0; j < k; j++) s += (q * (k - j) - j) * y[k - j]! * u[j]!;
        u[k] = (s * inv) / k;
      }
    }
    let next: number;
    if (fox) {
      let w = 0; // (y·ln y)_k
      for (let j = 0; j <= k; j++) w += y[j]! * u[k - j]!;
      next = a * y[k]! - b * w;
    } else {
      next = a * y[k]! - b * u[k]!;
    }
    if (k === 0) next -= C;
    y[k + 1] = next / (k + 1);
  }
}

/**
 * Advances y' = g(y) − C over one year. `fox` selects the model; for Pella-Tomlinson pass a, b, q,
 * for Fox pass a = r·ln K, b = r. A path that reaches zero is a collapse (B = 0), as in odex's path.
 */
export function taylorYear(fox: boolean, a: number, b: number, q: number, C: number, B0: number, tol = 1e-12): YearStep {
  let t = 0;
  let B = B0;
  let steps = 0;
  while (t < 1) {
    if (B <= 0) return { B: 0, collapsed: true, steps };
    coefficients(fox, a, b, q, C, B);
    // step from the decay of the last two coefficients (Jorba & Zou 2005, §3.2): the truncated tail stays below tol·B
    const scale = tol * Math.max(B, 1e-300);
    const e1 = Math.abs(y[ORDER - 1]!), e2 = Math.abs(y[ORDER]!);
    const h1 = e1 > 0 ? Math.pow(scale / e1, 1 / (ORDER - 1)) : Infinity;
    const h2 = e2 > 0 ? Math.pow(scale / e2, 1 / ORDER) : Infinity;
    let h = Math.min(h1, h2, 1 - t);
    if (!(h > 1e-9)) h = 1e-9;
    // Horner on the series
    let next = y[ORDER]!;
    for (let k = ORDER - 1; k >= 0; k--) next = next * h + y[k]!;
    if (!Number.isFinite(next)) throw new Error(`Taylor step failed at t=${t} (non-finite state)`);
    if (++steps > 10_000) throw new Error(`Taylor step failed at t=${t} (steps exceeded)`);
    t += h;
    B = next;
    if (B <= 0) return { B: 0, collapsed: true, steps };
  }
  return { B, collapsed: false, steps };
}
