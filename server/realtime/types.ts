import type { Server, Socket } from 'socket.io';
import type { User } from '../../shared/schema/api.ts';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/schema/socket.ts';

/** Per-connection state, kept on the socket so the Redis adapter can see it from any process. */
export interface SocketData {
  user: User;
  /** The session version the socket's token carried (users.token_version). */
  tokenVersion: number;
  /** When the socket's token expires, ms since the epoch: after it the socket may do nothing. */
  expiresAt: number;
  /** Selected node ids per stack the socket has joined. */
  selections: Record<number, string[]>;
}

/** The processes send each other no events of their own (the Redis adapter carries the rooms). */
export type InterServerEvents = Record<string, never>;
export type LiveServer = Server<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;
export type LiveSocket = Socket<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;
