// Plane beam-column element about one axis: 2 DOF per node (lateral displacement, rotation), order
// [u1, θ1, u2, θ2]. Cubic Hermite shape functions; the matrices are the standard Euler–Bernoulli
// elastic stiffness and the consistent geometric stiffness (compression positive), as in any text on
// the finite element method for stability (e.g. McGuire, Gallagher & Ziemian, Matrix Structural
// Analysis, ch. 9; from memory).

/** Elastic bending stiffness, row-major 4×4: EI/L³ [12 6L −12 6L; 6L 4L² −6L 2L²; …]. */
export function elasticStiffness(EI: number, L: number, out = new Float64Array(16)): Float64Array {
  const a = EI / (L * L * L);
  const b = (6 * EI) / (L * L);
  const c = (4 * EI) / L;
  const d = (2 * EI) / L;
  out.set([12 * a, b, -12 * a, b, b, c, -b, d, -12 * a, -b, 12 * a, -b, b, d, -b, c]);
  return out;
}

/** Geometric stiffness for an axial compression N: N/(30L) [36 3L −36 3L; 3L 4L² −3L −L²; …]. */
export function geometricStiffness(N: number, L: number, out = new Float64Array(16)): Float64Array {
  const f = N / (30 * L);
  const a = 36 * f;
  const b = 3 * L * f;
  const c = 4 * L * L * f;
  const d = -L * L * f;
  out.set([a, b, -a, b, b, c, -b, d, -a, -b, a, -b, b, d, -b, c]);
  return out;
}
