/**
 * Banded matrices and their LU factorisation with partial pivoting (the unblocked algorithm of
 * LAPACK's dgbtf2; Golub & Van Loan 2013, §4.3). Row i stores columns i − kl … i + kl + ku, the extra
 * kl columns hold the fill-in that row exchanges create.
 */

export class BandMatrix {
  readonly width: number;
  readonly a: Float64Array;
  constructor(readonly n: number, readonly kl: number, readonly ku: number) {
    this.width = 2 * kl + ku + 1;
    this.a = new Float64Array(n * this.width);
  }
  private at(i: number, j: number): number {
    const k = j - i + this.kl;
    if (k < 0 || k >= this.width) throw new RangeError(`(${i}, ${j}) is outside the band`);
    return i * this.width + k;
  }
  get(i: number, j: number): number {
    const k = j - i + this.kl;
    return k < 0 || k >= this.width ? 0 : this.a[i * this.width + k]!;
  }
  set(i: number, j: number, v: number): void { this.a[this.at(i, j)] = v; }
  add(i: number, j: number, v: number): void { this.a[this.at(i, j)]! += v; }
  clone(): BandMatrix {
    const m = new BandMatrix(this.n, this.kl, this.ku);
    m.a.set(this.a);
    return m;
  }
  /** y = A·x (before factorisation). */
  multiply(x: ArrayLike<number>): Float64Array {
    const y = new Float64Array(this.n);
    for (let i = 0; i < this.n; i++) {
      let s = 0;
      for (let j = Math.max(0, i - this.kl); j <= Math.min(this.n - 1, i + this.ku); j++) s += this.get(i, j) * x[j]!;
      y[i] = s;
    }
    return y;
  }
}

export interface BandLu {
  m: BandMatrix;
  pivots: Int32Array;
}

/** Factorises A in place (A is consumed); throws on an exactly singular matrix. */
export function bandLu(A: BandMatrix): BandLu {
  const { n, kl, ku, width, a } = A;
  const pivots = new Int32Array(n);
  const idx = (i: number, j: number) => i * width + (j - i + kl);
  for (let k = 0; k < n; k++) {
    const last = Math.min(n - 1, k + kl);
    let p = k;
    let best = Math.abs(a[idx(k, k)]!);
    for (let i = k + 1; i <= last; i++) {
      const v = Math.abs(a[idx(i, k)]!);
      if (v > best) { best = v; p = i; }
    }
    pivots[k] = p;
    if (best === 0) throw new Error(`singular banded matrix (column ${k})`);
    const jEnd = Math.min(n - 1, k + kl + ku);
    if (p !== k) {
      for (let j = k; j <= jEnd; j++) {
        const t = a[idx(k, j)]!;
        a[idx(k, j)] = a[idx(p, j)]!;
        a[idx(p, j)] = t;
      }
    }
    const piv = a[idx(k, k)]!;
    for (let i = k + 1; i <= last; i++) {
      const l = a[idx(i, k)]! / piv;
      a[idx(i, k)] = l;
      if (l === 0) continue;
      for (let j = k + 1; j <= jEnd; j++) a[idx(i, j)]! -= l * a[idx(k, j)]!;
    }
  }
  return { m: A, pivots };
}

/** Solves A·x = b with a factorisation from bandLu; b is not changed. */
export function bandSolve(lu: BandLu, b: ArrayLike<number>): Float64Array {
  const { n, kl, ku, width, a } = lu.m;
  const x = Float64Array.from(b as ArrayLike<number>);
  const piv = lu.pivots;
  // element (i, j) is a[i·width + j − i + kl]
  for (let k = 0; k < n; k++) {
    const p = piv[k]!;
    if (p !== k) { const t = x[k]!; x[k] = x[p]!; x[p] = t; }
    const last = Math.min(n - 1, k + kl);
    const xk = x[k]!;
    if (xk === 0) continue;
    for (let i = k + 1; i <= last; i++) x[i]! -= a[i * width + k - i + kl]! * xk;
  }
  for (let k = n - 1; k >= 0; k--) {
    const jEnd = Math.min(n - 1, k + kl + ku);
    const row = k * width - k + kl;
    let s = x[k]!;
    for (let j = k + 1; j <= jEnd; j++) s -= a[row + j]! * x[j]!;
    x[k] = s / a[row + k]!;
  }
  return x;
}
