// Reading and writing a building's model row (docs/building-model.md). No row means an empty model.
import type { Knex } from 'knex';
import { buildingModelSchema, EMPTY_MODEL, type BuildingModel } from '../../shared/schema/building.ts';
import { isPostgres, now } from '../db.ts';
import { conflict } from '../errors.ts';

interface ModelRow {
  building_id: number;
  model: string;
  version: number;
}

/** Locked until commit on PostgreSQL when asked, so two writers of one building queue. */
export async function readModel(
  db: Knex,
  buildingId: number,
  opts: { lock?: boolean } = {},
): Promise<{ model: BuildingModel; version: number }> {
  const query = db<ModelRow>('building_models').where({ building_id: buildingId });
  if (opts.lock && isPostgres(db)) query.forUpdate();
  const row = await query.first();
  if (!row) return { model: EMPTY_MODEL, version: 0 };
  // Stored models were validated on the way in; parsing again guards against a hand-edited database.
  return { model: buildingModelSchema.parse(JSON.parse(row.model)), version: row.version };
}

/** Stores the model as the version after `version`; 409 when another writer stored it first. */
export async function writeModel(
  trx: Knex,
  buildingId: number,
  model: BuildingModel,
  version: number,
): Promise<number> {
  const next = version + 1;
  const text = JSON.stringify(model);
  if (version === 0) {
    await trx('building_models')
      .insert({ building_id: buildingId, model: text, version: next, updated_at: now() })
      .onConflict('building_id')
      .ignore();
    const stored = await trx<ModelRow>('building_models').where({ building_id: buildingId }).first('version', 'model');
    if (stored?.version === next && stored.model === text) return next;
  } else {
    const updated = await trx('building_models')
      .where({ building_id: buildingId, version })
      .update({ model: text, version: next, updated_at: now() });
    if (updated === 1) return next;
  }
  throw conflict('The building model was changed by someone else; reload and try again', { version });
}
