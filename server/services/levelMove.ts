// What moving a level does to the stacks of a building, worked out before anything is stored: every node
// on the level follows it, and every splice whose floor is that level keeps its offset above it. The same
// plan serves the preview (what the engineer sees before saving) and the move itself, which is refused
// when it would break a stack. See docs/stack-editing.md.
//
// The level row is the one place its elevation is stored: nodes tied to it follow by being placed on the
// levels wherever an elevation is read (shared/engine/stack/placeOnLevels.ts), so the move writes nothing
// into them. Only splices, which stand at their own elevation, are written; every stack using the level is
// stored again with results at the level's new place.
import type { Knex } from 'knex';
import type { LevelMovePreview } from '../../shared/schema/api.ts';
import type { Op } from '../../shared/schema/ops.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { applyOps } from '../../shared/ops/applyOps.ts';
import { isPlaceable } from '../../shared/engine/stack/placeOnLevels.ts';
import { analyse, analysisInputs, type AnalysisInputs } from './analysis.ts';
import { parseDoc, type StackRow } from './stackRows.ts';

export interface StackMove {
  row: StackRow;
  doc: StackDocument;
  /** Splice moves only; empty when the stack has only nodes tied to the level. */
  ops: Op[];
}

export interface LevelMovePlan {
  moves: StackMove[];
  /** Analysis inputs with the level at its new elevation. */
  inputs: AnalysisInputs;
  preview: LevelMovePreview;
}

/** The level a splice belongs to: the highest level at or below it (a splice stands a little above its floor). */
function floorOf(z: number, levels: ReadonlyMap<string, number>): string | null {
  let best: [string, number] | null = null;
  for (const [id, e] of levels) if (e <= z + 1e-6 && (!best || e > best[1])) best = [id, e];
  return best?.[0] ?? null;
}

/** How many of a document's nodes sit on the level (a restraint, the cap, the support). */
export function tiedCount(doc: StackDocument, levelId: string): number {
  return doc.nodes.filter((n) => isPlaceable(n) && n.data.levelId === levelId).length;
}

/** Ops that keep each splice whose floor is the level at its offset above it; the levels are as they stand. */
export function followLevel(
  doc: StackDocument,
  levelId: string,
  from: number,
  to: number,
  levels: ReadonlyMap<string, number>,
): Op[] {
  const delta = to - from;
  return doc.nodes.flatMap((n): Op[] =>
    n.kind === 'splice' && floorOf(n.data.elevation, levels) === levelId
      ? [{ op: 'updateNode', id: n.id, data: { elevation: Math.round((n.data.elevation + delta) * 1e6) / 1e6 } }]
      : [],
  );
}

export async function planLevelMove(
  db: Knex,
  buildingId: number,
  levelId: string,
  from: number,
  to: number,
): Promise<LevelMovePlan> {
  const before = await analysisInputs(db, buildingId);
  const inputs: AnalysisInputs = { ...before, levels: new Map(before.levels).set(levelId, to) };
  const rows = await db<StackRow>('stacks').where({ building_id: buildingId }).orderBy('name');
  const moves: StackMove[] = [];
  const preview: LevelMovePreview = { elevation: to, stacks: [] };
  for (const row of rows) {
    const doc = parseDoc(row.doc);
    const nodes = tiedCount(doc, levelId);
    const ops = followLevel(doc, levelId, from, to, before.levels);
    if (!nodes && !ops.length) continue;
    const moved = ops.length ? applyOps(doc, ops) : doc;
    const known = new Set(analyse(doc, before).errors.map((e) => e.message));
    const breaks = analyse(moved, inputs)
      .errors.map((e) => e.message)
      .filter((m) => !known.has(m));
    moves.push({ row, doc: moved, ops });
    preview.stacks.push({ stackId: row.id, name: row.name, nodes, splices: ops.length, breaks });
  }
  return { moves, inputs, preview };
}
