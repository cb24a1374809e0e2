// A building never holds two stacks of one name in any letter case; the database now enforces what
// services/uniqueNames.ts checks, so two processes racing cannot both insert (docs/faults.md).
import type { Knex } from 'knex';
import { createNameIndex, dropNameIndex } from './uniqueNameIndex.ts';

export const up = (knex: Knex): Promise<void> => createNameIndex(knex, 'stacks');
export const down = (knex: Knex): Promise<void> => dropNameIndex(knex, 'stacks');
