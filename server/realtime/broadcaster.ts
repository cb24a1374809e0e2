// The Socket.IO implementation of the Broadcaster: committed changes go to the stack's room and a
// summary to the building's room. With the Redis adapter these reach clients on every process.
import type { Broadcaster } from '../services/broadcast.ts';
import { buildingRoom, stackRoom } from './presence.ts';
import type { LiveServer } from './types.ts';

export function socketBroadcaster(io: LiveServer): Broadcaster {
  return {
    stackChanged({ buildingId: _buildingId, ...payload }) {
      io.to(stackRoom(payload.stackId)).emit('stack:changed', payload);
    },
    buildingStackChanged(payload) {
      io.to(buildingRoom(payload.buildingId)).emit('building:stack-changed', payload);
    },
  };
}
