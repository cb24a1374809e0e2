// The Socket.IO implementation of the Broadcaster: committed changes go to the stack's room and a
// summary to the building's room. With the Redis adapter these reach clients on every process, and
// socketsLeave / disconnectSockets on the user's own room reach that user's sockets on every process too.
import type { Broadcaster } from '../services/broadcast.ts';
import { broadcastPresence, buildingRoom, isShuttingDown, stackRoom, userRoom } from './presence.ts';
import type { LiveServer } from './types.ts';

export function socketBroadcaster(io: LiveServer, opts: { sharedRooms?: boolean } = {}): Broadcaster {
  // Socket.IO encodes a packet before it looks at the room. A building-wide change re-analyses hundreds of
  // stacks whose rooms are mostly empty, so on one process an empty room is skipped; with rooms shared
  // through Redis, other processes may hold members, so every change is sent.
  const heard = (room: string) => opts.sharedRooms || (io.sockets.adapter.rooms.get(room)?.size ?? 0) > 0;
  return {
    stackChanged({ buildingId: _buildingId, ...payload }) {
      // Changes committed while the server closes are in the database; clients catch up on reconnect.
      if (isShuttingDown(io)) return;
      const room = stackRoom(payload.stackId);
      if (heard(room)) io.to(room).emit('stack:changed', payload);
    },
    buildingStackChanged(payload) {
      if (isShuttingDown(io)) return;
      io.to(buildingRoom(payload.buildingId)).emit('building:stack-changed', payload);
    },
    buildingStacksChanged(payload) {
      if (isShuttingDown(io)) return;
      io.to(buildingRoom(payload.buildingId)).emit('building:stacks-changed', payload);
    },
    async accessRevoked({ userId, buildingId, stackIds }) {
      if (isShuttingDown(io)) return;
      const mine = io.in(userRoom(userId));
      // Joined stack rooms first: the set is taken before leaving, so presence can be told afterwards.
      const sockets = await mine.fetchSockets();
      const rooms = new Set(sockets.flatMap((s) => [...s.rooms]));
      mine.socketsLeave([buildingRoom(buildingId), ...stackIds.map(stackRoom)]);
      io.to(userRoom(userId)).emit('access:revoked', { buildingId });
      await Promise.all(stackIds.filter((id) => rooms.has(stackRoom(id))).map((id) => broadcastPresence(io, id)));
    },
    async sessionsEnded({ userId }) {
      if (isShuttingDown(io)) return;
      io.to(userRoom(userId)).emit('session:ended', {
        reason: 'signed-out',
        message: 'You have signed out on this or another device; sign in again',
      });
      io.in(userRoom(userId)).disconnectSockets(true);
    },
    revisionChanged(payload) {
      if (isShuttingDown(io)) return;
      io.to(buildingRoom(payload.buildingId)).emit('building:revision-changed', payload);
    },
    buildingModelChanged(payload) {
      if (isShuttingDown(io)) return;
      io.to(buildingRoom(payload.buildingId)).emit('building:model-changed', payload);
    },
  };
}
