// Symmetric band matrix (lower band stored row by row) with its Cholesky factor and the two
// triangular solves. A beam along a column couples only neighbouring nodes, so with 2 DOF per node
// the half-bandwidth is 3 and a factorisation costs O(n) instead of the dense O(n³).
// Band Cholesky: Golub & Van Loan, Matrix Computations, Algorithm 4.3.5 (band Cholesky), from memory.

export interface BandMatrix {
  n: number;
  /** Half-bandwidth: entries (i, j) with 0 ≤ i − j ≤ bw are stored. */
  bw: number;
  /** (i, j) at i·(bw + 1) + (i − j). */
  data: Float64Array;
}

export function bandMatrix(n: number, bw: number): BandMatrix {
  return { n, bw, data: new Float64Array(n * (bw + 1)) };
}

/** Adds v to (i, j) and, by symmetry, (j, i); only the lower triangle is stored. */
export function addBand(m: BandMatrix, i: number, j: number, v: number): void {
  const [r, c] = i >= j ? [i, j] : [j, i];
  m.data[r * (m.bw + 1) + (r - c)] += v;
}

export function bandMultiply(m: BandMatrix, x: Float64Array, out: Float64Array): Float64Array {
  const { n, bw, data } = m;
  out.fill(0);
  for (let i = 0; i < n; i++) {
    const row = i * (bw + 1);
    out[i] += data[row] * x[i];
    for (let k = 1; k <= bw && k <= i; k++) {
      const v = data[row + k];
      out[i] += v * x[i - k];
      out[i - k] += v * x[i];
    }
  }
  return out;
}

/**
 * The lower Cholesky factor L (A = L·Lᵀ) in the same band layout, or the index of the first pivot that
 * is not positive: the matrix is not positive definite (a mechanism, for a stiffness matrix).
 */
export function bandCholesky(a: BandMatrix, relativeTolerance = 1e-12): { factor: BandMatrix } | { failedAt: number } {
  const { n, bw } = a;
  const w = bw + 1;
  const l = new Float64Array(a.data);
  for (let j = 0; j < n; j++) {
    let s = l[j * w];
    for (let k = Math.max(0, j - bw); k < j; k++) s -= l[j * w + (j - k)] ** 2;
    if (!(s > relativeTolerance * a.data[j * w])) return { failedAt: j };
    const pivot = Math.sqrt(s);
    l[j * w] = pivot;
    for (let i = j + 1; i <= Math.min(n - 1, j + bw); i++) {
      let t = l[i * w + (i - j)];
      for (let k = Math.max(0, i - bw); k < j; k++) t -= l[i * w + (i - k)] * l[j * w + (j - k)];
      l[i * w + (i - j)] = t / pivot;
    }
  }
  return { factor: { n, bw, data: l } };
}

/** Solves L·y = b in place (forward substitution). */
export function solveLower(l: BandMatrix, b: Float64Array): Float64Array {
  const { n, bw, data } = l;
  const w = bw + 1;
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = Math.max(0, i - bw); k < i; k++) s -= data[i * w + (i - k)] * b[k];
    b[i] = s / data[i * w];
  }
  return b;
}

/** Solves Lᵀ·x = b in place (back substitution). */
export function solveUpper(l: BandMatrix, b: Float64Array): Float64Array {
  const { n, bw, data } = l;
  const w = bw + 1;
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let k = i + 1; k <= Math.min(n - 1, i + bw); k++) s -= data[k * w + (k - i)] * b[k];
    b[i] = s / data[i * w];
  }
  return b;
}
