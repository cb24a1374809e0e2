import type { Knex } from 'knex';

// docs/rights.md: a frozen revision can never be changed, by anyone, through any route; the database refuses
// it too, so a slip in code (or a hand-typed UPDATE) cannot alter an issued package.
const isPostgres = (knex: Knex) => ['pg', 'postgres', 'postgresql'].includes(String(knex.client.config.client));

export async function up(knex: Knex): Promise<void> {
  if (isPostgres(knex)) {
    await knex.raw(`
      CREATE OR REPLACE FUNCTION revisions_refuse_change() RETURNS trigger AS $$
      BEGIN
        RAISE EXCEPTION 'revisions are frozen: % refused', TG_OP;
      END;
      $$ LANGUAGE plpgsql`);
    await knex.raw(`CREATE TRIGGER revisions_frozen_rows BEFORE UPDATE OR DELETE ON revisions
      FOR EACH ROW EXECUTE FUNCTION revisions_refuse_change()`);
    await knex.raw(`CREATE TRIGGER revisions_frozen_table BEFORE TRUNCATE ON revisions
      FOR EACH STATEMENT EXECUTE FUNCTION revisions_refuse_change()`);
    return;
  }
  await knex.raw(`CREATE TRIGGER revisions_no_update BEFORE UPDATE ON revisions
    BEGIN SELECT RAISE(ABORT, 'revisions are frozen: UPDATE refused'); END`);
  await knex.raw(`CREATE TRIGGER revisions_no_delete BEFORE DELETE ON revisions
    BEGIN SELECT RAISE(ABORT, 'revisions are frozen: DELETE refused'); END`);
}

export async function down(knex: Knex): Promise<void> {
  if (isPostgres(knex)) {
    await knex.raw('DROP TRIGGER IF EXISTS revisions_frozen_table ON revisions');
    await knex.raw('DROP TRIGGER IF EXISTS revisions_frozen_rows ON revisions');
    await knex.raw('DROP FUNCTION IF EXISTS revisions_refuse_change()');
    return;
  }
  await knex.raw('DROP TRIGGER IF EXISTS revisions_no_delete');
  await knex.raw('DROP TRIGGER IF EXISTS revisions_no_update');
}
