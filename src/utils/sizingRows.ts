// The sizing preview as table rows, the mass totals of what is ticked, and the ops that accept it.
// Pure: the dialog and the store both use these, and the client tests check them directly.
import type { Op } from '@shared/schema/ops.ts';
import type { LiftSizing, StackSizingPreview } from '@shared/schema/sizing.ts';

export interface PreviewRow {
  /** `${stackId}:${liftId}`, the key of the tick box. */
  key: string;
  stackId: number;
  stackName: string;
  lift: LiftSizing;
  /** Only a changed section can be ticked; unchanged, none and blocked rows are for reading. */
  selectable: boolean;
}

export const rowKey = (stackId: number, liftId: string): string => `${stackId}:${liftId}`;

/** Stacks in the order given, lifts from the top down as an engineer reads a column schedule. */
export function previewRows(previews: readonly StackSizingPreview[]): PreviewRow[] {
  return previews.flatMap((p) =>
    [...p.lifts].reverse().map((lift) => ({
      key: rowKey(p.stackId, lift.liftId),
      stackId: p.stackId,
      stackName: p.name,
      lift,
      selectable: lift.status === 'proposed',
    })),
  );
}

/** Every row that can be accepted, ticked. */
export function allSelectable(previews: readonly StackSizingPreview[]): Set<string> {
  return new Set(
    previewRows(previews)
      .filter((r) => r.selectable)
      .map((r) => r.key),
  );
}

export interface MassTotals {
  /** kg, stacks without errors. */
  before: number;
  /** kg, with the ticked lifts changed and the others as they are. */
  after: number;
}

export function massTotals(previews: readonly StackSizingPreview[], chosen: ReadonlySet<string>): MassTotals {
  let before = 0;
  let after = 0;
  for (const p of previews) {
    if (p.massBefore === null) continue;
    for (const lift of p.lifts) {
      const length = lift.top - lift.bottom;
      before += lift.before.massPerMetre * length;
      const taken = lift.after && chosen.has(rowKey(p.stackId, lift.liftId)) ? lift.after : lift.before;
      after += taken.massPerMetre * length;
    }
  }
  return { before, after };
}

/** updateNode ops for the ticked lifts of one stack: section and grade, nothing else. */
export function acceptOps(preview: StackSizingPreview, chosen: ReadonlySet<string>): Op[] {
  return preview.lifts
    .filter((l) => l.status === 'proposed' && l.after && chosen.has(rowKey(preview.stackId, l.liftId)))
    .map((l) => ({ op: 'updateNode', id: l.liftId, data: { section: l.after!.section, grade: l.after!.grade } }));
}

/** "1 234 kg" with a thin space between thousands, as on drawings; tonnes above 10 t. */
export function formatMass(kg: number): string {
  if (kg >= 10_000) return `${(kg / 1000).toFixed(1)} t`;
  return `${Math.round(kg).toLocaleString('en-GB').replace(/,/g, '\u2009')} kg`;
}
