// SQLite writes each commit to its WAL and, by default, copies the pages into the database file at the end of
// the commit that crosses 1,000 pages: a building-wide re-analysis (135 MB of results) would then spend half
// a second of its commit, on the event loop, copying. Instead a worker thread with its own connection
// checkpoints a few times a second (PASSIVE: it never waits for the server's connection nor blocks it), and
// the server's connection no longer does (docs/building-model.md §Live at building scale). Durability is the
// WAL's, as before: a commit is synced to the WAL before it is acknowledged.
import { Worker } from 'node:worker_threads';
import type { Knex } from 'knex';
import type { Logger } from 'pino';

/** How often the checkpointer looks for committed pages to copy, ms (common practice, no source). */
const EVERY_MS = 250;
/** SQLite's own setting, pages (sqlite.org/pragma.html#pragma_wal_autocheckpoint). */
const SQLITE_DEFAULT_AUTOCHECKPOINT = 1000;

export interface WalCheckpointer {
  close(): Promise<void>;
}

export async function startWalCheckpointer(db: Knex, file: string, log: Logger): Promise<WalCheckpointer> {
  const worker = new Worker(new URL('./walCheckpointWorker.mjs', import.meta.url), {
    workerData: { file, everyMs: EVERY_MS },
  });
  let exited = false;
  const done = new Promise<void>((resolve) =>
    worker.once('exit', () => {
      exited = true;
      resolve();
    }),
  );
  worker.on('message', (m: { error?: string }) => m.error && log.warn({ error: m.error }, 'WAL checkpoint failed'));
  worker.on('error', (err) => {
    // Without its checkpointer the server's connection checkpoints at commit again, as SQLite does by default.
    log.error({ err }, 'WAL checkpointer stopped');
    void db.raw(`PRAGMA wal_autocheckpoint = ${SQLITE_DEFAULT_AUTOCHECKPOINT}`).catch(() => undefined);
  });
  worker.unref();
  await db.raw('PRAGMA wal_autocheckpoint = 0');
  return {
    async close() {
      if (!exited) worker.postMessage('close');
      await done;
    },
  };
}
