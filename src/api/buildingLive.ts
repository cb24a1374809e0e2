// A building's live channel: stack results that change while the building page is open.
import type { BuildingModelChanged } from '@shared/schema/building.ts';
import type { BuildingStackChanged } from '@shared/schema/socket.ts';
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
): BuildingWatch {
  const socket: LiveSocket = connectLive(token);
  const join = () =>
    socket.emit('building:join', { buildingId }, (res) => {
      if (!res.ok) onError(`Live updates are off: ${res.error.message}`);
    });
  socket.on('connect', join);
  socket.on('building:stack-changed', (change) => {
    if (change.buildingId === buildingId) onChange(change);
  });
  socket.on('building:model-changed', (change) => {
    if (change.buildingId === buildingId) onModelChange?.(change);
  });
  return {
    stop: () => {
      socket.removeAllListeners();
      socket.disconnect();
    },
  };
}
