// The one service that changes a stack document (docs/contracts.md §Edits): the REST PUT and ops routes and the live
// channel all come here. Each change is one transaction: check the base version, apply, analyse,
// store the new version with its results, its ops and an audit row; broadcast after commit.
import type { Knex } from 'knex';
import type { Level, User } from '../../shared/schema/api.ts';
import type { BuildingStackChanged } from '../../shared/schema/socket.ts';
import type { Op } from '../../shared/schema/ops.ts';
import type { StackResult } from '../../shared/schema/results.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { applyOps as applyOpsToDoc, OpError, touchedIds } from '../../shared/ops/applyOps.ts';
import type { ServerContext } from '../context.ts';
import { now } from '../db.ts';
import { conflict, unprocessable } from '../errors.ts';
import {
  analyse,
  analysisInputs,
  storedResultColumns,
  summariseResult,
  withPositions,
  type AnalysisInputs,
  type ResultSummary,
} from './analysis.ts';
import { recordAudit } from './audit.ts';
import { touchBuilding } from './buildings.ts';
import { assertDocSound } from './docChecks.ts';
import { diffDocs } from './docDiff.ts';
import { assertUniqueIds, loadStackRow, parseDoc, placeOf, type StackRow } from './stackRows.ts';
import type { OffThread } from '../offThread/pool.ts';
import { editOffThread, isLarge, LARGE_STACK_LIFTS, yieldToLoop } from './stackEditOffThread.ts';

export interface CommittedChange {
  stackId: number;
  buildingId: number;
  version: number;
  doc: StackDocument;
  results: StackResult;
  ops: Op[];
  summary: ResultSummary;
}

/** Stores doc as the next version of row; refuses (409) when another writer got there first. */
export async function commitDoc(
  trx: Knex,
  row: Pick<StackRow, 'id' | 'building_id' | 'version' | 'grid_x' | 'grid_y' | 'web_along'>,
  change: { doc: StackDocument; ops: Op[]; touched: Set<string>; userId: number | null; action: string },
  inputs: AnalysisInputs,
  /** Results worked out beforehand (on the worker thread) for exactly this document and these inputs. */
  precomputed?: StackResult,
): Promise<CommittedChange> {
  // Results worked out elsewhere carry the stack's own place; a typical column's further positions are added here.
  const results = precomputed
    ? withPositions(precomputed, change.doc, inputs, placeOf(row))
    : analyse(change.doc, inputs, placeOf(row));
  const version = row.version + 1;
  const columns = {
    doc: JSON.stringify(change.doc),
    version,
    ...(await storedResultColumns(trx, change.doc, results)),
    updated_at: now(),
  };
  // A large stack (results computed off the main thread) is encoded and written in separate turns of the loop.
  if (precomputed) await yieldToLoop();
  const updated = await trx('stacks').where({ id: row.id, version: row.version }).update(columns);
  if (precomputed) await yieldToLoop();
  if (updated === 0)
    throw conflict('The stack was changed by someone else; reload and try again', { version: row.version });
  await trx('stack_ops').insert({
    stack_id: row.id,
    version,
    ops: JSON.stringify(change.ops),
    touched: JSON.stringify([...change.touched]),
    user_id: change.userId,
    created_at: now(),
  });
  await recordAudit(trx, {
    userId: change.userId,
    buildingId: row.building_id,
    stackId: row.id,
    action: change.action,
    version,
    detail: { ops: change.ops.length },
  });
  await touchBuilding(trx, row.building_id);
  return {
    stackId: row.id,
    buildingId: row.building_id,
    version,
    doc: change.doc,
    results,
    ops: change.ops,
    summary: summariseResult(change.doc, results),
  };
}

export async function assertNoOverlap(
  trx: Knex,
  row: StackRow,
  baseVersion: number,
  touched: Set<string>,
): Promise<void> {
  if (baseVersion > row.version)
    throw conflict(`Version ${baseVersion} of this stack does not exist yet`, { version: row.version });
  if (baseVersion === row.version) return;
  const since = await trx('stack_ops')
    .where('stack_id', row.id)
    .andWhere('version', '>', baseVersion)
    .select<{ touched: string }[]>('touched');
  if (since.length < row.version - baseVersion)
    throw conflict('This edit is based on a version too old to merge; reload the stack', { version: row.version });
  const clashes = new Set<string>();
  for (const r of since) for (const id of JSON.parse(r.touched) as string[]) if (touched.has(id)) clashes.add(id);
  if (clashes.size > 0) {
    throw conflict(`Someone else has changed ${[...clashes].join(', ')} since version ${baseVersion}`, {
      version: row.version,
      ids: [...clashes],
    });
  }
}

export interface OpsInput {
  stackId: number;
  baseVersion: number;
  ops: Op[];
  userId: number | null;
  /** With it, edits of large stacks are computed on a worker thread (stackEditOffThread.ts). */
  offThread?: OffThread;
}

