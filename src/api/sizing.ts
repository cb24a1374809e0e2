// Sizing previews (docs/analysis-rules.md §Sizing): the lightest passing sections of a stack or a building.
// They store nothing; accepting them is an edit (stacks.ts, or the open stack's live queue).
import type { BuildingSizingPreview, SizingRequest, StackSizingPreview } from '@shared/schema/sizing.ts';
import { buildingSizingPreviewSchema, stackSizingPreviewSchema } from '@shared/schema/replies.ts';
import { http } from './http.ts';

export async function proposeForStack(stackId: number, request: SizingRequest): Promise<StackSizingPreview> {
  return stackSizingPreviewSchema.parse(await http.post(`/stacks/${stackId}/sizing`, request));
}

export async function proposeForBuilding(buildingId: number, request: SizingRequest): Promise<BuildingSizingPreview> {
  return buildingSizingPreviewSchema.parse(await http.post(`/buildings/${buildingId}/sizing`, request));
}
