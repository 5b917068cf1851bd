/**
 * Logistic growth with constant harvest, dN/dt = rN(1 − N/K) − h, solved exactly.
 * Clark (1990) Mathematical Bioeconomics, 2nd ed., ch. 1; May (1977) Nature 269:471.
 */

export interface LogisticFold {
  /** Fold (saddle-node) harvest h* = rK/4. */
  hStar: number;
  /** Stable equilibrium N+ = (K/2)(1 + √(1 − h/h*)), or null past the fold. */
  stable: number | null;
  /** Unstable threshold N− = (K/2)(1 − √(1 − h/h*)), or null past the fold. */
  unstable: number | null;
  /** Return rate at N+: λ = r√(1 − h/h*) (Wissel 1984, Oecologia 65:101), 0 past the fold. */
  returnRate: number;
}

/** Equilibria, their stability and the fold for harvest h. */
export function logisticFold(r: number, K: number, h: number): LogisticFold {
  const hStar = (r * K) / 4;
  const s = 1 - h / hStar;
  if (s < 0) return { hStar, stable: null, unstable: null, returnRate: 0 };
  const root = Math.sqrt(s);
  return { hStar, stable: (K / 2) * (1 + root), unstable: (K / 2) * (1 - root), returnRate: r * root };
}

export interface LogisticStep {
  N: number;
  /** Time at which N reached zero, if it did within t. */
  collapseTime: number | null;
}

/**
 * N(t) from N(0) = N0 under constant harvest h, exactly. Below the unstable threshold (or past the
 * fold) the stock reaches zero at a finite time and stays there.
 */
export function logisticHarvest(r: number, K: number, h: number, N0: number, t: number): LogisticStep {
  if (N0 <= 0) return { N: 0, collapseTime: 0 };
  const hStar = (r * K) / 4;
  const s = 1 - h / hStar;
  const u0 = N0 - K / 2;
  if (Math.abs(s) < 1e-12) {
    // h = h*: N(t) = K/2 + u0/(1 + r·t·u0/K); zero when u0 < 0 at t = −K(K/2 + u0)/(r·u0·K/2)
    if (u0 < 0) {
      const tc = (-K * (K / 2 + u0)) / ((r * u0 * K) / 2);
      if (tc <= t) return { N: 0, collapseTime: tc };
    }
    return { N: K / 2 + u0 / (1 + (r * t * u0) / K), collapseTime: null };
  }
  if (s < 0) {
    // h > h*: ω = (K/2)√(h/h* − 1), N(t) = K/2 + ω·tan(arctan(u0/ω) − rωt/K)
    const w = (K / 2) * Math.sqrt(-s);
    const tc = (K / (r * w)) * (Math.atan(u0 / w) + Math.atan(K / (2 * w)));
    if (tc <= t) return { N: 0, collapseTime: tc };
    return { N: K / 2 + w * Math.tan(Math.atan(u0 / w) - (r * w * t) / K), collapseTime: null };
  }
  const root = Math.sqrt(s);
  const lambda = r * root;
  const np = (K / 2) * (1 + root);
  const nm = (K / 2) * (1 - root);
  if (N0 === nm) return { N: nm, collapseTime: null };
  const C = (N0 - np) / (N0 - nm);
  if (N0 < nm) {
    const tc = Math.log((C * nm) / np) / lambda;
    if (tc <= t) return { N: 0, collapseTime: tc };
  }
  const e = C * Math.exp(-lambda * t);
  return { N: (np - nm * e) / (1 - e), collapseTime: null };
}
