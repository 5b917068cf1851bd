/**
 * Lognormal observation error I_t = q·B_t·e^ε with q and σ concentrated out in closed form.
 * Polacheck, Hilborn & Punt (1993) CJFAS 50:2597; Hilborn & Walters (1992) Quantitative Fisheries
 * Stock Assessment.
 */

export interface IndexFit {
  q: number;
  sigma: number;
  /** Negative log-likelihood of this index at q̂, σ̂. */
  nll: number;
  /** ln(I_t) − ln(q̂·B_t) for each observed year (null where no observation). */
  residuals: (number | null)[];
  n: number;
}

/**
 * Concentrated fit of one index to a biomass path. Without CVs: q̂ = exp(mean z), σ̂² = mean((z − ln q̂)²),
 * nll = n·ln σ̂ + (n/2)(1 + ln 2π) + Σ ln I_t. With a CV for every observation, σ_t = √ln(1 + CV²) is
 * fixed and ln q̂ is the precision-weighted mean of z. A given `fixedQ` replaces q̂ (σ̂ is then the
 * root mean square of z − ln q).
 */
export function concentratedIndexFit(index: (number | null)[], biomass: number[], cv: (number | null)[] | null = null, fixedQ?: number): IndexFit | null {
  const z: number[] = [];
  const at: number[] = [];
  let sumLogI = 0;
  for (let t = 0; t < index.length; t++) {
    const I = index[t];
    if (I === null || I === undefined) continue;
    const B = biomass[t]!;
    if (!(B > 0)) return null;
    z.push(Math.log(I / B));
    at.push(t);
    sumLogI += Math.log(I);
  }
  const n = z.length;
  if (n === 0) return null;
  const sigmas = cv && at.every((t) => cv[t] != null) ? at.map((t) => Math.sqrt(Math.log(1 + cv[t]! ** 2))) : null;
  let lnq: number;
  let nll: number;
  let sigma: number;
  if (sigmas) {
    let sw = 0, swz = 0;
    for (let i = 0; i < n; i++) {
      const w = 1 / sigmas[i]! ** 2;
      sw += w;
      swz += w * z[i]!;
    }
    lnq = fixedQ !== undefined ? Math.log(fixedQ) : swz / sw;
    nll = sumLogI;
    for (let i = 0; i < n; i++) nll += Math.log(sigmas[i]!) + 0.5 * Math.log(2 * Math.PI) + (z[i]! - lnq) ** 2 / (2 * sigmas[i]! ** 2);
    sigma = Math.sqrt(z.reduce((s, v) => s + (v - lnq) ** 2, 0) / n);
  } else {
    lnq = fixedQ !== undefined ? Math.log(fixedQ) : z.reduce((s, v) => s + v, 0) / n;
    const s2 = z.reduce((s, v) => s + (v - lnq) ** 2, 0) / n;
    sigma = Math.sqrt(Math.max(s2, 1e-300));
    nll = n * Math.log(sigma) + (n / 2) * (1 + Math.log(2 * Math.PI)) + sumLogI;
  }
  const residuals: (number | null)[] = index.map(() => null);
  at.forEach((t, i) => { residuals[t] = z[i]! - lnq; });
  return { q: Math.exp(lnq), sigma, nll, residuals, n };
}

/** Full (not concentrated) lognormal negative log-likelihood at a given q and σ: for checks and profiles. */
export function lognormalNll(index: (number | null)[], biomass: number[], q: number, sigma: number): number {
  let nll = 0;
  for (let t = 0; t < index.length; t++) {
    const I = index[t];
    if (I === null || I === undefined) continue;
    const e = Math.log(I) - Math.log(q * biomass[t]!);
    nll += Math.log(sigma) + 0.5 * Math.log(2 * Math.PI) + Math.log(I) + (e * e) / (2 * sigma * sigma);
  }
  return nll;
}
