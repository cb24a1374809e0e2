// A building never holds two levels of one name in any letter case (see 202612031100 for stacks).
import type { Knex } from 'knex';
import { createNameIndex, dropNameIndex } from './uniqueNameIndex.ts';

export const up = (knex: Knex): Promise<void> => createNameIndex(knex, 'levels');
export const down = (knex: Knex): Promise<void> => dropNameIndex(knex, 'levels');
