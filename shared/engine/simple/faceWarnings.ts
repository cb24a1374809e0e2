// The faces describe how a floor's load splits; they must not add up to more than the floor brings in.
import type { Issue } from '../../schema/results.ts';
import type { RestraintFaces } from '../../schema/stack.ts';
import { formatElevation } from '../stack/formatElevation.ts';

export interface FaceTotals {
  nodeId: string;
  elevation: number;
  faces?: RestraintFaces;
  /** Characteristic loads entering the column at this floor (its own plus attached load nodes), kN. */
  Gk: number;
  Qk: number;
  /** The cap (roof beams) rather than a restraint. */
  cap?: boolean;
}

const TOLERANCE_KN = 1e-6;

export function faceWarnings(floors: readonly FaceTotals[]): Issue[] {
  const issues: Issue[] = [];
  for (const f of floors) {
    if (!f.faces) continue;
    const sides = [f.faces.yPlus, f.faces.yMinus, f.faces.zPlus, f.faces.zMinus];
    const Gk = sides.reduce((s, r) => s + (r?.Gk ?? 0), 0);
    const Qk = sides.reduce((s, r) => s + (r?.Qk ?? 0), 0);
    if (Gk > f.Gk + TOLERANCE_KN || Qk > f.Qk + TOLERANCE_KN) {
      issues.push({
        nodeId: f.nodeId,
        message: `${f.cap ? 'Cap' : 'Restraint'} at ${formatElevation(f.elevation)}: the face reactions (Gk ${Gk.toFixed(1)}, Qk ${Qk.toFixed(1)} kN) add up to more than the load entering the column there (Gk ${f.Gk.toFixed(1)}, Qk ${f.Qk.toFixed(1)} kN); the axial force uses the load entering the column`,
      });
    }
  }
  return issues;
}
