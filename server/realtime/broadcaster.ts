// The Socket.IO implementation of the Broadcaster: committed changes go to the stack's room and a
// summary to the building's room. With the Redis adapter these reach clients on every process.
import type { Broadcaster } from '../services/broadcast.ts';
import { buildingRoom, isShuttingDown, stackRoom } from './presence.ts';
import type { LiveServer } from './types.ts';

export function socketBroadcaster(io: LiveServer): Broadcaster {
  return {
    stackChanged({ buildingId: _buildingId, ...payload }) {
      // Changes committed while the server closes are in the database; clients catch up on reconnect.
      if (isShuttingDown(io)) return;
      io.to(stackRoom(payload.stackId)).emit('stack:changed', payload);
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
