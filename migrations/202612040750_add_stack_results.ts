// A stack's results stored packed and once (docs/contracts.md §Stored results). A building-wide re-analysis
// writes every stack's results in one transaction; as JSON text that was about 340 kB a stack of 40 storeys,
// most of it the repeated shape of the working, and writing it was most of the time of a floor-load change
// (docs/building-model.md §Live at building scale). Results now live in `stack_results`, deflated and keyed
// by the SHA-256 of their JSON, so the columns of a grid that come out the same are stored once; a stack row
// names its results by that key. Rows written before keep their JSON text in `results`. `engine_version` says
// which rules produced the results without reading them (the start-up check for outdated results).
import { inflateRawSync } from 'node:zlib';
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('stack_results', (t) => {
    t.string('hash', 64).primary();
    t.binary('packed').notNullable();
    // When a stack last took these results: a sweep removes results no stack names and none took lately.
    t.timestamp('used_at').notNullable().defaultTo(knex.fn.now());
  });
  await knex.schema.alterTable('stacks', (t) => {
    t.string('results_hash', 64).nullable().index('stacks_results_hash_index');
    t.string('engine_version', 40).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  // Back to JSON text first, so going down loses no results.
  const packed = await knex('stacks')
    .join('stack_results', 'stack_results.hash', 'stacks.results_hash')
    .select<{ id: number; packed: Buffer }[]>('stacks.id', 'stack_results.packed');
  for (const row of packed)
    await knex('stacks')
      .where({ id: row.id })
      .update({ results: inflateRawSync(row.packed).toString('utf8') });
  await knex.schema.alterTable('stacks', (t) => {
    t.dropIndex(['results_hash'], 'stacks_results_hash_index');
    t.dropColumn('results_hash');
    t.dropColumn('engine_version');
  });
  await knex.schema.dropTable('stack_results');
}
