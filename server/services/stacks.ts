// Stacks of a building: list, read, create (empty, from a document or from a template), rename,
// delete. Edits to the document go through stackOps.ts.
import type { Knex } from 'knex';
import type { Level, Role, StackDetail, StackSummary, StackTemplate, User } from '../../shared/schema/api.ts';
import type { StackJoinAck } from '../../shared/schema/socket.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { stackFromTemplate } from '../../shared/ops/stackFromTemplate.ts';
import { placeOnLevels } from '../../shared/engine/stack/placeOnLevels.ts';
import { positionOverridesKey } from '../../shared/schema/building.ts';
import type { ServerContext } from '../context.ts';
import { now } from '../db.ts';
import { notFound } from '../errors.ts';
import { analyse, analysisInputs, storedResultColumns } from './analysis.ts';
import { recordAudit } from './audit.ts';
import { broadcastModelChange, dropOverrides } from './buildingModel.ts';
import { readModel } from './buildingModelStore.ts';
import { touchBuilding } from './buildings.ts';
import { listLevels } from './levels.ts';
import { assertUniqueIds, loadStackRow, toDetail, toSummary, type StackRow } from './stackRows.ts';
import { assertNameFree, withNameGuard } from './uniqueNames.ts';

export async function listStacks(db: Knex, buildingId: number): Promise<StackSummary[]> {
  const rows = await db<StackRow>('stacks').where({ building_id: buildingId }).orderBy('name').orderBy('id');
  return rows.map(toSummary);
}

/**
 * A stack as the API sends it, with its building's levels: the document's tied nodes are placed on the levels,
 * so no reader meets the copy of a level's elevation a stored document may carry (docs/stack-editing.md).
 */
export async function getStackWithLevels(db: Knex, id: number): Promise<{ stack: StackDetail; levels: Level[] }> {
  const row = await loadStackRow(db, id);
  const levels = await listLevels(db, row.building_id);
  const stack = toDetail(row);
  return { stack: { ...stack, doc: placeOnLevels(stack.doc, levels) }, levels };
}

export async function getStack(db: Knex, id: number): Promise<StackDetail> {
  return (await getStackWithLevels(db, id)).stack;
}

/** Everything the stack page needs on opening, for the live channel's join (docs/live-protocol.md): the
 *  document, its results, and the building's name and levels with the caller's role (null: a site admin
 *  reading as a viewer). */
export async function openStack(db: Knex, id: number, role: Role | null): Promise<StackJoinAck> {
  // The document with its tied nodes placed on the levels sent beside it (docs/stack-editing.md).
  const { stack, levels } = await getStackWithLevels(db, id);
  const building = await db('buildings').where({ id: stack.buildingId }).first<{ name: string }>('name');
  return {
    doc: stack.doc,
    version: stack.version,
    results: stack.results,
    name: stack.name,
    buildingId: stack.buildingId,
    buildingName: building.name,
    role: role ?? 'viewer',
    gridX: stack.gridX ?? null,
    levels,
  };
}

export interface NewStack {
  name: string;
  doc?: StackDocument;
  template?: StackTemplate;
}

export async function createStack(db: Knex, buildingId: number, input: NewStack, user: User): Promise<StackSummary> {
  const id = await withNameGuard('stack', input.name, () =>
    db.transaction(async (trx) => {
      await assertNameFree(trx, 'stack', buildingId, input.name);
      const doc = input.template
        ? stackFromTemplate(input.template, await listLevels(trx, buildingId))
        : (input.doc ?? { nodes: [], edges: [] });
      assertUniqueIds(doc);
      const results = analyse(doc, await analysisInputs(trx, buildingId));
      const [row] = await trx('stacks')
        .insert({
          building_id: buildingId,
          name: input.name,
          doc: JSON.stringify(doc),
          version: 0,
          ...(await storedResultColumns(trx, doc, results)),
          created_at: now(),
          updated_at: now(),
        })
        .returning<{ id: number }[]>('id');
      await recordAudit(trx, {
        userId: user.id,
        buildingId,
        stackId: row.id,
        action: 'stack.create',
        version: 0,
        detail: { name: input.name, from: input.template ? 'template' : input.doc ? 'document' : 'empty', doc },
      });
      await touchBuilding(trx, buildingId);
      return row.id;
    }),
  );
  return toSummary(await loadStackRow(db, id));
}

export async function renameStack(db: Knex, id: number, name: string, user: User): Promise<StackSummary> {
  await withNameGuard('stack', name, () =>
    db.transaction(async (trx) => {
      const row = await loadStackRow(trx, id);
      await assertNameFree(trx, 'stack', row.building_id, name, id);
      await trx('stacks').where({ id }).update({ name, updated_at: now() });
      await recordAudit(trx, {
        userId: user.id,
        buildingId: row.building_id,
        stackId: id,
        action: 'stack.rename',
        version: row.version,
        detail: { from: row.name, to: name },
      });
    }),
  );
  return toSummary(await loadStackRow(db, id));
}

/**
 * Deletes a stack with its further positions, and takes their areas set by hand out of the building model in
 * the same transaction, so a later stack can never inherit them (docs/typical-columns.md).
 */
export async function deleteStack(ctx: ServerContext, id: number, user: User): Promise<void> {
  const { buildingId, dropped } = await ctx.db.transaction(async (trx) => {
    const stack = await trx('stacks').where({ id }).first<{ building_id: number } | undefined>('building_id');
    if (!stack) throw notFound('Stack');
    // The model before the stack row, in the order every write of the model locks them.
    const read = await readModel(trx, stack.building_id, { lock: true });
    const row = await loadStackRow(trx, id, { lock: true });
    const positions = await trx('stack_positions').where({ stack_id: id }).pluck<number[]>('id');
    const keys = [String(id), ...positions.map(positionOverridesKey)];
    await trx('stack_positions').where({ stack_id: id }).delete();
    await trx('stacks').where({ id }).delete();
    await recordAudit(trx, {
      userId: user.id,
      buildingId: row.building_id,
      stackId: id,
      action: 'stack.delete',
      version: row.version,
      detail: { name: row.name },
    });
    await touchBuilding(trx, row.building_id);
    const detail = { stackId: id, overrides: 0 };
    return {
      buildingId: row.building_id,
      dropped: await dropOverrides(trx, row.building_id, read, keys, user, detail),
    };
  });
  if (dropped) broadcastModelChange(ctx, buildingId, dropped, user);
}
