// Typical columns (docs/typical-columns.md): the further grid positions a stack stands at, their areas set by hand
// and each position's check. Replies are validated with the shared schemas.
import type { AreaOverride } from '@shared/schema/building.ts';
import {
  buildingPositionsReplySchema,
  stackPositionsReplySchema,
  type AddStackPositionBody,
  type BuildingPositionsReply,
  type StackPositionsReply,
} from '@shared/schema/stackPositions.ts';
import { apiFetch } from './http.ts';

const s = (stackId: number) => `/stacks/${stackId}/positions`;

export const stackPositionsApi = {
  list: async (stackId: number): Promise<StackPositionsReply> =>
    stackPositionsReplySchema.parse(await apiFetch<unknown>('GET', s(stackId))),
  add: async (stackId: number, body: AddStackPositionBody): Promise<StackPositionsReply> =>
    stackPositionsReplySchema.parse(await apiFetch<unknown>('POST', s(stackId), body)),
  remove: async (stackId: number, positionId: number): Promise<StackPositionsReply> =>
    stackPositionsReplySchema.parse(await apiFetch<unknown>('DELETE', `${s(stackId)}/${positionId}`)),
  /** A further position's areas set by hand; an empty list gives it the grid's areas again. */
  putAreaOverrides: async (
    stackId: number,
    positionId: number,
    overrides: AreaOverride[],
  ): Promise<StackPositionsReply> =>
    stackPositionsReplySchema.parse(
      await apiFetch<unknown>('PUT', `${s(stackId)}/${positionId}/area-overrides`, { overrides }),
    ),
  ofBuilding: async (buildingId: number): Promise<BuildingPositionsReply> =>
    buildingPositionsReplySchema.parse(await apiFetch<unknown>('GET', `/buildings/${buildingId}/stack-positions`)),
};
