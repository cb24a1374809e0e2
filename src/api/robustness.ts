// A building's robustness summary: which splices meet the tie force of its consequence class.
import type { RobustnessSummary } from '@shared/engine/connections/robustnessSummary.ts';
import { apiFetch } from './http.ts';

export const robustnessApi = {
  get: (buildingId: number) => apiFetch<RobustnessSummary>('GET', `/buildings/${buildingId}/robustness`),
};
