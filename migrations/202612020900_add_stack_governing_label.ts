// The building's stacks table names the governing lift as engineers do (L1, L2, … from the bottom),
// so the summary row keeps the lift's label beside its node id. Existing rows are filled from their
// stored results; results stored before lifts had labels fall back to the node id, as elsewhere.
import type { Knex } from 'knex';

interface StoredLift {
  liftId: string;
  label?: string;
}

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stacks', (t) => {
    t.string('governing_lift_label', 40).nullable();
  });
  const rows = await knex('stacks')
    .whereNotNull('governing_lift_id')
    .select<{ id: number; results: string; governing_lift_id: string }[]>('id', 'results', 'governing_lift_id');
  for (const row of rows) {
    const lifts = (JSON.parse(row.results) as { lifts?: StoredLift[] }).lifts ?? [];
    const lift = lifts.find((l) => l.liftId === row.governing_lift_id);
    await knex('stacks')
      .where({ id: row.id })
      .update({ governing_lift_label: lift?.label ?? row.governing_lift_id });
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stacks', (t) => {
    t.dropColumn('governing_lift_label');
  });
}
