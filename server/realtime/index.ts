// Socket.IO on the API's HTTP server (issue 6): JWT in the handshake, typed events, rooms per stack
// and per building. With REDIS_URL (issue 13) rooms are shared by every server process.
import type { Server as HttpServer } from 'node:http';
import { Server } from 'socket.io';
import { pino } from 'pino';
import type { ServerContext } from '../context.ts';
import { HttpError } from '../errors.ts';
import { verifyToken } from '../services/tokens.ts';
import { findUserById } from '../services/users.ts';
import { socketBroadcaster } from './broadcaster.ts';
import { registerHandlers } from './handlers.ts';
import type { LiveServer } from './types.ts';

export interface Realtime {
  io: LiveServer;
  close(): Promise<void>;
}

export function attachRealtime(httpServer: HttpServer, ctx: ServerContext): Realtime {
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

  io.on('connection', (socket) => registerHandlers(ctx, io, socket, log));
  ctx.broadcaster = socketBroadcaster(io);

  return {
    io,
    close: () => new Promise<void>((resolve) => void io.close(() => resolve())),
  };
}
