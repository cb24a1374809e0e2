// A building's own sections (docs/contracts.md §Imports): stored by designation with their dimensions, listed beside
// the catalogue in the section pickers and handed to the engine with every analysis of the building.
import type { Knex } from 'knex';
import { designationKey } from '../../shared/catalogue/index.ts';
import { sectionProperties } from '../../shared/engine/sectionProperties.ts';
import type { CompanySectionHit } from '../../shared/schema/imports.ts';
import { sectionDimsSchema, type SectionDims } from '../../shared/schema/stack.ts';
import { now } from '../db.ts';

interface CompanySectionRow {
  designation: string;
  dims: string;
}

/** Stored dimensions were checked on the way in; parsing again guards against a hand-edited database. */
const parseDims = (text: string): SectionDims => sectionDimsSchema.parse(JSON.parse(text));

/** designation → dimensions, for the engine context of an analysis. */
export async function companySectionMap(db: Knex, buildingId: number): Promise<Map<string, SectionDims>> {
  const rows = await db('company_sections')
    .where({ building_id: buildingId })
    .select<CompanySectionRow[]>('designation', 'dims');
  return new Map(rows.map((r) => [r.designation, parseDims(r.dims)]));
}

/** The building's sections whose designation starts with q (any case and spacing), by designation. */
export async function listCompanySections(db: Knex, buildingId: number, q = ''): Promise<CompanySectionHit[]> {
  const key = designationKey(q);
  const hits: CompanySectionHit[] = [];
  for (const [designation, dims] of await companySectionMap(db, buildingId)) {
    if (key && !designationKey(designation).startsWith(key)) continue;
    hits.push({ designation, series: 'Company', dims, massPerMetre: sectionProperties(dims).massPerMetre });
  }
  return hits.sort((a, b) => a.designation.localeCompare(b.designation, 'en', { numeric: true }));
}

/** Adds or replaces sections by designation; runs inside the caller's transaction. */
export async function upsertCompanySections(
  trx: Knex,
  buildingId: number,
  sections: readonly { designation: string; dims: SectionDims }[],
): Promise<void> {
  for (const s of sections) {
    const dims = JSON.stringify(s.dims);
    const updated = await trx('company_sections')
      .where({ building_id: buildingId, designation: s.designation })
      .update({ dims, updated_at: now() });
    if (updated === 0)
      await trx('company_sections').insert({
        building_id: buildingId,
        designation: s.designation,
        dims,
        created_at: now(),
        updated_at: now(),
      });
  }
}
