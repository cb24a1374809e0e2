// Where a level load lands: the restraint (or the cap) of a stack at a named level. Shared by the
// loads import and the loads template, so a downloaded template always re-imports to the same nodes.
import type { Knex } from 'knex';
import { nodeElevation } from '../../shared/engine/stack/placeOnLevels.ts';
import type { FloorLoad } from '../../shared/schema/imports.ts';
import type { NodeOf, StackDocument } from '../../shared/schema/stack.ts';
import { parseDoc, type StackRow } from './stackRows.ts';

export interface LevelRef {
  id: number;
  name: string;
  /** m */
  elevation: number;
}

export interface StackRef {
  row: StackRow;
  doc: StackDocument;
}

export type LoadedNode = NodeOf<'restraint'> | NodeOf<'cap'>;

/** Elevations are entered and printed to the millimetre, so closer than half of one is the same level. */
const SAME_ELEVATION_M = 0.0005;

export async function buildingStacks(db: Knex, buildingId: number): Promise<StackRef[]> {
  const rows = await db<StackRow>('stacks').where({ building_id: buildingId }).orderBy('name').orderBy('id');
  return rows.map((row) => ({ row, doc: parseDoc(row.doc) }));
}

export async function buildingLevels(db: Knex, buildingId: number): Promise<LevelRef[]> {
  const rows = await db('levels')
    .where({ building_id: buildingId })
    .orderBy('elevation')
    .orderBy('id')
    .select<LevelRef[]>('id', 'name', 'elevation');
  return rows.map((r) => ({ id: Number(r.id), name: r.name, elevation: Number(r.elevation) }));
}

/**
 * Restraints and a cap on the level: tied to it (levelId) or standing at its elevation, a tied node where its
 * own level is (`levels`, the building's: the copy a document carries is never trusted).
 */
export function nodesAtLevel(doc: StackDocument, level: LevelRef, levels: readonly LevelRef[]): LoadedNode[] {
  const key = String(level.id);
  const elevations = new Map(levels.map((l) => [String(l.id), l.elevation]));
  const near = (z: number) => Math.abs(z - level.elevation) < SAME_ELEVATION_M;
  return doc.nodes.filter(
    (n): n is LoadedNode =>
      (n.kind === 'restraint' || n.kind === 'cap') && (n.data.levelId === key || near(nodeElevation(n, elevations))),
  );
}

export const floorLoadOf = (node: LoadedNode): FloorLoad => ({
  Gk: node.data.Gk,
  Qk: node.data.Qk,
  category: node.data.category,
});

export const sameLoad = (a: FloorLoad, b: FloorLoad): boolean =>
  a.Gk === b.Gk && a.Qk === b.Qk && a.category === b.category;
