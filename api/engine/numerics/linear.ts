/** Small dense linear algebra used by continuation (n ≤ 3): determinants, solves, 2×2 eigenvalues. */
import { Matrix, solve } from 'ml-matrix';

/** Determinant of a square matrix of order ≤ 3. */
export function det(A: number[][]): number {
  const n = A.length;
  if (n === 0) return 1;
  if (n === 1) return A[0]![0]!;
  if (n === 2) return A[0]![0]! * A[1]![1]! - A[0]![1]! * A[1]![0]!;
  let d = 0;
  for (let j = 0; j < n; j++) d += (j % 2 ? -1 : 1) * A[0]![j]! * det(A.slice(1).map((row) => row.filter((_, k) => k !== j)));
  return d;
}

/** Solves A x = b. */
export function solveLinear(A: number[][], b: number[]): number[] {
  return solve(new Matrix(A), Matrix.columnVector(b)).to1DArray();
}

export interface Eigen {
  re: number[];
  im: number[];
}

/** Eigenvalues of a 1×1 or 2×2 Jacobian. */
export function eigenvalues(J: number[][]): Eigen {
  if (J.length === 1) return { re: [J[0]![0]!], im: [0] };
  const tr = J[0]![0]! + J[1]![1]!;
  const d = det(J);
  const disc = (tr * tr) / 4 - d;
  if (disc >= 0) {
    const s = Math.sqrt(disc);
    return { re: [tr / 2 + s, tr / 2 - s], im: [0, 0] };
  }
  const s = Math.sqrt(-disc);
  return { re: [tr / 2, tr / 2], im: [s, -s] };
}
