// The live channel (docs/contracts.md §Live events): a typed Socket.IO client and promise wrappers
// around the acknowledged events, so the store never handles raw ack shapes.
import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents, StackJoinAck } from '@shared/schema/socket.ts';
import type { ErrorCode } from '@shared/schema/errors.ts';
import type { Op } from '@shared/schema/ops.ts';
import { notifyUnauthorised } from './http.ts';

export type LiveSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

/** How long an acknowledged event may wait before it is treated as lost. */
export const ACK_TIMEOUT_MS = 15_000;

export class LiveError extends Error {
  constructor(
    readonly code: ErrorCode | 'timeout',
    message: string,
  ) {
    super(message);
    this.name = 'LiveError';
  }
}

/** Connects to the same origin (path /socket.io) unless a URL is given (tests, a separate API host). */
export function connectLive(token: string, url?: string): LiveSocket {
  const options = { auth: { token }, path: '/socket.io', transports: ['websocket', 'polling'] };
  const socket: LiveSocket = url ? io(url, options) : io(options);
  // The server ends a socket whose session expired or was signed out: sign in again.
  socket.on('session:ended', () => notifyUnauthorised());
  return socket;
}

type AckResult<T> = { ok: true; data: T } | { ok: false; error: { code: ErrorCode; message: string } };

/** The data of an acknowledgement, or its error as a LiveError; Socket.IO's own timeout rejects a late answer. */
async function answer<T>(acknowledged: Promise<AckResult<T>>): Promise<T> {
  let res: AckResult<T>;
  try {
    res = await acknowledged;
  } catch {
    // With timeout(), emitWithAck rejects only when no acknowledgement came in time.
    throw new LiveError('timeout', 'The server did not answer in time');
  }
  if (res.ok) return res.data;
  throw new LiveError(res.error.code, res.error.message);
}

export function joinStack(socket: LiveSocket, stackId: number): Promise<StackJoinAck> {
  return answer(socket.timeout(ACK_TIMEOUT_MS).emitWithAck('stack:join', { stackId }));
}

export function sendEdit(
  socket: LiveSocket,
  stackId: number,
  baseVersion: number,
  ops: Op[],
): Promise<{ version: number }> {
  return answer(socket.timeout(ACK_TIMEOUT_MS).emitWithAck('stack:edit', { stackId, baseVersion, ops }));
}

export function selectNodes(socket: LiveSocket, stackId: number, nodeIds: string[]): void {
  socket.emit('stack:select', { stackId, nodeIds: nodeIds.slice(0, 200) });
}

export function leaveStack(socket: LiveSocket, stackId: number): void {
  socket.emit('stack:leave', { stackId });
}
