// The frozen content of a revision: every stack's document and results, the levels, the analysis
// options and the engine version, as canonical JSON (keys sorted) with its SHA-256.
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { placeOnLevels } from '../../shared/engine/stack/placeOnLevels.ts';
import type { RevisionSnapshot, SnapshotStack } from '../../shared/schema/revisions.ts';
import { getBuildingOptions } from './buildings.ts';
import { listLevels } from './levels.ts';
import type { SectionDims } from '../../shared/schema/stack.ts';
import { analyseWithLoads, analysisInputs, floorLoadsOf, positionPlaces } from './analysis.ts';
import { readModel } from './buildingModelStore.ts';
import { companySectionMap } from './companySections.ts';
import { inTurns, yieldToLoop } from './stackEditOffThread.ts';
import { joinResults, parseDoc, parseResults, placeOf, STORED_RESULTS, type StackRow } from './stackRows.ts';

/** JSON with object keys in code-point order at every depth, so equal content gives equal text. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => {
    if (v === null || typeof v !== 'object' || Array.isArray(v)) return v;
    const sorted: Record<string, unknown> = {};
    for (const k of Object.keys(v).sort()) sorted[k] = (v as Record<string, unknown>)[k];
    return sorted;
  });
}

/** Bytes digested at a time between turns of the event loop: freezing 40 stacks × 30 storeys writes and digests
 *  5–10 MB, which in one piece held every request and live edit of the process for 0.5–0.7 s. */
const DIGEST_CHUNK = 1 << 20;

/** The SHA-256 of a text (UTF-8) in hex, digested a megabyte at a time with the event loop turning between. */
export async function sha256HexInTurns(text: string): Promise<string> {
  const bytes = Buffer.from(text, 'utf8');
  const hash = createHash('sha256');
  for (let i = 0; i < bytes.length; i += DIGEST_CHUNK) {
    hash.update(bytes.subarray(i, i + DIGEST_CHUNK));
    await yieldToLoop();
  }
  return hash.digest('hex');
}

/**
 * `canonicalJson` of a snapshot, the same text, written a stack at a time with the event loop turning between:
 * the top-level keys in order as canonicalJson sorts them, `stacks` element by element.
 */
export async function snapshotJsonInTurns(snapshot: RevisionSnapshot): Promise<string> {
  const fields = Object.entries(snapshot)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  const parts: string[] = [];
  for (const [key, value] of fields) {
    const text =
      key === 'stacks' ? `[${(await inTurns(snapshot.stacks, canonicalJson)).join(',')}]` : canonicalJson(value);
    parts.push(`${JSON.stringify(key)}:${text}`);
  }
  return `{${parts.join(',')}}`;
}

/** Grid references in natural order: "A/2" before "A/10". */
export const byStackName = (a: { name: string; id: number }, b: { name: string; id: number }) =>
  a.name.localeCompare(b.name, 'en', { numeric: true, sensitivity: 'base' }) || a.id - b.id;

/**
 * Every stack as it stands, its tied nodes placed on the building's levels: a frozen document carries the
 * elevations its package and comparisons print, beside the levels frozen with it (docs/stack-editing.md).
 */
export async function snapshotStacks(db: Knex, buildingId: number): Promise<SnapshotStack[]> {
  const [rows, levels] = await Promise.all([
    joinResults(db<StackRow>('stacks'))
      .where({ building_id: buildingId })
      .select('id', 'name', 'version', 'doc', ...STORED_RESULTS, 'grid_x', 'grid_y', 'web_along'),
    listLevels(db, buildingId),
  ]);
  const stacks = await inTurns(rows, (r) => {
    const stack: SnapshotStack = {
      id: r.id,
      name: r.name,
      version: r.version,
      doc: placeOnLevels(parseDoc(r.doc), levels),
      results: parseResults(r),
    };
    const { gridX, gridY, webAlong } = placeOf(r);
    if (gridX !== null) stack.placement = { gridX, gridY, webAlong };
    return stack;
  });
  return stacks.sort(byStackName);
}

/**
 * Adds to each typical column whose check a further position governs the full results at that position, analysed
 * with the same inputs as its stored results (the engine is a pure function of them), so the package can print
 * the working that governs the type, not only the own place's (docs/typical-columns.md).
 */
export async function addGoverningWorking(db: Knex, buildingId: number, stacks: SnapshotStack[]): Promise<void> {
  const governedElsewhere = stacks.filter((s) =>
    s.results.positions?.some((p) => p.positionId !== null && p.name === s.results.governingPosition),
  );
  if (governedElsewhere.length === 0) return;
  const inputs = await analysisInputs(db, buildingId);
  for (const stack of governedElsewhere) {
    const place = { stackId: stack.id, gridX: null, gridY: null, webAlong: 'x' as const, ...stack.placement };
    const at = positionPlaces(inputs, place).find((p) => p.name === stack.results.governingPosition);
    if (!at) continue;
    stack.governingWorking = {
      position: at.name,
      results: analyseWithLoads(stack.doc, inputs, floorLoadsOf(inputs, at.place)),
    };
  }
}

function usedOwnSections(stacks: SnapshotStack[], own: Map<string, SectionDims>): Record<string, SectionDims> {
  const used: Record<string, SectionDims> = {};
  for (const s of stacks)
    for (const n of s.doc.nodes)
      if (n.kind === 'lift' && typeof n.data.section === 'string') {
        const dims = own.get(n.data.section);
        if (dims) used[n.data.section] = dims;
      }
  return used;
}

export type SnapshotMeta = Omit<RevisionSnapshot, 'format' | 'options' | 'levels' | 'stacks' | 'sections'>;

export async function takeSnapshot(
  db: Knex,
  meta: SnapshotMeta,
  stacks: SnapshotStack[],
): Promise<{ snapshot: RevisionSnapshot; text: string; hash: string }> {
  const [options, levels, stored, own] = await Promise.all([
    getBuildingOptions(db, meta.building.id),
    listLevels(db, meta.building.id),
    readModel(db, meta.building.id),
    companySectionMap(db, meta.building.id),
  ]);
  const snapshot: RevisionSnapshot = { format: 1, ...meta, options, levels, stacks };
  // What the derived loads came from; a building without a model freezes exactly as before.
  if (stored.version > 0) snapshot.buildingModel = stored.model;
  // The building's own sections its lifts use, so the package's column schedule can weigh them.
  const used = usedOwnSections(stacks, own);
  if (Object.keys(used).length > 0) snapshot.sections = used;
  const text = await snapshotJsonInTurns(snapshot);
  return { snapshot, text, hash: await sha256HexInTurns(text) };
}
