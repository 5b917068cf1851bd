import { Matrix, solve } from 'ml-matrix';
import { createRng } from './random';
import { BandMatrix, bandLu, bandSolve } from './banded';

describe('banded LU with partial pivoting', () => {
  it('solves a random indefinite banded system like ml-matrix\'s dense solver', () => {
    // reference: ml-matrix's dense LU solve (general-purpose library)
    const rng = createRng(3);
    const n = 60, kl = 4, ku = 3;
    const A = new BandMatrix(n, kl, ku);
    const dense = Matrix.zeros(n, n);
    for (let i = 0; i < n; i++) {
      for (let j = Math.max(0, i - kl); j <= Math.min(n - 1, i + ku); j++) {
        const v = rng.uniform() - 0.5 + (i === j ? 0.01 : 0);
        A.set(i, j, v);
        dense.set(i, j, v);
      }
    }
    const b = Array.from({ length: n }, () => rng.normal());
    const Ab = A.multiply(b);
    expect(Ab[5]!).toBeCloseTo(dense.mmul(Matrix.columnVector(b)).get(5, 0), 12);
    const x = bandSolve(bandLu(A.clone()), b);
    const ref = solve(dense, Matrix.columnVector(b)).getColumn(0);
    for (let i = 0; i < n; i++) expect(x[i]!).toBeCloseTo(ref[i]!, 8);
  });

  it('pivots past a zero on the diagonal', () => {
    const A = new BandMatrix(2, 1, 1);
    A.set(0, 1, 1); A.set(1, 0, 1); A.set(1, 1, 1);
    const x = bandSolve(bandLu(A), [2, 3]);
    expect(Array.from(x)).toEqual([1, 2]);
  });
});
