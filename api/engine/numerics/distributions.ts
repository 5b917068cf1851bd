/** Normal, beta and lognormal distribution functions (jStat), named for what the engine asks of them. */
import jstat from 'jstat';

const { jStat } = jstat;

/** Φ(z), the standard normal distribution function. */
export const normalCdf = (z: number): number => jStat.normal.cdf(z, 0, 1);

/** Φ⁻¹(p), the standard normal quantile. */
export const normalQuantile = (p: number): number => jStat.normal.inv(p, 0, 1);

/** χ² quantile (for likelihood-ratio thresholds). */
export const chiSquareQuantile = (p: number, dof: number): number => jStat.chisquare.inv(p, dof);

/** −ln of the lognormal density with median m and sd of log s at x. */
export function lognormalNegLogDensity(x: number, median: number, sdLog: number): number {
  if (!(x > 0)) return Infinity;
  const z = (Math.log(x) - Math.log(median)) / sdLog;
  return Math.log(x) + Math.log(sdLog) + 0.5 * Math.log(2 * Math.PI) + 0.5 * z * z;
}

/** Beta shape parameters from a mean and a standard deviation (method of moments). */
export function betaShapes(mean: number, sd: number): { a: number; b: number } | null {
  const k = (mean * (1 - mean)) / (sd * sd) - 1;
  if (!(mean > 0 && mean < 1) || !(k > 0)) return null;
  return { a: mean * k, b: (1 - mean) * k };
}

/** −ln of the beta(a, b) density at x in (0, 1). */
export function betaNegLogDensity(x: number, a: number, b: number): number {
  if (!(x > 0 && x < 1)) return Infinity;
  return -((a - 1) * Math.log(x) + (b - 1) * Math.log(1 - x) - jStat.betaln(a, b));
}
