import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('stacks', (t) => {
    t.increments('id').primary();
    t.integer('building_id').notNullable().references('id').inTable('buildings').onDelete('CASCADE');
    t.string('name', 40).notNullable();
    t.text('doc').notNullable();
    t.integer('version').notNullable().defaultTo(0);
    // StackResult of this version, so reads never recompute.
    t.text('results').notNullable();
    // Summary of the results, for building lists without parsing every result.
    t.double('utilisation');
    t.string('status', 8).notNullable();
    t.string('governing_lift_id', 64);
    t.string('governing_section', 80);
    t.integer('lift_count').notNullable().defaultTo(0);
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
    t.index(['building_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('stacks');
}
