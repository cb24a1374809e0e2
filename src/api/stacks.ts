// Stacks (docs/contracts.md §REST routes): a building's stacks as summaries, one stack's document, its
// edits over REST, and its history. The open stack page reads the document through the live channel's
// join instead (live.ts), in one reply.
import { z } from 'zod';
import type { CreateStackBody, PatchStackBody, StackDetail, StackSummary } from '@shared/schema/api.ts';
import type { Op } from '@shared/schema/ops.ts';
import type { StackAsOf, StackHistory } from '@shared/history/historyTypes.ts';
import {
  createdStackSchema,
  opsReplySchema,
  stackAsOfSchema,
  stackDetailSchema,
  stackHistorySchema,
  stackSummarySchema,
} from '@shared/schema/replies.ts';
import { http } from './http.ts';

export async function listStacks(buildingId: number): Promise<StackSummary[]> {
  return z.array(stackSummarySchema).parse(await http.get(`/buildings/${buildingId}/stacks`));
}

export async function createStack(buildingId: number, body: CreateStackBody): Promise<{ id: number; name: string }> {
  return createdStackSchema.parse(await http.post(`/buildings/${buildingId}/stacks`, body));
}

export async function getStack(stackId: number): Promise<StackDetail> {
  return stackDetailSchema.parse(await http.get(`/stacks/${stackId}`));
}

export async function renameStack(stackId: number, body: PatchStackBody): Promise<void> {
  await http.patch(`/stacks/${stackId}`, body);
}

export async function removeStack(stackId: number): Promise<void> {
  await http.delete(`/stacks/${stackId}`);
}

/** Edits a stack that is not open, on the version they were made against (409 when it moved on). */
export async function applyStackOps(stackId: number, baseVersion: number, ops: Op[]): Promise<{ version: number }> {
  return opsReplySchema.parse(await http.post(`/stacks/${stackId}/ops`, { ops, baseVersion }));
}

export async function getStackHistory(stackId: number): Promise<StackHistory> {
  return stackHistorySchema.parse(await http.get(`/stacks/${stackId}/history`));
}

export async function getStackAsOf(stackId: number, version: number): Promise<StackAsOf> {
  return stackAsOfSchema.parse(await http.get(`/stacks/${stackId}/versions/${version}`));
}

/** Makes an earlier version the next one, on the version the page shows. */
export async function restoreStackVersion(stackId: number, version: number, baseVersion: number): Promise<void> {
  await http.post(`/stacks/${stackId}/versions/${version}/restore`, { baseVersion });
}
