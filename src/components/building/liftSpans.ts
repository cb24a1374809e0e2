// The lifts a template makes: a splice every n storeys, the top lift taking what is left. The grouping is
// the one the server builds the stack with (shared/ops/stackFromTemplate.ts).
import { MAX_TEMPLATE_STOREYS } from '@shared/schema/api.ts';
import { liftFloorRanges, templateFloors } from '@shared/ops/stackFromTemplate.ts';

export interface LiftSpan {
  index: number;
  bottom: number;
  top: number;
  /** The building levels at the span's ends, when the floors are the building's levels. */
  bottomName?: string;
  topName?: string;
}

/** Lifts over floors given bottom first (elevation in m, and a level name where there is one). */
export function liftSpans(floors: readonly { elevation: number; name?: string }[], spliceEvery: number): LiftSpan[] {
  if (floors.length < 2 || !Number.isInteger(spliceEvery) || spliceEvery < 1) return [];
  return liftFloorRanges(floors.length - 1, spliceEvery).map(({ bottom, top }, i) => ({
    index: i + 1,
    bottom: floors[bottom].elevation,
    top: floors[top].elevation,
    ...(floors[bottom].name !== undefined ? { bottomName: floors[bottom].name } : {}),
    ...(floors[top].name !== undefined ? { topName: floors[top].name } : {}),
  }));
}

export function templateLiftSpans(
  storeys: number,
  storeyHeight: number,
  spliceEvery: number,
  baseElevation: number,
): LiftSpan[] {
  // Input the template refuses lists no lifts (the form says why on submitting).
  const usable =
    Number.isInteger(storeys) &&
    storeys >= 1 &&
    storeys <= MAX_TEMPLATE_STOREYS &&
    storeyHeight > 0 &&
    Number.isFinite(baseElevation);
  if (!usable) return [];
  const floors = templateFloors({ storeys, storeyHeight, baseElevation });
  return liftSpans(
    floors.map((elevation) => ({ elevation })),
    spliceEvery,
  );
}
