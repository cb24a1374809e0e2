// Where each stack of a building stands, answered from an index alone. On SQLite these columns sit after
// the results (hundreds of kB per stack) in each row, so reading them from the table walks every results
// page; a building-wide re-analysis reads them for every stack (docs/building-model.md §Live at building scale).
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stacks', (t) => {
    t.index(['building_id', 'grid_x', 'grid_y', 'web_along'], 'stacks_place_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stacks', (t) => {
    t.dropIndex(['building_id', 'grid_x', 'grid_y', 'web_along'], 'stacks_place_index');
  });
}