/** Applies ops made against baseVersion; merged when nobody has touched the same nodes or edges since. */
export async function applyOps(db: Knex, input: OpsInput): Promise<CommittedChange> {
  return db.transaction(async (trx) => {
    const row = await loadStackRow(trx, input.stackId, { lock: true });
    if (input.offThread && isLarge(row)) return editOffThread(trx, row, input, input.offThread);
    const doc = parseDoc(row.doc);
    const touched = touchedIds(doc, input.ops);
    await assertNoOverlap(trx, row, input.baseVersion, touched);
    let next: StackDocument;
    try {
      next = applyOpsToDoc(doc, input.ops);
    } catch (e) {
      if (e instanceof OpError) throw unprocessable(e.message, { opIndex: e.opIndex, id: e.id });
      throw e;
    }
    const inputs = await analysisInputs(trx, row.building_id);
    assertDocSound(next, inputs.levels, touched);
    return commitDoc(
      trx,
      row,
      { doc: next, ops: input.ops, touched, userId: input.userId, action: 'stack.edit' },
      inputs,
    );
  });
}

/**
 * Replaces the whole document (REST PUT). Only on the current version: a whole document cannot be
 * merged. Recorded as the ops that turn the old document into the new one.
 */
export async function replaceDoc(
  db: Knex,
  input: { stackId: number; baseVersion: number; doc: StackDocument; userId: number | null },
): Promise<CommittedChange | null> {
  assertUniqueIds(input.doc);
  return db.transaction(async (trx) => {
    const row = await loadStackRow(trx, input.stackId, { lock: true });
    if (input.baseVersion !== row.version)
      throw conflict(`The stack is at version ${row.version}, not ${input.baseVersion}; reload and try again`, {
        version: row.version,
      });
    const before = parseDoc(row.doc);
    const ops = diffDocs(before, input.doc);
    if (ops.length === 0) return null;
    const touched = touchedIds(before, ops);
    const inputs = await analysisInputs(trx, row.building_id);
    assertDocSound(input.doc, inputs.levels, touched);
    return commitDoc(trx, row, { doc: input.doc, ops, touched, userId: input.userId, action: 'stack.replace' }, inputs);
  });
}

export function broadcastChange(
  ctx: ServerContext,
  c: CommittedChange,
  by: { userId: number; name: string },
  /** The building's levels when the change moved one (docs/live-protocol.md); the edit's own id when it gave one. */
  extra: { levels?: Level[]; editId?: string } = {},
): void {
  broadcastChanges(ctx, [c], by, extra);
}

/** A building room's summary of one stack's new version. */
function stackSummary(c: CommittedChange): BuildingStackChanged {
  return {
    buildingId: c.buildingId,
    stackId: c.stackId,
    version: c.version,
    utilisation: c.summary.utilisation,
    governingLiftId: c.summary.governingLiftId,
    governingLiftLabel: c.summary.governingLiftLabel,
    governingSection: c.summary.governingSection,
    status: c.summary.status,
    ...(c.results.positions ? { positions: c.results.positions, governingPosition: c.results.governingPosition } : {}),
  };
}

/**
 * The changes of one write, after commit: each to its stack's room, and to the building's room as one summary
 * (`building:stack-changed`) or, when the write changed several stacks of the building, one message with all
 * of their summaries (`building:stacks-changed`; docs/live-protocol.md).
 */
export function broadcastChanges(
  ctx: ServerContext,
  changes: readonly CommittedChange[],
  by: { userId: number; name: string },
  extra: { levels?: Level[]; editId?: string } = {},
): void {
  try {
    for (const c of changes)
      ctx.broadcaster.stackChanged({
        buildingId: c.buildingId,
        stackId: c.stackId,
        version: c.version,
        ops: c.ops,
        results: c.results,
        by,
        ...(extra.levels ? { levels: extra.levels } : {}),
        ...(extra.editId ? { editId: extra.editId } : {}),
      });
    const byBuilding = new Map<number, CommittedChange[]>();
    for (const c of changes) {
      const some = byBuilding.get(c.buildingId);
      if (some) some.push(c);
      else byBuilding.set(c.buildingId, [c]);
    }
    for (const [buildingId, some] of byBuilding) {
      if (some.length === 1) ctx.broadcaster.buildingStackChanged(stackSummary(some[0]));
      else ctx.broadcaster.buildingStacksChanged({ buildingId, stacks: some.map(stackSummary) });
    }
  } catch (e) {
    // The changes are committed; a failed notification must not turn them into an error reply.
    ctx.log.error({ err: e, stackIds: changes.map((c) => c.stackId) }, 'broadcast failed');
  }
}

/** applyOps then broadcast: what the REST ops route and the live channel call. The client's edit id, when it
 *  gave one, goes out with the broadcast so the client knows its own edit (docs/live-protocol.md). */
export async function editStack(
  ctx: ServerContext,
  input: Omit<OpsInput, 'userId'>,
  user: User,
  editId?: string,
): Promise<CommittedChange> {
  const change = await applyOps(ctx.db, { ...input, userId: user.id, offThread: ctx.offThread });
  // Storing a large stack and encoding its broadcast are each tens of milliseconds: not in one turn.
  if (change.results.lifts.length > LARGE_STACK_LIFTS) await yieldToLoop();
  broadcastChange(ctx, change, { userId: user.id, name: user.name }, { editId });
  return change;
}
