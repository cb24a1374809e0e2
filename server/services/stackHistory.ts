// Ops committed since a version, for a client catching up after a reconnect; a stack's history in words and the
// stack as it was at a version (docs/stack-history.md), rebuilt from its starting document and those ops.
import type { Knex } from 'knex';
import type { Level } from '../../shared/schema/api.ts';
import type { Op } from '../../shared/schema/ops.ts';
import { placeOnLevels } from '../../shared/engine/stack/placeOnLevels.ts';
import { isoTime } from '../db.ts';
import { describeOps } from '../../shared/history/describeOps.ts';
import type { HistoryEntry, StackAsOf, StackHistory } from '../../shared/history/historyTypes.ts';
import { stackOutline } from '../../shared/history/stackOutline.ts';
import { applyOps } from '../../shared/ops/applyOps.ts';
import { stackDocumentSchema, type StackDocument } from '../../shared/schema/stack.ts';
import { notFound, unprocessable } from '../errors.ts';
import { loadStackRow, parseDoc } from './stackRows.ts';
import { replaceDoc, type CommittedChange } from './stackOps.ts';

export interface CommittedOps {
  version: number;
  ops: Op[];
  by: { userId: number; name: string } | null;
  at: string;
}

export async function opsSince(db: Knex, stackId: number, since: number): Promise<CommittedOps[]> {
  const rows = await db('stack_ops as o')
    .leftJoin('users as u', 'u.id', 'o.user_id')
    .where('o.stack_id', stackId)
    .andWhere('o.version', '>', since)
    .orderBy('o.version')
    .select<{ version: number; ops: string; user_id: number | null; name: string | null; created_at: unknown }[]>(
      'o.version',
      'o.ops',
      'o.user_id',
      'u.name',
      'o.created_at',
    );
  return rows.map((r) => ({
    version: r.version,
    // Stored by stackOps after validation.
    ops: JSON.parse(r.ops) as Op[],
    by: r.user_id !== null && r.name !== null ? { userId: r.user_id, name: r.name } : null,
    at: isoTime(r.created_at),
  }));
}

interface AuditRow {
  version: number | null;
  action: string;
  detail: string;
  user_id: number | null;
  name: string | null;
  created_at: unknown;
}

async function auditRows(db: Knex, stackId: number): Promise<AuditRow[]> {
  return db('audit_log as a')
    .leftJoin('users as u', 'u.id', 'a.user_id')
    .where('a.stack_id', stackId)
    .orderBy('a.id')
    .select<AuditRow[]>('a.version', 'a.action', 'a.detail', 'a.user_id', 'u.name', 'a.created_at');
}

/** The document the stack was created with, when its creation was recorded with it. */
function startingDoc(rows: readonly AuditRow[]): StackDocument | null {
  const created = rows.find((r) => r.action === 'stack.create');
  if (!created) return null;
  const detail = JSON.parse(created.detail) as { doc?: unknown };
  const parsed = stackDocumentSchema.safeParse(detail.doc);
  return parsed.success ? parsed.data : null;
}

async function buildingLevels(db: Knex, stackId: number): Promise<Level[]> {
  const rows = await db('levels as l')
    .join('stacks as s', 's.building_id', 'l.building_id')
    .where('s.id', stackId)
    .select<{ id: number; name: string; elevation: number }[]>('l.id', 'l.name', 'l.elevation');
  return rows.map((r) => ({ id: String(r.id), name: r.name, elevation: Number(r.elevation) }));
}

async function levelNames(db: Knex, stackId: number): Promise<Map<string, string>> {
  return new Map((await buildingLevels(db, stackId)).map((l) => [l.id, l.name]));
}

/**
 * A version with its tied nodes at the building's levels as they stand now: a level's elevation
 * is stored only in its row, and its moves are in the building's audit, not in the stack's ops.
 */
function asOf(version: number, stored: StackDocument, levels: readonly Level[]): StackAsOf {
  const doc = placeOnLevels(stored, levels);
  return { version, doc, outline: stackOutline(doc, new Map(levels.map((l) => [l.id, l.name]))) };
}

/** Every version of the stack, newest first, with who made it, when, and what changed in words. */
export async function stackHistory(db: Knex, stackId: number): Promise<StackHistory> {
  const [audit, committed, levels] = await Promise.all([
    auditRows(db, stackId),
    opsSince(db, stackId, 0),
    levelNames(db, stackId),
  ]);
  const actionOf = new Map(audit.filter((r) => r.version !== null).map((r) => [Number(r.version), r.action]));
  const created = audit.find((r) => r.action === 'stack.create');
  let doc = startingDoc(audit);
  const complete = doc !== null;
  const entries: HistoryEntry[] = [];
  if (created) {
    const by =
      created.user_id !== null && created.name !== null ? { userId: created.user_id, name: created.name } : null;
    entries.push({
      version: 0,
      by,
      at: isoTime(created.created_at),
      action: 'stack.create',
      changes: ['Created the stack'],
    });
  }
  for (const c of committed) {
    let changes: string[];
    if (doc) {
      changes = describeOps(doc, c.ops, levels);
      doc = applyOps(doc, c.ops);
    } else {
      changes = [
        `${c.ops.length} change${c.ops.length === 1 ? '' : 's'} (not described: the stack's starting document was not kept)`,
      ];
    }
    entries.push({ version: c.version, by: c.by, at: c.at, action: actionOf.get(c.version) ?? 'stack.edit', changes });
  }
  return { entries: entries.reverse(), complete };
}

/** The document as it was at a version, rebuilt from the starting document and the stored ops (read only). */
export async function stackAsOf(db: Knex, stackId: number, version: number): Promise<StackAsOf> {
  const row = await loadStackRow(db, stackId);
  if (version > row.version) throw notFound('Version');
  const levels = await buildingLevels(db, stackId);
  if (version === row.version) {
    return asOf(version, parseDoc(row.doc), levels);
  }
  let doc = startingDoc(await auditRows(db, stackId));
  if (!doc)
    throw unprocessable('Earlier versions of this stack cannot be shown: its starting document was not kept', {
      version,
    });
  for (const c of await opsSince(db, stackId, 0)) {
    if (c.version > version) break;
    doc = applyOps(doc, c.ops);
  }
  return asOf(version, doc, levels);
}

/**
 * Makes an earlier version the current document again, as a new version through the one write path (recorded as the
 * ops that turn the current document into the old one, so restoring is itself undone by restoring the version
 * before it). Only from the current version, like any whole-document write; null when nothing differs.
 */
export async function restoreVersion(
  db: Knex,
  input: { stackId: number; version: number; baseVersion: number; userId: number },
): Promise<CommittedChange | null> {
  const { doc } = await stackAsOf(db, input.stackId, input.version);
  return replaceDoc(db, { stackId: input.stackId, baseVersion: input.baseVersion, doc, userId: input.userId });
}
