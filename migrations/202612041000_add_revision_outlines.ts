import type { Knex } from 'knex';

// What a revision's page shows of its frozen snapshot (options, levels, each stack's outcome and lifts), written
// beside the revision when it is frozen so that reading a revision does not parse a snapshot of several megabytes
// (docs/contracts.md §Revisions). `hash` is the snapshot's the outline was drawn from; one that does not match its
// revision's is drawn again from the snapshot. Revisions frozen before this table have none until first read.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('revision_outlines', (t) => {
    t.integer('revision_id').primary().references('id').inTable('revisions');
    t.string('hash', 64).notNullable();
    t.text('outline').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('revision_outlines');
}
