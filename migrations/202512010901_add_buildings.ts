import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('buildings', (t) => {
    t.increments('id').primary();
    t.string('name', 120).notNullable();
    t.string('reference', 60).notNullable().defaultTo('');
    // AnalysisOptions as JSON text.
    t.text('options').notNullable();
    t.integer('created_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('buildings');
}
