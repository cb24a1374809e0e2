// What every route and service of one server process shares.
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { createClient } from 'redis';
import type { Config } from './config.ts';
import type { Mailer } from './mail/mailer.ts';
import type { OffThread } from './offThread/pool.ts';
import type { Broadcaster } from './services/broadcast.ts';

export interface ServerContext {
  db: Knex;
  config: Config;
  /** The process's logger: every log line of the server goes through it (pino, JSON lines). */
  log: Logger;
  mailer: Mailer;
  /** Replaceable: the realtime module swaps in its Socket.IO broadcaster. */
  broadcaster: Broadcaster;
  /** With REDIS_URL: counters every process must share (the sign-in limit); null on a single process. */
  redis: RedisClient | null;
  /** Long work (calculation packages, sizing a building) done on a worker thread. */
  offThread: OffThread;
  /** The background mail sender: `kick()` after queueing mail so it goes out without waiting a poll. */
  outbox: { kick(): void };
}

export type RedisClient = ReturnType<typeof createClient>;
