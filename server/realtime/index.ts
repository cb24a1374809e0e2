// Socket.IO on the API's HTTP server (issue 6): JWT in the handshake, typed events, rooms per stack
// and per building. With REDIS_URL (issue 13) rooms are shared by every server process.
import type { Server as HttpServer } from 'node:http';
import { Server } from 'socket.io';
import { createAdapter } from '@socket.io/redis-adapter';
import { createClient } from 'redis';
import { pino, type Logger } from 'pino';
import type { ServerContext } from '../context.ts';
import { HttpError } from '../errors.ts';
import { verifyToken } from '../services/tokens.ts';
import { findUserById } from '../services/users.ts';
import { socketBroadcaster } from './broadcaster.ts';
import { registerHandlers } from './handlers.ts';
import { stopPresence } from './presence.ts';
import type { LiveServer } from './types.ts';

export interface Realtime {
  io: LiveServer;
  close(): Promise<void>;
}

/** With REDIS_URL, rooms, presence and broadcasts are shared with every process on the same Redis. */
async function useRedis(io: LiveServer, url: string, prefix: string, log: Logger): Promise<() => Promise<void>> {
  const pub = createClient({ url });
  const sub = pub.duplicate();
  for (const c of [pub, sub]) c.on('error', (err: unknown) => log.error({ err }, 'redis connection error'));
  await Promise.all([pub.connect(), sub.connect()]);
  io.adapter(createAdapter(pub, sub, { key: `${prefix}#live`, requestsTimeout: 3000 }));
  return async () => {
    await Promise.allSettled([pub.quit(), sub.quit()]);
  };
}

export async function attachRealtime(httpServer: HttpServer, ctx: ServerContext): Promise<Realtime> {
  const log = pino({ level: ctx.config.logLevel, name: 'live' });
  const io: LiveServer = new Server(httpServer, {
    serveClient: false,
    maxHttpBufferSize: 1e6,
    // Edits are small; long-polling stays available for networks that block WebSockets.
    transports: ['websocket', 'polling'],
  });

  io.use(async (socket, next) => {
    try {
      const auth: unknown = socket.handshake.auth;
      const token = auth && typeof auth === 'object' && 'token' in auth && typeof auth.token === 'string' ? auth.token : null;
      if (!token) throw new HttpError(401, 'unauthenticated', 'Sign in to continue');
      const user = await findUserById(ctx.db, verifyToken(ctx.config.jwtSecret, token));
      if (!user) throw new HttpError(401, 'unauthenticated', 'This account no longer exists');
      socket.data.user = user;
      socket.data.selections = {};
      next();
    } catch (err) {
      const e = err instanceof HttpError ? err : new HttpError(401, 'unauthenticated', 'Sign in to continue');
      next(Object.assign(new Error(e.message), { data: { code: e.code } }));
    }
  });

  const closeRedis = ctx.config.redisUrl ? await useRedis(io, ctx.config.redisUrl, ctx.config.redisPrefix, log) : null;
  io.on('connection', (socket) => registerHandlers(ctx, io, socket, log));
  ctx.broadcaster = socketBroadcaster(io, { sharedRooms: closeRedis !== null });

  return {
    io,
    async close() {
      stopPresence(io);
      await new Promise<void>((resolve) => void io.close(() => resolve()));
      await closeRedis?.();
    },
  };
}
