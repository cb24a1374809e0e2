import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // Who was told about a revision and whether the e-mail went (mutable, unlike the revision itself).
  await knex.schema.createTable('revision_recipients', (t) => {
    t.increments('id').primary();
    t.integer('revision_id').notNullable().references('id').inTable('revisions');
    t.integer('user_id');
    t.string('email', 254).notNullable();
    t.string('name', 100).notNullable();
    t.string('status', 8).notNullable();
    t.integer('attempts').notNullable().defaultTo(0);
    t.text('error');
    t.string('updated_at', 32).notNullable();
    t.unique(['revision_id', 'email']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('revision_recipients');
}
