// Socket.IO on the API's HTTP server (docs/live-protocol.md): JWT in the handshake, typed events, rooms per stack
// and per building. With REDIS_URL (docs/live-protocol.md §Several processes) rooms are shared by every server process.
import type { Server as HttpServer } from 'node:http';
import { Server } from 'socket.io';
import { createAdapter } from '@socket.io/redis-adapter';
import type { Logger } from 'pino';
import type { ServerContext } from '../context.ts';
import { HttpError } from '../errors.ts';
import { closeRedis, connectBounded, createRedisClient, REDIS_START_WAIT_MS, safePublisher } from '../redis.ts';
import { verifySession } from '../services/tokens.ts';
import { userForSession } from '../services/users.ts';
import { socketBroadcaster } from './broadcaster.ts';
import { registerHandlers } from './handlers.ts';
import { stopPresence, userRoom } from './presence.ts';
import { endSession } from './session.ts';
import type { LiveServer, LiveSocket } from './types.ts';

export interface Realtime {
  io: LiveServer;
  close(): Promise<void>;
}

/**
 * With REDIS_URL, rooms, presence and broadcasts are shared with every process on the same Redis.
 * Without Redis (lost, or not there at start) the adapter serves this process's own sockets: a
 * publish that fails is dropped with a warning, the subscriber re-subscribes when Redis returns.
 */
async function useRedis(io: LiveServer, url: string, prefix: string, log: Logger): Promise<() => Promise<void>> {
  const pub = createRedisClient(url, 'live-publish', log, { queueWhileOffline: false });
  const sub = createRedisClient(url, 'live-subscribe', log, { queueWhileOffline: true });
  await Promise.all([
    connectBounded(pub, REDIS_START_WAIT_MS, log, 'live-publish'),
    connectBounded(sub, REDIS_START_WAIT_MS, log, 'live-subscribe'),
  ]);
  io.adapter(createAdapter(safePublisher(pub, log), sub, { key: `${prefix}#live`, requestsTimeout: 3000 }));
  return async () => {
    await Promise.allSettled([closeRedis(pub), closeRedis(sub)]);
  };
}

/** setTimeout takes at most 2^31-1 ms (about 24.8 days); a session token lives far less. */
const MAX_TIMER_MS = 2 ** 31 - 1;

/** Closes the socket when its token expires: a socket never outlives the session that opened it. */
function endAtExpiry(socket: LiveSocket): void {
  const timer = setTimeout(
    () => endSession(socket, 'expired'),
    Math.min(Math.max(0, socket.data.expiresAt - Date.now()), MAX_TIMER_MS),
  );
  socket.once('disconnect', () => clearTimeout(timer));
}

export async function attachRealtime(httpServer: HttpServer, ctx: ServerContext): Promise<Realtime> {
  const log = ctx.log.child({ name: 'live' });
  const io: LiveServer = new Server(httpServer, {
    serveClient: false,
    maxHttpBufferSize: 1e6,
    // Edits are small; long-polling stays available for networks that block WebSockets.
    transports: ['websocket', 'polling'],
  });

  io.use(async (socket, next) => {
    try {
      const auth: unknown = socket.handshake.auth;
      const token =
        auth && typeof auth === 'object' && 'token' in auth && typeof auth.token === 'string' ? auth.token : null;
      if (!token) throw new HttpError(401, 'unauthenticated', 'Sign in to continue');
      const claims = verifySession(ctx.config.jwtSecret, token);
      const { tokenVersion, ...user } = await userForSession(ctx.db, claims);
      socket.data.user = user;
      socket.data.tokenVersion = tokenVersion;
      socket.data.expiresAt = claims.expiresAt;
      socket.data.selections = {};
      next();
    } catch (err) {
      const e = err instanceof HttpError ? err : new HttpError(401, 'unauthenticated', 'Sign in to continue');
      next(Object.assign(new Error(e.message), { data: { code: e.code } }));
    }
  });

  const closeLiveRedis = ctx.config.redisUrl
    ? await useRedis(io, ctx.config.redisUrl, ctx.config.redisPrefix, log)
    : null;
  io.on('connection', (socket) => {
    void socket.join(userRoom(socket.data.user.id));
    endAtExpiry(socket);
    registerHandlers(ctx, io, socket, log);
  });
  ctx.broadcaster = socketBroadcaster(io, { sharedRooms: closeLiveRedis !== null });

  return {
    io,
    async close() {
      stopPresence(io);
      await new Promise<void>((resolve) => void io.close(() => resolve()));
      await closeLiveRedis?.();
    },
  };
}
