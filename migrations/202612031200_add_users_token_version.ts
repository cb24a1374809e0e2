// A session version per user, carried in every session token: signing out everywhere and changing the
// password raise it, and a token carrying an older version is refused (docs/access.md).
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.integer('token_version').notNullable().defaultTo(0);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('token_version');
  });
}
