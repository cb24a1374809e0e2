import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // Messages captured by the local SMTP fake (development and tests).
  await knex.schema.createTable('outbox', (t) => {
    t.increments('id').primary();
    t.text('to').notNullable();
    t.text('subject').notNullable();
    t.text('text').notNullable();
    t.text('html');
    // [{ filename, contentType, size, content (base64) }]
    t.text('attachments').notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('outbox');
}
