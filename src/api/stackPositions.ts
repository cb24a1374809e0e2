// Typical columns (docs/typical-columns.md): the further grid positions a stack stands at and each position's
// check. Replies are validated with the shared schemas.
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
  ofBuilding: async (buildingId: number): Promise<BuildingPositionsReply> =>
    buildingPositionsReplySchema.parse(await apiFetch<unknown>('GET', `/buildings/${buildingId}/stack-positions`)),
};
