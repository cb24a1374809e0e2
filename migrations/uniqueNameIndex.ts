// Shared by the two migrations that make a building's stack and level names unique in any letter case
// (an expression index on lower(name), which SQLite and PostgreSQL both have). Old databases may hold
// duplicates made by races before the index: the later rows are renamed "<name> (2)", "(3)", … so
// the index can be built, and each rename is logged and written to the audit log.
import type { Knex } from 'knex';

export async function renameDuplicates(knex: Knex, table: 'stacks' | 'levels'): Promise<void> {
  const rows = await knex(table)
    .orderBy('id')
    .select<{ id: number; building_id: number; name: string }[]>('id', 'building_id', 'name');
  const fold = (s: string) => s.toLowerCase();
  // Every name's first holder keeps it; the later holders are renamed to names nobody holds.
  const taken = new Map<number, Set<string>>();
  const later: typeof rows = [];
  for (const r of rows) {
    const names = taken.get(r.building_id) ?? new Set<string>();
    taken.set(r.building_id, names);
    if (names.has(fold(r.name))) later.push(r);
    else names.add(fold(r.name));
  }
  for (const r of later) {
    const names = taken.get(r.building_id) as Set<string>;
    // The suffix fits within the column (40 characters for stacks; levels allow 60).
    const suffixed = (n: number) => `${r.name.slice(0, 40 - ` (${n})`.length)} (${n})`;
    let n = 2;
    let name = suffixed(n);
    while (names.has(fold(name))) name = suffixed(++n);
    names.add(fold(name));
    await knex(table).where({ id: r.id }).update({ name });
    await knex('audit_log').insert({
      user_id: null,
      building_id: r.building_id,
      stack_id: table === 'stacks' ? r.id : null,
      action: `${table === 'stacks' ? 'stack' : 'level'}.rename-duplicate`,
      detail: JSON.stringify({ from: r.name, to: name }),
      created_at: new Date().toISOString(),
    });
    console.warn(
      `migration: ${table} ${r.id} in building ${r.building_id} renamed from "${r.name}" to "${name}" (a duplicate name)`,
    );
  }
}

export async function createNameIndex(knex: Knex, table: 'stacks' | 'levels'): Promise<void> {
  await renameDuplicates(knex, table);
  await knex.raw(`CREATE UNIQUE INDEX ${table}_building_name_folded ON ${table} (building_id, lower(name))`);
}

export async function dropNameIndex(knex: Knex, table: 'stacks' | 'levels'): Promise<void> {
  await knex.raw(`DROP INDEX IF EXISTS ${table}_building_name_folded`);
}
