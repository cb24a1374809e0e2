// A building's stacks as summaries for the building page (docs/contracts.md §REST routes). The stack editor reads and
// writes the document itself through its own store.
import type { z } from 'zod';
import type { StackSummary, createStackBodySchema, patchStackBodySchema } from '@shared/schema/api.ts';
import type { StackAsOf, StackHistory } from '@shared/history/historyTypes.ts';
import { apiFetch } from './http.ts';

export type CreateStackBody = z.output<typeof createStackBodySchema>;
export type PatchStackBody = z.output<typeof patchStackBodySchema>;

export const stacksApi = {
  list: (buildingId: number) => apiFetch<StackSummary[]>('GET', `/buildings/${buildingId}/stacks`),
  create: (buildingId: number, body: CreateStackBody) =>
    apiFetch<Pick<StackSummary, 'id' | 'name'>>('POST', `/buildings/${buildingId}/stacks`, body),
  rename: (stackId: number, body: PatchStackBody) => apiFetch<StackSummary>('PATCH', `/stacks/${stackId}`, body),
  remove: (stackId: number) => apiFetch<void>('DELETE', `/stacks/${stackId}`),
};

export const stackHistoryApi = {
  history: (stackId: number) => apiFetch<StackHistory>('GET', `/stacks/${stackId}/history`),
  asOf: (stackId: number, version: number) => apiFetch<StackAsOf>('GET', `/stacks/${stackId}/versions/${version}`),
  restore: (stackId: number, version: number, baseVersion: number) =>
    apiFetch<unknown>('POST', `/stacks/${stackId}/versions/${version}/restore`, { baseVersion }),
};
