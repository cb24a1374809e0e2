// Levels and stacks are found by name (load imports, the calculation package, the people reading it),
// so a building never holds two levels or two stacks of one name, in any letter case. The check gives
// the friendly message; the unique index on (building_id, lower(name)) settles races between processes.
import type { Knex } from 'knex';
import { onUniqueViolation } from '../dbErrors.ts';
import { conflict } from '../errors.ts';

export async function assertNameFree(
  db: Knex,
  what: 'level' | 'stack',
  buildingId: number,
  name: string,
  exceptId?: number,
): Promise<void> {
  const query = db(what === 'level' ? 'levels' : 'stacks')
    .where({ building_id: buildingId })
    .whereRaw('lower(name) = lower(?)', [name]);
  if (exceptId !== undefined) query.whereNot({ id: exceptId });
  const clash = await query.first<{ id: number; name: string } | undefined>('id', 'name');
  if (clash)
    throw conflict(`This building already has a ${what} called "${clash.name}"; choose another name`, { id: clash.id });
}

/** Runs a write that names a level or stack; the index's refusal (a racing writer won) becomes a 409. */
export function withNameGuard<T>(what: 'level' | 'stack', name: string, work: () => Promise<T>): Promise<T> {
  return onUniqueViolation(work, () =>
    conflict(`This building already has a ${what} called "${name}" (in some letter case); choose another name`),
  );
}
