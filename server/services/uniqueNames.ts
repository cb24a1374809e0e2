// Levels and stacks are found by name (load imports, the calculation package, the people reading it),
// so a building never holds two levels or two stacks of one name, in any letter case.
import type { Knex } from 'knex';
import { conflict } from '../errors.ts';

export async function assertNameFree(db: Knex, what: 'level' | 'stack', buildingId: number, name: string, exceptId?: number): Promise<void> {
  const query = db(what === 'level' ? 'levels' : 'stacks')
    .where({ building_id: buildingId })
    .whereRaw('lower(name) = ?', [name.toLowerCase()]);
  if (exceptId !== undefined) query.whereNot({ id: exceptId });
  const clash = await query.first<{ id: number; name: string } | undefined>('id', 'name');
  if (clash) throw conflict(`This building already has a ${what} called "${clash.name}"; choose another name`, { id: clash.id });
}
