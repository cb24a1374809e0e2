import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('levels', (t) => {
    t.increments('id').primary();
    t.integer('building_id').notNullable().references('id').inTable('buildings').onDelete('CASCADE');
    t.string('name', 60).notNullable();
    // metres
    t.double('elevation').notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['building_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('levels');
}
