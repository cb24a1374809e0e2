// One results-table row per lift, read from the lift's worst piece (docs/analysis-rules.md §Pieces: the lift's
// utilisation is its worst piece). Forces converted from the engine's N to kN; lengths stay in m.
import type { GoverningMode, LiftResult, PieceCheck, StackResult } from '@shared/schema/results.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import { CHECK_NAMES } from '@shared/wording.ts';
import { liftNumbers } from '@/utils/stackChain.ts';

export interface LiftRow {
  liftId: string;
  name: string;
  section: string;
  grade: string;
  bottom: number;
  top: number;
  /** kN */
  NEd: number;
  /** m */
  LcrY: number;
  LcrZ: number;
  lambdaBarY: number;
  lambdaBarZ: number;
  chiY: number;
  chiZ: number;
  /** kN */
  NbRd: number;
  utilisation: number;
  /** Largest simple-construction combined check of the lift's pieces; null when no nominal moments act. */
  combined: number | null;
  /** The combination (EN 1990 eq. 6.10, 6.10a or 6.10b) of that combined check; null without one or in older results. */
  combinedCombination: string | null;
  governing: GoverningMode;
  isGoverningLift: boolean;
}

export const GOVERNING_WORD: Record<GoverningMode, string> = CHECK_NAMES;

const N_PER_KN = 1000;

/** The piece with the highest utilisation; the lowest one on a tie. */
export function worstPiece(lift: LiftResult): PieceCheck | null {
  let worst: PieceCheck | null = null;
  for (const p of lift.pieces) if (!worst || p.utilisation > worst.utilisation) worst = p;
  return worst;
}

/** The largest combined check of the lift's pieces, with the combination it was made for. */
function worstCombined(lift: LiftResult): { combined: number | null; combinedCombination: string | null } {
  let worst: PieceCheck['combined'] | null = null;
  for (const p of lift.pieces)
    if (p.combined && (!worst || p.combined.utilisation > worst.utilisation)) worst = p.combined;
  return { combined: worst?.utilisation ?? null, combinedCombination: worst?.combination ?? null };
}

export function liftRows(results: StackResult | null, doc: StackDocument | null): LiftRow[] {
  if (!results) return [];
  const names = doc ? liftNumbers(doc) : new Map<string, string>();
  return results.lifts.flatMap((lift) => {
    const piece = worstPiece(lift);
    if (!piece) return [];
    const c = piece.check;
    return [
      {
        liftId: lift.liftId,
        name: names.get(lift.liftId) ?? lift.liftId,
        section: lift.section,
        grade: lift.grade,
        bottom: lift.bottom,
        top: lift.top,
        NEd: piece.NEd,
        LcrY: piece.LcrY,
        LcrZ: piece.LcrZ,
        lambdaBarY: c.lambdaBarY,
        lambdaBarZ: c.lambdaBarZ,
        chiY: c.chiY,
        chiZ: c.chiZ,
        NbRd: c.NbRd / N_PER_KN,
        utilisation: lift.utilisation,
        ...worstCombined(lift),
        governing: lift.governing,
        isGoverningLift: results.governingLiftId === lift.liftId,
      },
    ];
  });
}
