// Redis clients that survive losing Redis (docs/faults.md). Every client has an 'error' listener and
// reconnects with capped back-off; state changes are logged once per outage, not once per retry.
// Start-up waits a bounded time for Redis and then carries on degraded: the process never hangs on
// Redis and never ends because of it.
import type { Logger } from 'pino';
import { createClient } from 'redis';
import type { RedisClient } from './context.ts';

/** How long start-up waits for Redis before serving without it. */
export const REDIS_START_WAIT_MS = 3000;
/** How long one Redis command may take before the caller treats Redis as unavailable. */
export const REDIS_COMMAND_TIMEOUT_MS = 1000;

export interface RedisClientOptions {
  /**
   * false: commands fail at once while Redis is away (publishing, counters); true: they wait for the
   * connection (the subscriber's SUBSCRIBE, which must happen whenever Redis comes).
   */
  queueWhileOffline: boolean;
}

// Back-off between reconnection attempts: 100 ms doubling, capped at 2 s (common practice, no source).
const reconnectDelay = (retries: number) => Math.min(100 * 2 ** retries, 2000);

export function createRedisClient(url: string, role: string, log: Logger, opts: RedisClientOptions): RedisClient {
  const client: RedisClient = createClient({
    url,
    disableOfflineQueue: !opts.queueWhileOffline,
    socket: { connectTimeout: 2000, reconnectStrategy: reconnectDelay },
  });
  let lost = false;
  client.on('error', (err: unknown) => {
    if (lost) return;
    lost = true;
    log.warn(
      { err, role },
      'Redis connection lost: live rooms serve this process only and sign-in answers 503 until it returns',
    );
  });
  client.on('ready', () => {
    if (!lost) return;
    lost = false;
    log.warn({ role }, 'Redis connection back: live rooms are shared again');
  });
  return client;
}

/**
 * Starts connecting and waits at most `ms` for the connection. Resolves true when ready; false when
 * Redis did not answer in time, in which case the client keeps trying in the background.
 */
export async function connectBounded(client: RedisClient, ms: number, log: Logger, role: string): Promise<boolean> {
  const ready = new Promise<boolean>((resolve) => {
    client.once('ready', () => resolve(true));
  });
  client.connect().catch((err: unknown) => log.error({ err, role }, 'Redis connection failed for good'));
  let timer: NodeJS.Timeout | undefined;
  const timedOut = new Promise<boolean>((resolve) => {
    timer = setTimeout(() => resolve(false), ms);
  });
  const ok = await Promise.race([ready, timedOut]);
  clearTimeout(timer);
  if (!ok) {
    log.error(
      { role, waitedMs: ms },
      'REDIS UNREACHABLE AT START: serving degraded (live rooms on this process only, sign-in answers 503) and reconnecting in the background',
    );
  }
  return ok;
}

/** Runs a Redis command with a time bound; rejects with `onFail()`'s error when Redis is away or slow. */
export async function boundedCommand<T>(
  client: RedisClient,
  run: () => Promise<T>,
  onFail: () => Error,
  ms = REDIS_COMMAND_TIMEOUT_MS,
): Promise<T> {
  if (!client.isReady) throw onFail();
  const work = run();
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_resolve, reject) => {
    timer = setTimeout(() => reject(onFail()), ms);
  });
  try {
    return await Promise.race([work, timeout]);
  } catch (err) {
    // A late failure of the command itself must not surface as an unhandled rejection.
    work.catch(() => undefined);
    if (!client.isReady) throw onFail();
    throw err;
  } finally {
    clearTimeout(timer);
  }
}

/**
 * The adapter publishes without handling the promise (and would end the process when a publish
 * fails). This view of the client turns a failed publish into a logged, dropped message: the
 * committed change is in the database and clients catch up on re-join.
 */
export function safePublisher(client: RedisClient, log: Logger): RedisClient {
  let warned = false;
  client.on('ready', () => {
    warned = false;
  });
  return new Proxy(client, {
    get(target, prop, receiver) {
      if (prop === 'publish') {
        return (...args: Parameters<RedisClient['publish']>) =>
          target.publish(...args).catch((err: unknown) => {
            if (!warned)
              log.warn({ err }, 'Redis publish failed: broadcasts reach this process only until Redis returns');
            warned = true;
            return 0;
          });
      }
      const value: unknown = Reflect.get(target, prop, receiver);
      return typeof value === 'function' ? (value as (...a: unknown[]) => unknown).bind(target) : value;
    },
  });
}

/** Closes a client whether or not it is connected (close waits for replies, so only when connected). */
export async function closeRedis(client: RedisClient | null): Promise<void> {
  if (!client || !client.isOpen) return;
  if (client.isReady) await client.close().catch(() => client.destroy());
  else client.destroy();
}
