// Ops committed since a version, for a client catching up after a reconnect.
import type { Knex } from 'knex';
import type { Op } from '../../shared/schema/ops.ts';
import { isoTime } from '../db.ts';

export interface CommittedOps {
  version: number;
  ops: Op[];
  by: { userId: number; name: string } | null;
  at: string;
}

export async function opsSince(db: Knex, stackId: number, since: number): Promise<CommittedOps[]> {
  const rows = await db('stack_ops as o')
    .leftJoin('users as u', 'u.id', 'o.user_id')
    .where('o.stack_id', stackId)
    .andWhere('o.version', '>', since)
    .orderBy('o.version')
    .select<{ version: number; ops: string; user_id: number | null; name: string | null; created_at: unknown }[]>('o.version', 'o.ops', 'o.user_id', 'u.name', 'o.created_at');
  return rows.map((r) => ({
    version: r.version,
    // Stored by stackOps after validation.
    ops: JSON.parse(r.ops) as Op[],
    by: r.user_id !== null && r.name !== null ? { userId: r.user_id, name: r.name } : null,
    at: isoTime(r.created_at),
  }));
}
