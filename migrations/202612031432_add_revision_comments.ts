import type { Knex } from 'knex';

// A checker's comments on a stack or a lift of a revision (docs/issue-workflow.md): open until resolved, once.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('revision_comments', (t) => {
    t.increments('id').primary();
    t.integer('revision_id').notNullable().references('id').inTable('revisions');
    // The stack and lift as frozen in the revision's snapshot, with the names people read.
    t.integer('stack_id').notNullable();
    t.string('stack_name', 100).notNullable();
    t.string('lift_id', 100);
    t.string('lift_label', 40);
    t.text('text').notNullable();
    t.integer('author_id').notNullable();
    t.string('author_name', 100).notNullable();
    t.string('created_at', 32).notNullable();
    t.integer('resolved_by');
    t.string('resolved_by_name', 100);
    t.string('resolved_at', 32);
    t.text('resolution');
    t.index(['revision_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('revision_comments');
}
