// A building's robustness summary: which splices meet the tie force of its consequence class.
import type { RobustnessSummary } from '@shared/engine/connections/robustnessSummary.ts';
import { robustnessSummarySchema } from '@shared/schema/replies.ts';
import { http } from './http.ts';

export async function getRobustness(buildingId: number): Promise<RobustnessSummary> {
  return robustnessSummarySchema.parse(await http.get(`/buildings/${buildingId}/robustness`));
}
