// When the owner of the address proved it by following the link in the verification e-mail; null until
// then. Accounts made before verification existed stay unverified and may ask for a link (docs/access.md).
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.timestamp('email_verified_at').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('email_verified_at');
  });
}
