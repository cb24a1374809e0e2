// One row per point where load enters the selected stack, top to bottom, as the take-down table shows it:
// where (level name, "Cap" or "Floor"), the loads entering, n and αn, the totals and NEd just below.
import type { Level } from '@shared/schema/api.ts';
import type { TakeDownRow } from '@shared/schema/results.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import { levelWord } from '@shared/wording.ts';

export interface TakeDownView extends TakeDownRow {
  where: string;
  sumQkText: string;
}

export function takeDownRows(
  rows: readonly TakeDownRow[],
  doc: StackDocument,
  levels: readonly Level[],
): TakeDownView[] {
  const levelName = new Map(levels.map((l) => [l.id, l.name]));
  const byId = new Map(doc.nodes.map((n) => [n.id, n]));
  return rows.map((r) => {
    const node = byId.get(r.nodeId);
    const levelId = node && (node.kind === 'restraint' || node.kind === 'cap') ? node.data.levelId : undefined;
    const named = levelId ? levelName.get(levelId) : undefined;
    const where =
      node?.kind === 'cap' ? (named ? `Cap, ${levelWord(named)}` : 'Cap') : named ? levelWord(named) : 'Floor';
    const sumQkText =
      Object.entries(r.sumQkByCategory)
        .map(([c, q]) => `${c} ${q.toFixed(0)}`)
        .join(' · ') || '–';
    return { ...r, where, sumQkText };
  });
}
