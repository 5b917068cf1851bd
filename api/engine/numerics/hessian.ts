/** Finite-difference derivatives and the approximate covariance of a maximum-likelihood fit. */
import { Matrix, inverse, EigenvalueDecomposition } from 'ml-matrix';

/** Central-difference gradient. */
export function gradient(f: (x: number[]) => number, x: number[], h = 1e-5): number[] {
  return x.map((_, i) => {
    const a = x.slice(); const b = x.slice();
    a[i]! += h; b[i]! -= h;
    return (f(a) - f(b)) / (2 * h);
  });
}

/** Central-difference Hessian of a negative log-likelihood. */
export function hessian(f: (x: number[]) => number, x: number[], h = 1e-4): number[][] {
  const n = x.length;
  const f0 = f(x);
  const H = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      if (i === j) {
        const a = x.slice(); const b = x.slice();
        a[i]! += h; b[i]! -= h;
        H[i]![i] = (f(a) - 2 * f0 + f(b)) / (h * h);
      } else {
        const pp = x.slice(); const pm = x.slice(); const mp = x.slice(); const mm = x.slice();
        pp[i]! += h; pp[j]! += h; pm[i]! += h; pm[j]! -= h; mp[i]! -= h; mp[j]! += h; mm[i]! -= h; mm[j]! -= h;
        H[i]![j] = H[j]![i] = (f(pp) - f(pm) - f(mp) + f(mm)) / (4 * h * h);
      }
    }
  }
  return H;
}

export interface Covariance {
  /** Inverse Hessian, or null when the Hessian is not positive definite. */
  cov: number[][] | null;
  minEigenvalue: number;
  conditionNumber: number;
}

/** The inverse Hessian as the approximate covariance, with the checks that say whether it can be trusted. */
export function covarianceFromHessian(H: number[][]): Covariance {
  const m = new Matrix(H);
  const eig = new EigenvalueDecomposition(m, { assumeSymmetric: true }).realEigenvalues;
  const min = Math.min(...eig);
  const max = Math.max(...eig);
  if (!(min > 0) || !eig.every(Number.isFinite)) return { cov: null, minEigenvalue: min, conditionNumber: Infinity };
  try {
    return { cov: inverse(m).to2DArray(), minEigenvalue: min, conditionNumber: max / min };
  } catch {
    // why: a positive but tiny eigenvalue (a parameter on its bound) can still leave LU singular
    return { cov: null, minEigenvalue: min, conditionNumber: Infinity };
  }
}

/** Delta-method variance of g(x): ∇gᵀ Σ ∇g. */
export function deltaVariance(g: (x: number[]) => number, x: number[], cov: number[][]): number {
  const d = gradient(g, x, 1e-5);
  let v = 0;
  for (let i = 0; i < d.length; i++) for (let j = 0; j < d.length; j++) v += d[i]! * cov[i]![j]! * d[j]!;
  return v;
}
