// Buildings: the job a team works on, with its analysis options.
import type { Knex } from 'knex';
import type { Building, BuildingSummary, Role, User } from '../../shared/schema/api.ts';
import { analysisOptionsSchema, DEFAULT_ANALYSIS_OPTIONS, type AnalysisOptions } from '../../shared/schema/results.ts';
import { notFound } from '../errors.ts';
import { isoTime, now } from '../db.ts';
import { recordAudit } from './audit.ts';

interface BuildingRow {
  id: number;
  name: string;
  reference: string;
  options: string;
  updated_at: unknown;
}

export function parseOptions(text: string): AnalysisOptions {
  const parsed = analysisOptionsSchema.partial().safeParse(JSON.parse(text));
  return { ...DEFAULT_ANALYSIS_OPTIONS, ...(parsed.success ? parsed.data : {}) };
}

async function stackStats(db: Knex, buildingIds: number[]): Promise<Map<number, { n: number; worst: number | null }>> {
  if (buildingIds.length === 0) return new Map();
  const rows = await db('stacks')
    .whereIn('building_id', buildingIds)
    .groupBy('building_id')
    .select<{ building_id: number; n: number | string; worst: number | null }[]>(
      'building_id',
      db.raw('count(*) as n'),
      db.raw('max(utilisation) as worst'),
    );
  return new Map(
    rows.map((r) => [r.building_id, { n: Number(r.n), worst: r.worst === null ? null : Number(r.worst) }]),
  );
}

function summary(
  row: BuildingRow,
  role: Role,
  stats: { n: number; worst: number | null } | undefined,
): BuildingSummary {
  return {
    id: row.id,
    name: row.name,
    reference: row.reference,
    role,
    stackCount: stats?.n ?? 0,
    worstUtilisation: stats?.worst ?? null,
    updatedAt: isoTime(row.updated_at),
  };
}

/** The caller's buildings; a site admin also sees every other building, as a viewer. */
export async function listBuildings(db: Knex, user: User): Promise<BuildingSummary[]> {
  const q = db('buildings as b')
    .leftJoin('memberships as m', function () {
      this.on('m.building_id', '=', 'b.id').andOn('m.user_id', '=', db.raw('?', [user.id]));
    })
    .orderBy('b.name')
    .select<(BuildingRow & { role: Role | null })[]>(
      'b.id',
      'b.name',
      'b.reference',
      'b.options',
      'b.updated_at',
      'm.role',
    );
  if (!user.isAdmin) q.whereNotNull('m.role');
  const rows = await q;
  const stats = await stackStats(
    db,
    rows.map((r) => r.id),
  );
  return rows.map((r) => summary(r, r.role ?? 'viewer', stats.get(r.id)));
}

export async function getBuilding(db: Knex, id: number, role: Role | null): Promise<Building> {
  const row = await db<BuildingRow>('buildings').where({ id }).first();
  if (!row) throw notFound('Building');
  const stats = await stackStats(db, [id]);
  return { ...summary(row, role ?? 'viewer', stats.get(id)), options: parseOptions(row.options) };
}

export async function getBuildingOptions(db: Knex, id: number): Promise<AnalysisOptions> {
  const row = await db<BuildingRow>('buildings').where({ id }).first('options');
  if (!row) throw notFound('Building');
  return parseOptions(row.options);
}

export interface BuildingInput {
  name: string;
  reference?: string;
  options?: Partial<AnalysisOptions>;
}

/** Creates the building; its creator becomes its lead. */
export async function createBuilding(db: Knex, user: User, input: BuildingInput): Promise<Building> {
  const id = await db.transaction(async (trx) => {
    const options = { ...DEFAULT_ANALYSIS_OPTIONS, ...input.options };
    const [row] = await trx('buildings')
      .insert({
        name: input.name,
        reference: input.reference ?? '',
        options: JSON.stringify(options),
        created_by: user.id,
        created_at: now(),
        updated_at: now(),
      })
      .returning<{ id: number }[]>('id');
    await trx('memberships').insert({ building_id: row.id, user_id: user.id, role: 'lead', created_at: now() });
    await recordAudit(trx, {
      userId: user.id,
      buildingId: row.id,
      action: 'building.create',
      detail: { name: input.name, options },
    });
    return row.id;
  });
  return getBuilding(db, id, 'lead');
}

export async function touchBuilding(db: Knex, id: number): Promise<void> {
  await db('buildings').where({ id }).update({ updated_at: now() });
}
