// A building's robustness summary (docs/splices-and-bases.md) from the stored results of each stack's current version.
import type { Knex } from 'knex';
import { robustnessSummary, type RobustnessSummary } from '../../shared/engine/connections/robustnessSummary.ts';
import { notFound } from '../errors.ts';
import { parseOptions } from './buildings.ts';
import { joinResults, parseResults, STORED_RESULTS, type StoredResults } from './stackRows.ts';

export async function buildingRobustness(db: Knex, buildingId: number): Promise<RobustnessSummary> {
  const building = await db('buildings').where({ id: buildingId }).first<{ options: string } | undefined>('options');
  if (!building) throw notFound('Building');
  const rows = await joinResults(db('stacks'))
    .where({ building_id: buildingId })
    .orderBy('name')
    .select<({ id: number; name: string } & StoredResults)[]>('id', 'name', ...STORED_RESULTS);
  const stacks = rows.map((r) => ({ id: r.id, name: r.name, result: parseResults(r) }));
  return robustnessSummary({ stacks }, parseOptions(building.options).consequenceClass);
}
