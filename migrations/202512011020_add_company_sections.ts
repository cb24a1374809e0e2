import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('company_sections', (t) => {
    t.increments('id').primary();
    t.integer('building_id').notNullable().references('id').inTable('buildings').onDelete('CASCADE');
    t.string('designation', 80).notNullable();
    // SectionDims (shared/schema/stack.ts), mm
    t.text('dims').notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['building_id', 'designation']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('company_sections');
}
