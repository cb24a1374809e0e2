// Pending invitations end: after expires_at an invitation is no longer taken up (docs/access.md).
// Invitations already pending get the default fourteen days from now.
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('invitations', (t) => {
    t.timestamp('expires_at').nullable();
  });
  await knex('invitations').update({ expires_at: new Date(Date.now() + 14 * 86_400_000).toISOString() });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('invitations', (t) => {
    t.dropColumn('expires_at');
  });
}
