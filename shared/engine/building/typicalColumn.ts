// A typical column (docs/typical-columns.md): one design standing at several crossings, each with its own
// floor loads. Each position is analysed on its own; these turn its results into the short form the stack,
// the building and the schedule show, and name the position that governs the type.
import type { StackResult } from '../../schema/results.ts';
import type { PositionResult } from '../../schema/stackPositions.ts';

export interface PositionPlace {
  /** null: the stack's own place. */
  positionId: number | null;
  gridX: string;
  gridY: string;
  name: string;
}

/** The check of the design at one position, from that position's full results. */
export function positionResult(place: PositionPlace, result: StackResult): PositionResult {
  const governing = result.lifts.find((l) => l.liftId === result.governingLiftId) ?? null;
  const utilisation = result.errors.length === 0 && governing ? governing.utilisation : null;
  // EN 1993-1-1 6.3.1.1(1): the design force must not exceed the resistance, i.e. utilisation ≤ 1.0.
  const status = utilisation === null ? 'errors' : utilisation > 1 ? 'fails' : 'passes';
  return {
    ...place,
    area: (result.floorLoads ?? []).reduce((sum, use) => sum + use.area, 0),
    utilisation,
    status,
    governingLiftId: governing?.liftId ?? null,
    governingLiftLabel: governing ? (governing.label ?? governing.liftId) : null,
    governingSection: governing?.section ?? null,
    lifts: result.lifts.map((l) => ({
      liftId: l.liftId,
      label: l.label ?? l.liftId,
      utilisation: l.utilisation,
      governing: l.governing,
      NEd: Math.max(0, ...l.pieces.map((p) => p.NEd)),
    })),
    errors: result.errors.map((e) => e.message),
  };
}

/**
 * The position that governs the type: one the design cannot be checked at (errors) first, else the highest
 * utilisation; on a tie the first listed (the stack's own place comes first).
 */
export function governingPosition(positions: readonly PositionResult[]): PositionResult | null {
  let worst: PositionResult | null = null;
  const rank = (p: PositionResult) => (p.utilisation === null ? Infinity : p.utilisation);
  for (const p of positions) if (!worst || rank(p) > rank(worst)) worst = p;
  return worst;
}

/** The own results with every position's check beside them and the governing position named. */
export function withPositionResults(own: StackResult, positions: PositionResult[]): StackResult {
  const governing = governingPosition(positions);
  return governing ? { ...own, positions, governingPosition: governing.name } : own;
}
