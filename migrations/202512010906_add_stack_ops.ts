import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('stack_ops', (t) => {
    t.increments('id').primary();
    t.integer('stack_id').notNullable().references('id').inTable('stacks').onDelete('CASCADE');
    // The version this ops list produced.
    t.integer('version').notNullable();
    t.text('ops').notNullable();
    // Node and edge ids the ops touched, worked out when they were applied (for conflict checks).
    t.text('touched').notNullable();
    t.integer('user_id').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['stack_id', 'version']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('stack_ops');
}
