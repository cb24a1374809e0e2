import type { Knex } from 'knex';

// The building model (docs/building-model.md): grid, floor build-ups, floor loads per level and tributary-area
// overrides, as one JSON document per building validated by shared/schema/building.ts. A building without a
// row has no grid and no floor loads, as every building had before.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('building_models', (t) => {
    t.integer('building_id').primary().references('id').inTable('buildings').onDelete('CASCADE');
    t.text('model').notNullable();
    t.integer('version').notNullable().defaultTo(0);
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('building_models');
}
