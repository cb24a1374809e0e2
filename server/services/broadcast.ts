// How committed stack changes reach live rooms. The realtime module replaces ctx.broadcaster with a
// Socket.IO implementation; REST writes call it after commit, so they reach live rooms too.
import type { BuildingModelChanged } from '../../shared/schema/building.ts';
import type { BuildingStackChanged, StackChanged } from '../../shared/schema/socket.ts';

export interface Broadcaster {
  stackChanged(p: StackChanged & { buildingId: number }): void;
  buildingStackChanged(p: BuildingStackChanged): void;
  buildingModelChanged(p: BuildingModelChanged): void;
}

export const nullBroadcaster: Broadcaster = {
  stackChanged: () => undefined,
  buildingStackChanged: () => undefined,
  buildingModelChanged: () => undefined,
};
