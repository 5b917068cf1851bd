/**
 * Checks on one survey's log residuals: the Wald-Wolfowitz runs test on their signs, lag-1
 * autocorrelation, normal QQ points and the fraction beyond 3σ.
 */
import { normalCdf, normalQuantile } from '../numerics/distributions';
import { lag1Autocorrelation } from './early-warning';

export interface RunsTest {
  /** Number of runs of equal sign. */
  runs: number;
  positives: number;
  negatives: number;
  /** Expected runs under randomness, 2·n₁·n₂/n + 1. */
  expected: number;
  z: number;
  /** Two-sided p-value (normal approximation); small means the signs are not in random order. */
  p: number;
}

/**
 * Runs test on the signs of x (zeros dropped). Wald & Wolfowitz (1940) Ann. Math. Stat. 11:147:
 * μ = 2n₁n₂/n + 1, σ² = 2n₁n₂(2n₁n₂ − n) / (n²(n − 1)), z = (R − μ)/σ. Null when one sign is missing.
 */
export function runsTest(x: number[]): RunsTest | null {
  const s = x.filter((v) => v !== 0).map((v) => v > 0);
  const n1 = s.filter(Boolean).length, n2 = s.length - n1, n = s.length;
  if (n1 === 0 || n2 === 0) return null;
  let runs = 1;
  for (let i = 1; i < n; i++) if (s[i] !== s[i - 1]) runs++;
  const expected = (2 * n1 * n2) / n + 1;
  const variance = (2 * n1 * n2 * (2 * n1 * n2 - n)) / (n * n * (n - 1));
  const z = variance > 0 ? (runs - expected) / Math.sqrt(variance) : 0;
  return { runs, positives: n1, negatives: n2, expected, z, p: Math.min(1, 2 * (1 - normalCdf(Math.abs(z)))) };
}

/** Normal QQ points [theoretical, standardised sample] with Blom's (1958) positions (i − 3/8)/(n + 1/4). */
export function qqPoints(x: number[]): [number, number][] {
  const sd = rms(x);
  const s = [...x].sort((a, b) => a - b);
  const n = s.length;
  return s.map((v, i) => [normalQuantile((i + 1 - 0.375) / (n + 0.25)), sd > 0 ? v / sd : 0]);
}

/** Root mean square of log residuals: the σ̂ of the concentrated likelihood. */
export function rms(x: number[]): number {
  return x.length ? Math.sqrt(x.reduce((s, v) => s + v * v, 0) / x.length) : 0;
}

export interface ResidualCheck {
  index: string;
  n: number;
  years: number[];
  residuals: number[];
  runsTest: RunsTest | null;
  lag1: number | null;
  /** Share of residuals with |e| > 3σ̂ (σ̂ their root mean square). */
  outside3Sigma: number;
  qq: [number, number][];
}

/** All checks for one survey, from its residual per year (null where not observed). */
export function residualCheck(index: string, years: number[], residuals: (number | null)[]): ResidualCheck {
  const at = residuals.map((r, t) => (r === null ? -1 : t)).filter((t) => t >= 0);
  const e = at.map((t) => residuals[t]!);
  const sd = rms(e);
  return {
    index, n: e.length, years: at.map((t) => years[t]!), residuals: e, runsTest: runsTest(e),
    lag1: e.length >= 4 ? lag1Autocorrelation(e) : null,
    outside3Sigma: e.length ? e.filter((v) => Math.abs(v) > 3 * sd).length / e.length : 0,
    qq: qqPoints(e),
  };
}
