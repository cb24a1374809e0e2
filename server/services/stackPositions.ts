// Typical columns (docs/typical-columns.md): the further crossings a stack stands at and their areas set by hand.
// Adding or removing one is one transaction that stores it and re-analyses the stack at every position as a new
// version; the live rooms hear after commit as for any edit. A position's areas set by hand are written as a
// stack's are (`putAreaOverrides`).
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import { positionOverridesKey, type AreaOverride } from '../../shared/schema/building.ts';
import type {
  AddStackPositionBody,
  BuildingPositionsReply,
  StackPositionsReply,
} from '../../shared/schema/stackPositions.ts';
import type { ServerContext } from '../context.ts';
import { onUniqueViolation } from '../dbErrors.ts';
import { now } from '../db.ts';
import { conflict, notFound, unprocessable } from '../errors.ts';
import { analysisInputs } from './analysis.ts';
import { broadcastModelChange, dropOverrides, putAreaOverrides } from './buildingModel.ts';
import { readModel } from './buildingModelStore.ts';
import { broadcastChange, commitDoc, type CommittedChange } from './stackOps.ts';
import { positionsOf, toStackPosition } from './stackPositionRows.ts';
import { joinResults, loadStackRow, parseDoc, parseResults, STORED_RESULTS, type StackRow } from './stackRows.ts';

/** A guard against absurd input, not a design limit: a type rarely stands at more than a few dozen places. */
export const MAX_POSITIONS = 400;

async function reply(db: Knex, row: Pick<StackRow, 'id' | 'building_id' | 'version' | 'results' | 'results_packed'>) {
  const { model } = await readModel(db, row.building_id);
  const results = parseResults(row);
  const out: StackPositionsReply = {
    stackId: row.id,
    version: row.version,
    positions: (await positionsOf(db, row.id)).map((p) => toStackPosition(model, p)),
    results: results.positions ?? [],
    governingPosition: results.governingPosition ?? null,
  };
  return out;
}

export async function listStackPositions(db: Knex, stackId: number): Promise<StackPositionsReply> {
  return reply(db, await loadStackRow(db, stackId));
}

/** Re-analyses the stack at every position as its next version, inside the caller's transaction. */
async function reanalyse(trx: Knex, row: StackRow, user: User, action: string): Promise<CommittedChange> {
  const inputs = await analysisInputs(trx, row.building_id);
  const change = { doc: parseDoc(row.doc), ops: [], touched: new Set<string>(), userId: user.id, action };
  return commitDoc(trx, row, change, inputs);
}

async function afterCommit(ctx: ServerContext, committed: CommittedChange, user: User): Promise<StackPositionsReply> {
  broadcastChange(ctx, committed, { userId: user.id, name: user.name });
  return reply(ctx.db, await loadStackRow(ctx.db, committed.stackId));
}

export async function addStackPosition(
  ctx: ServerContext,
  stackId: number,
  body: AddStackPositionBody,
  user: User,
): Promise<StackPositionsReply> {
  const committed = await ctx.db.transaction(async (trx) => {
    const row = await loadStackRow(trx, stackId, { lock: true });
    const buildingId = row.building_id;
    if (row.grid_x === null || row.grid_y === null)
      throw unprocessable('Place the stack on the grid before giving it further positions');
    const { model } = await readModel(trx, buildingId);
    if (!model.grid.x.lines.some((l) => l.id === body.gridX))
      throw unprocessable(`The grid has no x line ${body.gridX}`, { gridX: body.gridX });
    if (!model.grid.y.lines.some((l) => l.id === body.gridY))
      throw unprocessable(`The grid has no y line ${body.gridY}`, { gridY: body.gridY });
    const at = { building_id: buildingId, grid_x: body.gridX, grid_y: body.gridY };
    const stack = await trx('stacks').where(at).first<{ name: string } | undefined>('name');
    if (stack) throw conflict(`Stack ${stack.name} already stands there`);
    const clash = () => conflict('Another stack already stands there as a typical column');
    if (await trx('stack_positions').where(at).first('id')) throw clash();
    const count = await trx('stack_positions').where({ stack_id: stackId }).count<{ n: number | string }[]>('* as n');
    if (Number(count[0]?.n ?? 0) >= MAX_POSITIONS)
      throw unprocessable(`A stack may stand at ${MAX_POSITIONS} further positions at most`);
    await onUniqueViolation(
      () => trx('stack_positions').insert({ ...at, stack_id: stackId, web_along: body.webAlong, created_at: now() }),
      clash,
    );
    return reanalyse(trx, row, user, 'stack.position-add');
  });
  return afterCommit(ctx, committed, user);
}

export async function removeStackPosition(
  ctx: ServerContext,
  stackId: number,
  positionId: number,
  user: User,
): Promise<StackPositionsReply> {
  const { committed, dropped, buildingId } = await ctx.db.transaction(async (trx) => {
    const stack = await trx('stacks').where({ id: stackId }).first<{ building_id: number } | undefined>('building_id');
    if (!stack) throw notFound('Stack');
    // The model before the stack row, in the order every write of the model locks them (docs/typical-columns.md).
    const read = await readModel(trx, stack.building_id, { lock: true });
    const row = await loadStackRow(trx, stackId, { lock: true });
    const removed = await trx('stack_positions').where({ id: positionId, stack_id: stackId }).delete();
    if (removed === 0) throw notFound('Position');
    return {
      dropped: await dropOverrides(trx, row.building_id, read, [positionOverridesKey(positionId)], user, {
        positionId,
        overrides: 0,
      }),
      committed: await reanalyse(trx, row, user, 'stack.position-remove'),
      buildingId: row.building_id,
    };
  });
  if (dropped) broadcastModelChange(ctx, buildingId, dropped, user);
  return afterCommit(ctx, committed, user);
}

/** A further position's areas set by hand (voids, openings, cores); an empty list gives it the grid's areas again. */
export async function putPositionAreaOverrides(
  ctx: ServerContext,
  stackId: number,
  positionId: number,
  overrides: AreaOverride[],
  user: User,
): Promise<StackPositionsReply> {
  await putAreaOverrides(ctx, stackId, overrides, user, positionId);
  return listStackPositions(ctx.db, stackId);
}

/** Every typical column of a building with each position's check, for the plan view. */
export async function buildingPositions(db: Knex, buildingId: number): Promise<BuildingPositionsReply> {
  const rows = await joinResults(db<StackRow>('stacks'))
    .where({ building_id: buildingId })
    .whereIn('id', db('stack_positions').where({ building_id: buildingId }).select('stack_id'))
    .orderBy('id')
    .select<Pick<StackRow, 'id' | 'results' | 'results_packed'>[]>('id', ...STORED_RESULTS);
  return {
    buildingId,
    stacks: rows.map((r) => {
      const results = parseResults(r);
      return {
        stackId: r.id,
        results: results.positions ?? [],
        governingPosition: results.governingPosition ?? null,
      };
    }),
  };
}
