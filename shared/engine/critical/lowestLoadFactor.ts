// Linear buckling of a braced column about one axis: K·φ = λ·Kg·φ, lowest positive λ = αcr
// (EN 1993-1-1 5.2.1(3), eq. 5.1: αcr = Fcr/FEd). With K = L·Lᵀ (Cholesky; K is positive definite once
// the column is supported), μ = 1/λ are the eigenvalues of the symmetric L⁻¹·Kg·L⁻ᵀ, and the lowest
// positive λ is the largest μ. Tension (negative N) stiffens and gives negative μ, which never govern.
import { addBand, bandCholesky, bandMatrix, bandMultiply, solveLower, solveUpper } from './bandMatrix.ts';
import { elasticStiffness, geometricStiffness } from './beamElement.ts';
import { largestEigenpair } from './largestEigenpair.ts';

/** A column as beam elements between consecutive nodes. Units kN and m. */
export interface BeamColumn {
  /** Node elevations, ascending, m. */
  nodes: number[];
  /** Per element (nodes[i] to nodes[i + 1]): bending stiffness EI (kN·m²) and axial force N (kN, compression positive). */
  EI: number[];
  N: number[];
  /** Per node: no lateral movement (a restraint about this axis). */
  lateralFixed: boolean[];
  /** Per node: no rotation (a fixed end or restraint). */
  rotationFixed: boolean[];
  /** Per node: rotational spring, kN·m/rad (a partial end or restraint). */
  rotationSpring: number[];
}

export type BucklingSolution =
  | { alphaCr: number; /** Lateral displacement per node, largest magnitude 1, largest positive. */ shape: number[] }
  | { failure: 'mechanism'; node: number }
  | { failure: 'no-compression' };

/** Equation numbers per node, −1 where the DOF is held; numbered in node order so the band stays 3 wide. */
function numberDofs(c: BeamColumn): { u: number[]; t: number[]; count: number } {
  const u: number[] = [];
  const t: number[] = [];
  let count = 0;
  for (let k = 0; k < c.nodes.length; k++) {
    u.push(c.lateralFixed[k] ? -1 : count++);
    t.push(c.rotationFixed[k] ? -1 : count++);
  }
  return { u, t, count };
}

export function lowestLoadFactor(c: BeamColumn): BucklingSolution {
  const dofs = numberDofs(c);
  const n = dofs.count;
  const K = bandMatrix(n, 3);
  const Kg = bandMatrix(n, 3);
  const map = [0, 0, 0, 0];
  const ke = new Float64Array(16);
  const kg = new Float64Array(16);
  for (let e = 0; e + 1 < c.nodes.length; e++) {
    const L = c.nodes[e + 1] - c.nodes[e];
    map[0] = dofs.u[e];
    map[1] = dofs.t[e];
    map[2] = dofs.u[e + 1];
    map[3] = dofs.t[e + 1];
    elasticStiffness(c.EI[e], L, ke);
    geometricStiffness(c.N[e], L, kg);
    for (let a = 0; a < 4; a++) {
      for (let b = 0; b <= a; b++) {
        if (map[a] < 0 || map[b] < 0) continue;
        addBand(K, map[a], map[b], ke[a * 4 + b]);
        addBand(Kg, map[a], map[b], kg[a * 4 + b]);
      }
    }
  }
  for (let k = 0; k < c.nodes.length; k++)
    if (dofs.t[k] >= 0 && c.rotationSpring[k] > 0) addBand(K, dofs.t[k], dofs.t[k], c.rotationSpring[k]);

  if (n === 0) return { failure: 'no-compression' };
  const chol = bandCholesky(K);
  if ('failedAt' in chol) {
    const node = Math.max(
      0,
      dofs.u.findIndex((d, k) => d >= chol.failedAt || dofs.t[k] >= chol.failedAt),
    );
    return { failure: 'mechanism', node };
  }
  const L = chol.factor;
  const y = new Float64Array(n);
  const apply = (x: Float64Array, out: Float64Array): void => {
    y.set(x);
    solveUpper(L, y);
    bandMultiply(Kg, y, out);
    solveLower(L, out);
  };
  const pair = largestEigenpair(n, apply);
  // μ = 1/λ: none positive (to round-off) means no compression anywhere that can buckle the column.
  if (!(pair.value > (1e-12 * maxAbs(Kg.data)) / maxAbs(K.data))) return { failure: 'no-compression' };
  const phi = solveUpper(L, pair.vector);
  const shape = dofs.u.map((d) => (d < 0 ? 0 : phi[d]));
  const peak = shape.reduce((m, v) => (Math.abs(v) > Math.abs(m) ? v : m), 0);
  return { alphaCr: 1 / pair.value, shape: shape.map((v) => (peak === 0 ? 0 : v / peak)) };
}

function maxAbs(values: Float64Array): number {
  let m = 0;
  for (const v of values) if (Math.abs(v) > m) m = Math.abs(v);
  return m || 1;
}
