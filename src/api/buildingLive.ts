// A building's live channel: stack results that change while the building page is open.
import type { BuildingModelChanged } from '@shared/schema/building.ts';
import type { BuildingRevisionChanged, BuildingStackChanged } from '@shared/schema/socket.ts';
import {
  buildingModelChangedSchema,
  buildingRevisionChangedSchema,
  buildingStackChangedSchema,
  buildingStacksChangedSchema,
} from '@shared/schema/replies.ts';
import { connectLive, type LiveSocket } from './live.ts';

export interface BuildingWatch {
  stop: () => void;
}

/** Joins the building's room and calls onChange for every stack whose results change; stop() disconnects. */
export function watchBuilding(
  token: string,
  buildingId: number,
  onChange: (change: BuildingStackChanged) => void,
  onError: (message: string) => void,
  onModelChange?: (change: BuildingModelChanged) => void,
  onRevisionChange?: (change: BuildingRevisionChanged) => void,
): BuildingWatch {
  const socket: LiveSocket = connectLive(token);
  const join = () =>
    socket.emit('building:join', { buildingId }, (res) => {
      if (!res.ok) onError(`Live updates are off: ${res.error.message}`);
    });
  socket.on('connect', join);
  // Each event is checked against its shared schema; one that fails is reported, not applied.
  const unreadable = () => onError('A live update could not be read; reload the page to see the latest figures');
  socket.on('building:stack-changed', (raw) => {
    const change = buildingStackChangedSchema.safeParse(raw);
    if (!change.success) return unreadable();
    if (change.data.buildingId === buildingId) onChange(change.data);
  });
  // One write that re-analysed several stacks (a floor load, the grid, the options) sends them together.
  socket.on('building:stacks-changed', (raw) => {
    const changes = buildingStacksChangedSchema.safeParse(raw);
    if (!changes.success) return unreadable();
    if (changes.data.buildingId === buildingId) for (const change of changes.data.stacks) onChange(change);
  });
  socket.on('building:model-changed', (raw) => {
    const change = buildingModelChangedSchema.safeParse(raw);
    if (!change.success) return unreadable();
    if (change.data.buildingId === buildingId) onModelChange?.(change.data);
  });
  socket.on('building:revision-changed', (raw) => {
    const change = buildingRevisionChangedSchema.safeParse(raw);
    if (!change.success) return unreadable();
    if (change.data.buildingId === buildingId) onRevisionChange?.(change.data);
  });
  return {
    stop: () => {
      socket.removeAllListeners();
      socket.disconnect();
    },
  };
}
