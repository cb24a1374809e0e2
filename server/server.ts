// Starts one server process: configuration, database, migrations, mail, the app, an HTTP listener.
// Tests and server/index.ts both use it; the realtime module attaches Socket.IO to httpServer.
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import { pino, type Logger } from 'pino';
import { createApp } from './app.ts';
import { loadConfig, type ConfigOverrides } from './config.ts';
import type { RedisClient, ServerContext } from './context.ts';
import { createDb, migrate } from './db.ts';
import { createMailer } from './mail/mailer.ts';
import { startMailSender } from './mail/mailSender.ts';
import { createOffThread } from './offThread/pool.ts';
import { closeRedis, connectBounded, createRedisClient, REDIS_START_WAIT_MS } from './redis.ts';
import { nullBroadcaster } from './services/broadcast.ts';
import { attachRealtime, type Realtime } from './realtime/index.ts';
import { reanalyseOutdatedOnStart } from './services/outdatedResults.ts';
import { sweepResults } from './services/stackRows.ts';

export interface StartOptions {
  port?: number;
  dataDir?: string;
  databaseUrl?: string;
  /** Seed the demo scenario when the database has no users. */
  seed?: boolean;
  smtpUrl?: string;
  logLevel?: string;
  /** Anything else in the configuration (tests lower bcrypt rounds and the login rate limit). */
  config?: ConfigOverrides;
  env?: NodeJS.ProcessEnv;
}

export interface RunningServer {
  url: string;
  port: number;
  app: Express;
  httpServer: Server;
  ctx: ServerContext;
  realtime: Realtime;
  close(): Promise<void>;
}

/** How often stored results no stack names are looked for (common practice, no source). */
const SWEEP_EVERY_MS = 60 * 60 * 1000;

export async function startServer(opts: StartOptions = {}): Promise<RunningServer> {
  const overrides: ConfigOverrides = { ...opts.config };
  if (opts.port !== undefined) overrides.port = opts.port;
  if (opts.dataDir !== undefined) overrides.dataDir = opts.dataDir;
  if (opts.databaseUrl !== undefined) overrides.databaseUrl = opts.databaseUrl;
  if (opts.smtpUrl !== undefined) overrides.smtpUrl = opts.smtpUrl;
  if (opts.logLevel !== undefined) overrides.logLevel = opts.logLevel;
  const config = loadConfig(opts.env ?? process.env, overrides);

  const db = createDb(config);
  await migrate(db);
  if (opts.seed) {
    const { seedDemoIfEmpty } = await import('../seeds/demo.ts');
    await seedDemoIfEmpty(db, config.bcryptRounds);
  }
  await reanalyseOutdatedOnStart(db);
  const log = pino({ level: config.logLevel, redact: ['req.headers.authorization'] });
  // Stored results that no stack names any more go at start and then hourly (docs/contracts.md §Stored results).
  const sweep = () =>
    sweepResults(db).catch((err: unknown) => log.error({ err }, 'removing unused stored results failed'));
  await sweep();
  const sweeper = setInterval(() => void sweep(), SWEEP_EVERY_MS).unref();
  const mailer = await createMailer(config, db, log.child({ name: 'mail' }));
  const redis = config.redisUrl ? await connectRedis(config.redisUrl, log.child({ name: 'redis' })) : null;
  const offThread = createOffThread();
  const ctx: ServerContext = {
    db,
    config,
    log,
    mailer,
    broadcaster: nullBroadcaster,
    redis,
    offThread,
    outbox: { kick: () => undefined },
  };
  const app = createApp(ctx);
  const httpServer = createServer(app);
  const realtime = await attachRealtime(httpServer, ctx);
  await new Promise<void>((resolve, reject) => {
    httpServer.once('error', reject);
    httpServer.listen(config.port, () => resolve());
  });
  const { port } = httpServer.address() as AddressInfo;
  // On an ephemeral port (tests) the default public URL names the port actually bound.
  if (!overrides.publicUrl && !(opts.env ?? process.env).PUBLIC_URL) config.publicUrl = `http://localhost:${port}`;
  const mailSender = startMailSender(ctx, log.child({ name: 'mail' }));
  ctx.outbox = mailSender;

  let closing: Promise<void> | null = null;
  const close = () => {
    closing ??= (async () => {
      clearInterval(sweeper);
      httpServer.closeAllConnections();
      // Closes the live channel's sockets and the HTTP listener.
      await realtime.close();
      await mailSender.stop();
      await closeRedis(redis);
      await offThread.close();
      await mailer.close();
      await db.destroy();
    })();
    return closing;
  };
  return { url: `http://127.0.0.1:${port}`, port, app, httpServer, ctx, realtime, close };
}

/** The client of the sign-in limit: commands fail at once while Redis is away, so sign-in answers 503. */
async function connectRedis(url: string, log: Logger): Promise<RedisClient> {
  const client = createRedisClient(url, 'counters', log, { queueWhileOffline: false });
  await connectBounded(client, REDIS_START_WAIT_MS, log, 'counters');
  return client;
}
