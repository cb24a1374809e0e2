// Real socket.io-client connections to a test server, with promise-returning emits.
import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/schema/socket.ts';
import type { ApiErrorBody } from '../../shared/schema/errors.ts';

export type LiveClient = Socket<ServerToClientEvents, ClientToServerEvents>;
export type AckReply<T> = { ok: true; data: T } | ({ ok: false } & ApiErrorBody);

export function connect(url: string, token: string | null): Promise<LiveClient> {
  const socket: LiveClient = io(url, { auth: token ? { token } : {}, transports: ['websocket'], reconnection: false, forceNew: true });
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket));
    socket.once('connect_error', (err) => {
      socket.close();
      reject(err);
    });
  });
}

/** Emits an event and resolves with its acknowledgement (any payload, valid or not). */
export function request<T>(socket: LiveClient, event: string, payload: unknown, timeoutMs = 10_000): Promise<AckReply<T>> {
  return new Promise((resolve, reject) => {
    const emit = socket.timeout(timeoutMs).emit as unknown as (e: string, p: unknown, cb: (err: Error | null, res: AckReply<T>) => void) => void;
    emit.call(socket.timeout(timeoutMs), event, payload, (err, res) => (err ? reject(err) : resolve(res)));
  });
}

/** Resolves with the next `event` that satisfies `match`, or rejects after timeoutMs. */
export function next<E extends keyof ServerToClientEvents>(
  socket: LiveClient,
  event: E,
  match: (p: Parameters<ServerToClientEvents[E]>[0]) => boolean = () => true,
  timeoutMs = 5000,
): Promise<Parameters<ServerToClientEvents[E]>[0]> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      socket.off(event, listener as never);
      reject(new Error(`no ${String(event)} within ${timeoutMs} ms`));
    }, timeoutMs);
    const listener = (p: Parameters<ServerToClientEvents[E]>[0]) => {
      if (!match(p)) return;
      clearTimeout(timer);
      socket.off(event, listener as never);
      resolve(p);
    };
    socket.on(event, listener as never);
  });
}
