// The database: SQLite file in DATA_DIR by default, PostgreSQL when DATABASE_URL is set.
import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';
import knex, { type Knex } from 'knex';
import type { Database } from 'better-sqlite3';
import type { Config } from './config.ts';
import { migrationSource } from '../migrations/index.ts';

export type DatabaseKind = 'sqlite' | 'postgres';

export function databaseKind(config: Pick<Config, 'databaseUrl'>): DatabaseKind {
  return config.databaseUrl ? 'postgres' : 'sqlite';
}

export function createDb(
  config: Pick<Config, 'databaseUrl' | 'dataDir'> & Partial<Pick<Config, 'databaseSchema'>>,
): Knex {
  if (config.databaseUrl) {
    return knex({
      client: 'pg',
      connection: config.databaseUrl,
      ...(config.databaseSchema ? { searchPath: [config.databaseSchema] } : {}),
      pool: { min: 0, max: 10 },
    });
  }
  mkdirSync(config.dataDir, { recursive: true });
  return knex({
    client: 'better-sqlite3',
    connection: { filename: resolve(config.dataDir, 'stanchion.sqlite') },
    useNullAsDefault: true,
    // One connection: SQLite serialises writers anyway, and transactions then never interleave.
    pool: {
      min: 1,
      max: 1,
      afterCreate(conn: Database, done: (err: Error | null, conn: Database) => void) {
        conn.pragma('journal_mode = WAL');
        conn.pragma('foreign_keys = ON');
        conn.pragma('busy_timeout = 5000');
        done(null, conn);
      },
    },
  });
}

export async function migrate(db: Knex): Promise<void> {
  const schema = searchPathOf(db);
  if (schema) await db.raw('CREATE SCHEMA IF NOT EXISTS ??', [schema]);
  await db.migrate.latest({ migrationSource });
}

export function isPostgres(db: Knex): boolean {
  return db.client.config.client === 'pg';
}

function searchPathOf(db: Knex): string | null {
  const path: unknown = db.client.config.searchPath;
  return isPostgres(db) && Array.isArray(path) && typeof path[0] === 'string' ? path[0] : null;
}

export async function rollbackAll(db: Knex): Promise<void> {
  await db.migrate.rollback({ migrationSource }, true);
}

/** Timestamps come back as strings from SQLite and as Date from PostgreSQL. */
export function isoTime(value: unknown): string {
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'string')
    return new Date(value.includes('T') ? value : `${value.replace(' ', 'T')}Z`).toISOString();
  return new Date(0).toISOString();
}

export const now = (): string => new Date().toISOString();
