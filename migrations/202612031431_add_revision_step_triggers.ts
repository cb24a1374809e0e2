import type { Knex } from 'knex';

// A sign-off, once given, is never changed or taken back (docs/issue-workflow.md); the database refuses it too.
const isPostgres = (knex: Knex) => ['pg', 'postgres', 'postgresql'].includes(String(knex.client.config.client));

export async function up(knex: Knex): Promise<void> {
  if (isPostgres(knex)) {
    await knex.raw(`
      CREATE OR REPLACE FUNCTION revision_steps_refuse_change() RETURNS trigger AS $$
      BEGIN
        RAISE EXCEPTION 'revision sign-offs are final: % refused', TG_OP;
      END;
      $$ LANGUAGE plpgsql`);
    await knex.raw(`CREATE TRIGGER revision_steps_final BEFORE UPDATE OR DELETE ON revision_steps
      FOR EACH ROW EXECUTE FUNCTION revision_steps_refuse_change()`);
    return;
  }
  await knex.raw(`CREATE TRIGGER revision_steps_no_update BEFORE UPDATE ON revision_steps
    BEGIN SELECT RAISE(ABORT, 'revision sign-offs are final: UPDATE refused'); END`);
  await knex.raw(`CREATE TRIGGER revision_steps_no_delete BEFORE DELETE ON revision_steps
    BEGIN SELECT RAISE(ABORT, 'revision sign-offs are final: DELETE refused'); END`);
}

export async function down(knex: Knex): Promise<void> {
  if (isPostgres(knex)) {
    await knex.raw('DROP TRIGGER IF EXISTS revision_steps_final ON revision_steps');
    await knex.raw('DROP FUNCTION IF EXISTS revision_steps_refuse_change()');
    return;
  }
  await knex.raw('DROP TRIGGER IF EXISTS revision_steps_no_delete');
  await knex.raw('DROP TRIGGER IF EXISTS revision_steps_no_update');
}
