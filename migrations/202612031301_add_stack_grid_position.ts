import type { Knex } from 'knex';

// Where a stack stands on the building's grid: the ids of its x and y lines (both or neither) and how its
// web runs in plan. Null for stacks off the grid, which keep their typed loads.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stacks', (t) => {
    t.string('grid_x', 64).nullable();
    t.string('grid_y', 64).nullable();
    t.string('web_along', 1).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stacks', (t) => {
    t.dropColumn('grid_x');
    t.dropColumn('grid_y');
    t.dropColumn('web_along');
  });
}
