import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_log', (t) => {
    t.increments('id').primary();
    t.text('to').notNullable();
    t.text('subject').notNullable();
    t.string('status', 8).notNullable();
    t.integer('attempts').notNullable();
    t.text('error');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mail_log');
}
