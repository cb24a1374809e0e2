// Renaming a building or changing its analysis options; new options re-analyse every stack in the
// same transaction, so no stack ever shows results computed with the old options.
import type { Building, User } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { now } from '../db.ts';
import { recordAudit } from './audit.ts';
import { getBuilding, parseOptions, type BuildingInput } from './buildings.ts';

export async function updateBuilding(ctx: ServerContext, id: number, input: Partial<BuildingInput>, user: User): Promise<Building> {
  await ctx.db.transaction(async (trx) => {
    const row = await trx('buildings').where({ id }).first<{ options: string }>('options');
    const patch: Record<string, string> = { updated_at: now() };
    if (input.name !== undefined) patch.name = input.name;
    if (input.reference !== undefined) patch.reference = input.reference;
    if (input.options !== undefined) patch.options = JSON.stringify({ ...parseOptions(row.options), ...input.options });
    await trx('buildings').where({ id }).update(patch);
    await recordAudit(trx, { userId: user.id, buildingId: id, action: 'building.update', detail: { ...input } });
  });
  return getBuilding(ctx.db, id, 'lead');
}
