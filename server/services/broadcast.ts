// How committed stack changes reach live rooms. The realtime module replaces ctx.broadcaster with a
// Socket.IO implementation; REST writes call it after commit, so they reach live rooms too.
import type { BuildingModelChanged } from '../../shared/schema/building.ts';
import type {
  BuildingRevisionChanged,
  BuildingStackChanged,
  BuildingStacksChanged,
  StackChanged,
} from '../../shared/schema/socket.ts';

export interface Broadcaster {
  stackChanged(p: StackChanged & { buildingId: number }): void;
  buildingStackChanged(p: BuildingStackChanged): void;
  /** Several stacks of one building changed by one write: one message for all of them. */
  buildingStacksChanged(p: BuildingStacksChanged): void;
  /**
   * The user may no longer read the building: their open sockets, on every process, leave the rooms of
   * the building and of its stacks at once (docs/access.md).
   */
  accessRevoked(p: { userId: number; buildingId: number; stackIds: number[] }): Promise<void>;
  /** Every session of the user ended (sign-out, password change): their open sockets are closed. */
  sessionsEnded(p: { userId: number }): Promise<void>;
  buildingModelChanged(p: BuildingModelChanged): void;
  /** A revision's state or comments changed: the building's members refresh what they show of it. */
  revisionChanged(p: BuildingRevisionChanged): void;
}

export const nullBroadcaster: Broadcaster = {
  stackChanged: () => undefined,
  buildingStackChanged: () => undefined,
  buildingStacksChanged: () => undefined,
  accessRevoked: async () => undefined,
  sessionsEnded: async () => undefined,
  buildingModelChanged: () => undefined,
  revisionChanged: () => undefined,
};
