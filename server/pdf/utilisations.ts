// The two utilisations the package prints side by side: the axial check alone and the simple-construction
// combined check, read from the engine's results (the piece's utilisation is the larger of the two).
import type { LiftResult, PieceCheck, StackResult } from '../../shared/schema/results.ts';

/** The engine keeps the axial figure in `axialUtilisation` only when the combined check raised `utilisation`. */
export const axialOf = (p: PieceCheck): number => p.axialUtilisation ?? p.utilisation;
export const combinedOf = (p: PieceCheck): number | null => p.combined?.utilisation ?? null;

function largest(values: (number | null)[]): number | null {
  return values.reduce<number | null>((m, v) => (v === null ? m : m === null ? v : Math.max(m, v)), null);
}

export interface LiftUtilisations {
  axial: number | null;
  /** null when no piece of the lift carries nominal moments. */
  combined: number | null;
}

export function liftUtilisations(lift: LiftResult): LiftUtilisations {
  return { axial: largest(lift.pieces.map(axialOf)), combined: largest(lift.pieces.map(combinedOf)) };
}

export const hasCombined = (results: StackResult): boolean =>
  results.lifts.some((l) => l.pieces.some((p) => p.combined));
