// What every route and service of one server process shares.
import type { Knex } from 'knex';
import type { Config } from './config.ts';
import type { Mailer } from './mail/mailer.ts';
import type { Broadcaster } from './services/broadcast.ts';

export interface ServerContext {
  db: Knex;
  config: Config;
  mailer: Mailer;
  /** Replaceable: the realtime module swaps in its Socket.IO broadcaster. */
  broadcaster: Broadcaster;
}
