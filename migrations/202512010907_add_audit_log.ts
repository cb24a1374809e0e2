import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // No foreign keys: the log outlives the rows it talks about.
  await knex.schema.createTable('audit_log', (t) => {
    t.increments('id').primary();
    t.integer('user_id');
    t.integer('building_id');
    t.integer('stack_id');
    t.string('action', 60).notNullable();
    t.text('detail').notNullable();
    t.integer('version');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['building_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_log');
}
