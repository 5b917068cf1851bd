/** Principal branch W₀ of the Lambert W function (w·e^w = x), by Halley's iteration. */

const BRANCH = -1 / Math.E;

/** W₀(x) for x ≥ −1/e, to full double precision (Corless et al. 1996, Adv. Comput. Math. 5:329). */
export function lambertW0(x: number): number {
  if (!Number.isFinite(x) && x > 0) return Infinity;
  if (Number.isNaN(x) || x < BRANCH) throw new RangeError(`Lambert W₀ is defined for x ≥ −1/e, not ${x}`);
  if (x === 0) return 0;
  if (x === BRANCH) return -1;
  // starting values: branch-point series near −1/e, log asymptotics for large x, else log1p
  let w: number;
  if (x < -0.25) {
    const p = Math.sqrt(2 * (Math.E * x + 1));
    w = -1 + p - p * p / 3 + (11 / 72) * p * p * p;
  } else if (x > 3) {
    const l1 = Math.log(x);
    const l2 = Math.log(l1);
    w = l1 - l2 + l2 / l1;
  } else w = Math.log1p(x) * 0.8;
  for (let i = 0; i < 50; i++) {
    const ew = Math.exp(w);
    const f = w * ew - x;
    const wp1 = w + 1;
    if (wp1 === 0) break;
    const step = f / (ew * wp1 - ((w + 2) * f) / (2 * wp1));
    w -= step;
    if (Math.abs(step) <= 1e-15 * (1 + Math.abs(w))) break;
  }
  return w;
}
