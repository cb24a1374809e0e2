import type { Knex } from 'knex';

// The sign-offs of a revision (docs/issue-workflow.md): prepared, checked, approved, each once, with who and
// when. Rows are only ever added (the next migration's triggers refuse UPDATE and DELETE); where a revision
// stands is read from which steps it has. A revision with no steps was frozen before checking existed.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('revision_steps', (t) => {
    t.increments('id').primary();
    t.integer('revision_id').notNullable().references('id').inTable('revisions');
    t.string('step', 16).notNullable();
    // No foreign key: the revision keeps who signed even if the account goes.
    t.integer('user_id').notNullable();
    t.string('user_name', 100).notNullable();
    t.string('at', 32).notNullable();
    // approved: issued as a preliminary issue without a check.
    t.boolean('unchecked').notNullable().defaultTo(false);
    // checked: the checker's note; approved: why comments were still open (empty when none were).
    t.text('note').notNullable().defaultTo('');
    t.unique(['revision_id', 'step']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('revision_steps');
}
