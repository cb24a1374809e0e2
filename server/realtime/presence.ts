// Who is in a stack room and what each person has selected. Derived from the sockets themselves
// (socket.data), which the Redis adapter can fetch across processes: no process holds presence alone.
import type { Server } from 'socket.io';
import type { PresenceUser } from '../../shared/schema/socket.ts';
import type { LiveServer } from './types.ts';

export const stackRoom = (stackId: number) => `stack:${stackId}`;
export const buildingRoom = (buildingId: number) => `building:${buildingId}`;
/** Every socket of one user, on any process: where access changes and sign-outs are sent. */
export const userRoom = (userId: number) => `user:${userId}`;

/** Sockets in the room on every process; this process's own when the others cannot be asked (Redis away). */
async function roomSockets(io: LiveServer, stackId: number) {
  try {
    return await io.in(stackRoom(stackId)).fetchSockets();
  } catch {
    // Redis is away or another process did not answer in time (logged by the Redis clients).
    return io.local.in(stackRoom(stackId)).fetchSockets();
  }
}

export async function presenceOf(io: LiveServer | Server, stackId: number): Promise<PresenceUser[]> {
  const sockets = await roomSockets(io as LiveServer, stackId);
  const byUser = new Map<number, PresenceUser>();
  for (const s of sockets) {
    const user = s.data.user;
    if (!user) continue;
    const selection = s.data.selections?.[stackId] ?? [];
    const known = byUser.get(user.id);
    if (known) known.selection = [...new Set([...known.selection, ...selection])];
    else byUser.set(user.id, { userId: user.id, name: user.name, selection: [...selection] });
  }
  return [...byUser.values()].sort((a, b) => a.name.localeCompare(b.name) || a.userId - b.userId);
}

const shuttingDown = new WeakSet<LiveServer>();

/**
 * Stops presence broadcasts while the server shuts down: sockets leaving then must not publish
 * through an adapter (Redis) that is being closed.
 */
export function stopPresence(io: LiveServer): void {
  shuttingDown.add(io);
}

export const isShuttingDown = (io: LiveServer): boolean => shuttingDown.has(io);

export async function broadcastPresence(io: LiveServer, stackId: number): Promise<void> {
  if (shuttingDown.has(io)) return;
  const users = await presenceOf(io, stackId);
  if (shuttingDown.has(io)) return;
  io.to(stackRoom(stackId)).emit('presence', { stackId, users });
}
