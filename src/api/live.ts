// The live channel (docs/contracts.md §Live events): a typed Socket.IO client and promise wrappers
// around the acknowledged events, so the store never handles raw ack shapes.
import { io, type Socket } from 'socket.io-client';
import type {
  ClientToServerEvents,
  ServerToClientEvents,
  StackChanged,
  StackEditAck,
  StackJoinAck,
} from '@shared/schema/socket.ts';
import { stackChangedSchema, stackEditAckSchema, stackJoinAckSchema } from '@shared/schema/replies.ts';
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

/** Joins the stack's room; the answer is everything the stack page needs (docs/live-protocol.md). */
export async function joinStack(socket: LiveSocket, stackId: number): Promise<StackJoinAck> {
  return stackJoinAckSchema.parse(await answer(socket.timeout(ACK_TIMEOUT_MS).emitWithAck('stack:join', { stackId })));
}

/** Sends one edit; `editId` comes back in the ack and in the edit's `stack:changed`. */
export async function sendEdit(
  socket: LiveSocket,
  stackId: number,
  baseVersion: number,
  ops: Op[],
  editId?: string,
): Promise<StackEditAck> {
  const payload = editId ? { stackId, baseVersion, ops, editId } : { stackId, baseVersion, ops };
  return stackEditAckSchema.parse(await answer(socket.timeout(ACK_TIMEOUT_MS).emitWithAck('stack:edit', payload)));
}

/** Calls `listener` with each change to a stack, checked against the shared schema; a malformed one is
 *  passed to `onMalformed` (the store re-joins to take the server's state instead). */
export function onStackChanged(
  socket: LiveSocket,
  listener: (change: StackChanged) => void,
  onMalformed: () => void,
): void {
  socket.on('stack:changed', (raw) => {
    const parsed = stackChangedSchema.safeParse(raw);
    if (parsed.success) listener(parsed.data);
    else onMalformed();
  });
}

let editCount = 0;
/** A fresh edit id: unique within this page (a counter) and across pages and people (time and randomness). */
export function newEditId(): string {
  editCount++;
  return `${Date.now().toString(36)}-${editCount.toString(36)}-${Math.random().toString(36).slice(2, 10)}`;
}

/** Whether the live channel refused because the session ended (handshake or event): sign in again. */
export function isSessionRefusal(e: unknown): boolean {
  const data = (e as { data?: { code?: unknown } } | null)?.data;
  return data?.code === 'unauthenticated';
}

export function selectNodes(socket: LiveSocket, stackId: number, nodeIds: string[]): void {
  socket.emit('stack:select', { stackId, nodeIds: nodeIds.slice(0, 200) });
}

export function leaveStack(socket: LiveSocket, stackId: number): void {
  socket.emit('stack:leave', { stackId });
}
