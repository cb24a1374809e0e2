import type { Knex } from 'knex';

// The calculation package of a revision, drawn once and kept with its SHA-256 (docs/faults.md), in the
// database so every process of a deployment serves the same bytes. Copy 0 is the issued package; a
// row is made 'due' in the freeze's transaction and filled once after commit (bytes null until then).
// Copies 1, 2, … are re-drawn copies, marked as such on every page, made only when copy 0 is found
// tampered or missing.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('revision_packages', (t) => {
    t.increments('id').primary();
    t.integer('revision_id').notNullable().references('id').inTable('revisions');
    t.integer('copy').notNullable();
    t.binary('bytes');
    t.string('sha256', 64);
    t.integer('size');
    t.string('reason', 200);
    t.integer('drawn_by');
    t.string('drawn_at', 32);
    t.string('created_at', 32).notNullable();
    t.unique(['revision_id', 'copy']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('revision_packages');
}
