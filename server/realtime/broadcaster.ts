// The Socket.IO implementation of the Broadcaster: committed changes go to the stack's room and a
// summary to the building's room. With the Redis adapter these reach clients on every process.
import type { Broadcaster } from '../services/broadcast.ts';
import { buildingRoom, isShuttingDown, stackRoom } from './presence.ts';
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
    buildingModelChanged(payload) {
      if (isShuttingDown(io)) return;
      io.to(buildingRoom(payload.buildingId)).emit('building:model-changed', payload);
    },
  };
}
