import type { Knex } from 'knex';

// Typical columns (docs/typical-columns.md): the further grid crossings a stack also stands at, each with the
// stack's design and its own floor loads. One stack per crossing of a building: the unique index holds it
// among the positions, the service checks it against the stacks' own places (stacks.grid_x, grid_y).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('stack_positions', (t) => {
    t.increments('id').primary();
    t.integer('stack_id').notNullable().references('id').inTable('stacks').onDelete('CASCADE');
    t.integer('building_id').notNullable().references('id').inTable('buildings').onDelete('CASCADE');
    t.string('grid_x', 64).notNullable();
    t.string('grid_y', 64).notNullable();
    t.string('web_along', 1).notNullable().defaultTo('x');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['building_id', 'grid_x', 'grid_y']);
    t.index(['stack_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('stack_positions');
}
