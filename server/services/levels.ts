// Levels of a building. A level's row holds its elevation, the one place it is stored: moving a level moves
// every restraint, cap and support that sits on it (they are placed on the levels wherever an elevation is
// read), keeps the splices above it at their offset, and stores those stacks again with their new results in
// the same transaction (docs/stack-editing.md).
import type { Knex } from 'knex';
import type { Level, LevelMovePreview, User } from '../../shared/schema/api.ts';
import type { StackNode } from '../../shared/schema/stack.ts';
import { touchedIds } from '../../shared/ops/applyOps.ts';
import type { ServerContext } from '../context.ts';
import { now } from '../db.ts';
import { conflict, notFound, unprocessable } from '../errors.ts';
import { formatElevation, levelWord } from '../../shared/wording.ts';
import { planLevelMove } from './levelMove.ts';
import { recordAudit } from './audit.ts';
import { broadcastChanges, commitDoc, type CommittedChange } from './stackOps.ts';
import { parseDoc, type StackRow } from './stackRows.ts';
import { assertNameFree, withNameGuard } from './uniqueNames.ts';

interface LevelRow {
  id: number;
  building_id: number;
  name: string;
  elevation: number;
}
const toLevel = (r: LevelRow): Level => ({ id: String(r.id), name: r.name, elevation: Number(r.elevation) });

export async function listLevels(db: Knex, buildingId: number): Promise<Level[]> {
  const rows = await db<LevelRow>('levels').where({ building_id: buildingId }).orderBy('elevation').orderBy('id');
  return rows.map(toLevel);
}

async function loadLevel(db: Knex, buildingId: number, levelId: number): Promise<LevelRow> {
  const row = await db<LevelRow>('levels').where({ id: levelId, building_id: buildingId }).first();
  if (!row) throw notFound('Level');
  return row;
}

export async function createLevel(
  db: Knex,
  buildingId: number,
  input: { name: string; elevation: number },
  user: User,
): Promise<Level> {
  return withNameGuard('level', input.name, () =>
    db.transaction(async (trx) => {
      await assertNameFree(trx, 'level', buildingId, input.name);
      const [row] = await trx('levels')
        .insert({ building_id: buildingId, ...input, created_at: now() })
        .returning<{ id: number }[]>('id');
      await recordAudit(trx, {
        userId: user.id,
        buildingId,
        action: 'level.create',
        detail: { levelId: row.id, ...input },
      });
      return { id: String(row.id), ...input };
    }),
  );
}

/** Stacks of the building with nodes on this level (restraints, a cap, a support), and those nodes' ids. */
async function stacksUsingLevel(
  db: Knex,
  buildingId: number,
  levelId: number,
): Promise<{ row: StackRow; nodeIds: string[] }[]> {
  const rows = await db<StackRow>('stacks').where({ building_id: buildingId });
  const key = String(levelId);
  const onLevel = (n: StackNode) =>
    (n.kind === 'restraint' || n.kind === 'cap' || n.kind === 'support') && n.data.levelId === key;
  return rows
    .map((row) => ({
      row,
      nodeIds: parseDoc(row.doc)
        .nodes.filter(onLevel)
        .map((n) => n.id),
    }))
    .filter((s) => s.nodeIds.length > 0);
}

export async function updateLevel(
  ctx: ServerContext,
  buildingId: number,
  levelId: number,
  input: { name?: string; elevation?: number },
  user: User,
): Promise<Level> {
  const { level, changes, levels } = await withNameGuard('level', input.name ?? '', () =>
    ctx.db.transaction(async (trx) => {
      const before = await loadLevel(trx, buildingId, levelId);
      if (input.name !== undefined) await assertNameFree(trx, 'level', buildingId, input.name, levelId);
      const moves = input.elevation !== undefined && input.elevation !== Number(before.elevation);
      // Planned against the levels as they stand; every stack follows in this transaction (splices keep their
      // offset above the level), or, when any would break, nothing changes at all.
      const plan = moves
        ? await planLevelMove(trx, buildingId, String(levelId), Number(before.elevation), input.elevation as number)
        : null;
      const broken = plan?.preview.stacks.filter((st) => st.breaks.length > 0) ?? [];
      if (plan && broken.length) {
        const reasons = broken.map((st) => `${st.name}: ${st.breaks[0]}`).join('; ');
        const where = formatElevation(plan.preview.elevation);
        throw unprocessable(
          `Moving ${levelWord(before.name)} to ${where} m would break ${broken.length === 1 ? 'a stack' : `${broken.length} stacks`} (${reasons}); nothing was changed`,
          plan.preview,
        );
      }
      await trx('levels').where({ id: levelId }).update(input);
      await recordAudit(trx, {
        userId: user.id,
        buildingId,
        action: 'level.update',
        detail: { levelId, from: toLevel(before), ...input },
      });
      const changes: CommittedChange[] = [];
      if (plan) {
        for (const { row, doc, ops } of plan.moves) {
          changes.push(
            await commitDoc(
              trx,
              row,
              { doc, ops, touched: touchedIds(parseDoc(row.doc), ops), userId: user.id, action: 'level.move' },
              plan.inputs,
            ),
          );
        }
      }
      const levels = changes.length ? await listLevels(trx, buildingId) : undefined;
      return { level: toLevel(await loadLevel(trx, buildingId, levelId)), changes, levels };
    }),
  );
  // The stacks' open pages place their tied nodes on the levels they hold: they hear the levels with the change.
  broadcastChanges(ctx, changes, { userId: user.id, name: user.name }, { levels });
  return level;
}

export async function deleteLevel(db: Knex, buildingId: number, levelId: number, user: User): Promise<void> {
  await db.transaction(async (trx) => {
    const level = await loadLevel(trx, buildingId, levelId);
    const users = await stacksUsingLevel(trx, buildingId, levelId);
    if (users.length > 0) {
      const names = users.map((s) => s.row.name);
      throw conflict(
        `${levelWord(level.name)} is used by restraints, caps or supports in ${names.join(', ')}; detach them first`,
        { stacks: users.map((s) => s.row.id) },
      );
    }
    await trx('levels').where({ id: levelId }).delete();
    await recordAudit(trx, {
      userId: user.id,
      buildingId,
      action: 'level.delete',
      detail: { levelId, name: level.name },
    });
  });
}

/** What moving a level would do to each stack, without storing anything. */
export async function previewLevelMove(
  db: Knex,
  buildingId: number,
  levelId: number,
  elevation: number,
): Promise<LevelMovePreview> {
  const level = await loadLevel(db, buildingId, levelId);
  return (await planLevelMove(db, buildingId, String(levelId), Number(level.elevation), elevation)).preview;
}
