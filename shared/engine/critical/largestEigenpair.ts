// The largest eigenvalue of a symmetric operator and its eigenvector, by the Lanczos method with full
// reorthogonalisation: the operator is only applied to vectors (here two band triangular solves and a
// band product), and the small tridiagonal matrix it builds is solved by ml-matrix's symmetric
// EigenvalueDecomposition. Method: Golub & Van Loan, Matrix Computations, §10.1 (Lanczos) and the
// Ritz residual estimate |βj·sj| (from memory).
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';

export interface Eigenpair {
  value: number;
  vector: Float64Array;
  /** ‖A·x − θ·x‖ of the returned pair, relative to |θ|. */
  residual: number;
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/** Deterministic, not symmetric about the middle, so no mode of a symmetric column is missed. */
function startVector(n: number): Float64Array {
  const v = new Float64Array(n);
  for (let i = 0; i < n; i++) v[i] = 1 + 0.5 * Math.sin(1.7 * i + 0.3);
  const norm = Math.sqrt(dot(v, v));
  for (let i = 0; i < n; i++) v[i] /= norm;
  return v;
}

function tridiagonal(alpha: readonly number[], beta: readonly number[]): Matrix {
  const m = alpha.length;
  const t = Matrix.zeros(m, m);
  for (let i = 0; i < m; i++) {
    t.set(i, i, alpha[i]);
    if (i + 1 < m) {
      t.set(i, i + 1, beta[i]);
      t.set(i + 1, i, beta[i]);
    }
  }
  return t;
}

function largestRitz(alpha: readonly number[], beta: readonly number[]): { theta: number; s: number[] } {
  const eig = new EigenvalueDecomposition(tridiagonal(alpha, beta), { assumeSymmetric: true });
  const values = eig.realEigenvalues;
  let best = 0;
  for (let i = 1; i < values.length; i++) if (values[i] > values[best]) best = i;
  return { theta: values[best], s: eig.eigenvectorMatrix.getColumn(best) };
}

/**
 * `apply(x, out)` writes A·x into out. Stops when the Ritz residual is below `tolerance`·|θ| or the
 * Krylov space is exhausted (then the result is exact for it).
 */
export function largestEigenpair(
  n: number,
  apply: (x: Float64Array, out: Float64Array) => void,
  tolerance = 1e-9,
): Eigenpair {
  const basis: Float64Array[] = [startVector(n)];
  const alpha: number[] = [];
  const beta: number[] = [];
  const w = new Float64Array(n);
  let nextCheck = Math.min(n, 12);
  let ritz = { theta: 0, s: [1] };
  let residual = Infinity;
  for (let j = 0; j < n; j++) {
    const q = basis[j];
    apply(q, w);
    alpha.push(dot(w, q));
    // Full reorthogonalisation, repeated once when it removed most of w ("twice is enough", Kahan–Parlett;
    // Golub & Van Loan §10.1.5; from memory), keeps the basis orthogonal in floating point.
    let before = Math.sqrt(dot(w, w));
    for (let pass = 0; pass < 2; pass++) {
      for (let k = 0; k < basis.length; k++) {
        const v = basis[k];
        const c = dot(w, v);
        for (let i = 0; i < n; i++) w[i] -= c * v[i];
      }
      const after = Math.sqrt(dot(w, w));
      if (after > 0.7 * before) break;
      before = after;
    }
    const b = Math.sqrt(dot(w, w));
    const exhausted = j + 1 === n || b <= 1e-13 * Math.abs(alpha[0] || 1);
    if (j + 1 === nextCheck || exhausted) {
      ritz = largestRitz(alpha, beta);
      residual = exhausted ? 0 : (b * Math.abs(ritz.s[j])) / Math.max(Math.abs(ritz.theta), Number.MIN_VALUE);
      if (exhausted || residual <= tolerance) break;
      nextCheck = Math.min(n, Math.ceil(nextCheck * 1.5));
    }
    beta.push(b);
    const next = new Float64Array(n);
    for (let i = 0; i < n; i++) next[i] = w[i] / b;
    basis.push(next);
  }
  const vector = new Float64Array(n);
  for (let k = 0; k < ritz.s.length; k++) {
    const v = basis[k];
    const c = ritz.s[k];
    for (let i = 0; i < n; i++) vector[i] += c * v[i];
  }
  return { value: ritz.theta, vector, residual };
}
