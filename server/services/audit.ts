// One audit row for every write: who, when, what, which version.
import type { Knex } from 'knex';
import { now } from '../db.ts';

export interface AuditEntry {
  userId: number | null;
  buildingId?: number | null;
  stackId?: number | null;
  action: string;
  detail?: Record<string, unknown>;
  version?: number | null;
}

export async function recordAudit(db: Knex, entry: AuditEntry): Promise<void> {
  await db('audit_log').insert(auditRow(entry, now()));
}

/** The audit_log row of one entry. */
function auditRow(entry: AuditEntry, at: string) {
  return {
    user_id: entry.userId,
    building_id: entry.buildingId ?? null,
    stack_id: entry.stackId ?? null,
    action: entry.action,
    detail: JSON.stringify(entry.detail ?? {}),
    version: entry.version ?? null,
    created_at: at,
  };
}

/** Rows a multi-row insert carries at most: well inside SQLite's limit on bound values. */
export const INSERT_CHUNK = 100;

/** Many audit rows of one write, in as few statements as the database allows. */
export async function recordAudits(db: Knex, entries: readonly AuditEntry[]): Promise<void> {
  const at = now();
  const rows = entries.map((entry) => auditRow(entry, at));
  for (let i = 0; i < rows.length; i += INSERT_CHUNK) await db('audit_log').insert(rows.slice(i, i + INSERT_CHUNK));
}
