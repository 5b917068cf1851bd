/**
 * Early-warning indicators of a nearing fold on a residual series: rolling variance and lag-1
 * autocorrelation, each with Kendall's τ against time (Scheffer et al. 2009, Nature 461:53;
 * Dakos et al. 2012, PLoS ONE 7:e41010).
 */

/** Sample variance (n − 1). */
export function variance(x: number[]): number {
  const m = x.reduce((s, v) => s + v, 0) / x.length;
  return x.reduce((s, v) => s + (v - m) ** 2, 0) / (x.length - 1);
}

/** Pearson correlation of x_t with x_{t+1}. */
export function lag1Autocorrelation(x: number[]): number {
  const a = x.slice(0, -1), b = x.slice(1);
  const ma = a.reduce((s, v) => s + v, 0) / a.length, mb = b.reduce((s, v) => s + v, 0) / b.length;
  let sab = 0, saa = 0, sbb = 0;
  for (let i = 0; i < a.length; i++) {
    sab += (a[i]! - ma) * (b[i]! - mb);
    saa += (a[i]! - ma) ** 2;
    sbb += (b[i]! - mb) ** 2;
  }
  return sab / Math.sqrt(saa * sbb);
}

/** Kendall's τ-b of y against x (ties handled as in Kendall 1945). */
export function kendallTauB(x: number[], y: number[]): number {
  let concordant = 0, discordant = 0, tx = 0, ty = 0;
  for (let i = 0; i < x.length; i++) {
    for (let j = i + 1; j < x.length; j++) {
      const dx = Math.sign(x[i]! - x[j]!), dy = Math.sign(y[i]! - y[j]!);
      if (dx === 0 && dy === 0) continue;
      if (dx === 0) tx++;
      else if (dy === 0) ty++;
      else if (dx === dy) concordant++;
      else discordant++;
    }
  }
  return (concordant - discordant) / Math.sqrt((concordant + discordant + tx) * (concordant + discordant + ty));
}

/** Residuals from a straight-line fit against time (linear detrending). */
export function detrendLinear(x: number[]): number[] {
  const n = x.length;
  const t = x.map((_, i) => i);
  const mt = (n - 1) / 2, mx = x.reduce((s, v) => s + v, 0) / n;
  const slope = t.reduce((s, ti, i) => s + (ti - mt) * (x[i]! - mx), 0) / t.reduce((s, ti) => s + (ti - mt) ** 2, 0);
  return x.map((v, i) => v - (mx + slope * (i - mt)));
}

export interface EarlyWarning {
  /** Year at the end of each rolling window. */
  years: number[];
  variance: number[];
  autocorrelation: number[];
  tauVariance: number;
  tauAutocorrelation: number;
  window: number;
}

/** Rolling indicators over windows of half the series (default), after linear detrending. */
export function earlyWarning(years: number[], series: number[], window = Math.max(4, Math.floor(series.length / 2))): EarlyWarning {
  if (series.length < window + 2) throw new Error(`early-warning indicators need at least ${window + 2} values`);
  const x = detrendLinear(series);
  const ends: number[] = [], v: number[] = [], ac: number[] = [];
  for (let end = window; end <= x.length; end++) {
    const w = x.slice(end - window, end);
    ends.push(years[end - 1]!);
    v.push(variance(w));
    ac.push(lag1Autocorrelation(w));
  }
  return { years: ends, variance: v, autocorrelation: ac, tauVariance: kendallTauB(ends, v), tauAutocorrelation: kendallTauB(ends, ac), window };
}
