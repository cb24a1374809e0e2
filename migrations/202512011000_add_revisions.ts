import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // Frozen revisions (docs/contracts.md §Revisions). Rows are written once; triggers (next migration) refuse UPDATE
  // and DELETE.
  await knex.schema.createTable('revisions', (t) => {
    t.increments('id').primary();
    // RESTRICT: a building with issued revisions cannot be deleted out from under them.
    t.integer('building_id').notNullable().references('id').inTable('buildings').onDelete('RESTRICT');
    t.string('code', 8).notNullable();
    t.string('purpose', 16).notNullable();
    t.text('note').notNullable();
    t.text('acknowledgement');
    // Canonical JSON of the RevisionSnapshot; hash is its SHA-256 (hex).
    t.text('snapshot').notNullable();
    t.string('hash', 64).notNullable();
    t.string('engine_version', 40).notNullable();
    // No foreign key: the revision keeps who froze it even if the account goes.
    t.integer('frozen_by').notNullable();
    t.string('frozen_by_name', 100).notNullable();
    t.string('frozen_at', 32).notNullable();
    t.integer('stack_count').notNullable();
    t.double('worst_utilisation');
    t.integer('failing_lifts').notNullable();
    t.unique(['building_id', 'code']);
    t.index(['building_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('revisions');
}
