import type { Knex } from 'knex';

// The durable outbox of outgoing e-mail (docs/faults.md): a request commits its rows here and answers;
// a background sender in each server process claims due rows one at a time (a conditional UPDATE, so
// two processes never take one row), sends with bounded SMTP timeouts and retries with back-off.
// Times are epoch milliseconds so that "due" compares the same way on SQLite and PostgreSQL.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_queue', (t) => {
    t.increments('id').primary();
    t.string('kind', 20).notNullable();
    t.string('to', 254).notNullable();
    t.text('subject').notNullable();
    t.text('text').notNullable();
    t.text('html');
    /** The revision whose stored calculation package is attached, if any. */
    t.integer('attach_revision_id');
    /** The revision_recipients row this mail reports to, if any. */
    t.integer('recipient_id');
    /** For invitations: the building, so the lead sees whether the e-mail went. */
    t.integer('building_id');
    t.string('status', 10).notNullable();
    t.integer('attempts').notNullable().defaultTo(0);
    t.bigInteger('next_attempt_at').notNullable();
    t.bigInteger('claimed_until');
    t.string('claimed_by', 40);
    t.text('last_error');
    t.string('created_at', 32).notNullable();
    t.string('updated_at', 32).notNullable();
    t.index(['status', 'next_attempt_at']);
    t.index(['building_id', 'to']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mail_queue');
}
