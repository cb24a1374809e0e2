// The band Cholesky and the Lanczos eigen solver of shared/engine/critical against ml-matrix's dense
// CholeskyDecomposition and EigenvalueDecomposition on the same matrices.
import { CholeskyDecomposition, EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import {
  addBand,
  bandCholesky,
  bandMatrix,
  bandMultiply,
  solveLower,
  solveUpper,
} from '../../shared/engine/critical/bandMatrix.ts';
import { largestEigenpair } from '../../shared/engine/critical/largestEigenpair.ts';

/** A symmetric positive definite band matrix with half-bandwidth 3 (diagonally dominant), as band and dense. */
function sample(n: number): { band: ReturnType<typeof bandMatrix>; dense: Matrix } {
  const band = bandMatrix(n, 3);
  const dense = Matrix.zeros(n, n);
  for (let i = 0; i < n; i++) {
    for (let k = 0; k <= 3 && k <= i; k++) {
      const v = k === 0 ? 10 + (i % 5) : Math.sin(i * 3.1 + k) * 2;
      addBand(band, i, i - k, v);
      dense.set(i, i - k, v);
      dense.set(i - k, i, v);
    }
  }
  return { band, dense };
}

describe('band Cholesky', () => {
  it('solves A·x = b as ml-matrix CholeskyDecomposition does', () => {
    const n = 40;
    const { band, dense } = sample(n);
    const b = Float64Array.from({ length: n }, (_, i) => Math.cos(i));
    const chol = bandCholesky(band);
    if (!('factor' in chol)) throw new Error('not positive definite');
    const x = solveUpper(chol.factor, solveLower(chol.factor, b.slice()));
    const expected = new CholeskyDecomposition(dense).solve(Matrix.columnVector(Array.from(b))).getColumn(0);
    x.forEach((v, i) => expect(v).toBeCloseTo(expected[i], 10));
    const back = bandMultiply(band, x, new Float64Array(n));
    back.forEach((v, i) => expect(v).toBeCloseTo(b[i], 10));
  });

  it('reports the first pivot that is not positive', () => {
    const m = bandMatrix(3, 3);
    addBand(m, 0, 0, 1);
    addBand(m, 1, 0, 1);
    addBand(m, 1, 1, 1);
    addBand(m, 2, 2, 1);
    expect(bandCholesky(m)).toEqual({ failedAt: 1 });
  });
});

describe('largest eigenpair by Lanczos', () => {
  it('finds the largest eigenvalue that ml-matrix EigenvalueDecomposition finds', () => {
    const n = 60;
    const { band, dense } = sample(n);
    const pair = largestEigenpair(n, (x, out) => void bandMultiply(band, x, out));
    const values = new EigenvalueDecomposition(dense, { assumeSymmetric: true }).realEigenvalues;
    expect(pair.value).toBeCloseTo(Math.max(...values), 8);
    const ax = bandMultiply(band, pair.vector, new Float64Array(n));
    const norm = Math.hypot(...pair.vector);
    ax.forEach((v, i) => expect(v / norm).toBeCloseTo((pair.value * pair.vector[i]) / norm, 6));
  });
});
