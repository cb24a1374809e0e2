// Buildings, their members and their levels (docs/contracts.md §REST routes).
import type { z } from 'zod';
import type {
  Building,
  BuildingSummary,
  Level,
  LevelMovePreview,
  Member,
  addMemberBodySchema,
  createBuildingBodySchema,
  createLevelBodySchema,
  updateBuildingBodySchema,
  updateLevelBodySchema,
  updateMemberBodySchema,
} from '@shared/schema/api.ts';
import type { ColumnSchedule } from '@shared/schedule/columnSchedule.ts';
import { apiFetch } from './http.ts';

export type CreateBuildingBody = z.output<typeof createBuildingBodySchema>;
export type UpdateBuildingBody = z.output<typeof updateBuildingBodySchema>;
export type AddMemberBody = z.output<typeof addMemberBodySchema>;
export type UpdateMemberBody = z.output<typeof updateMemberBodySchema>;
export type CreateLevelBody = z.output<typeof createLevelBodySchema>;
export type UpdateLevelBody = z.output<typeof updateLevelBodySchema>;

const b = (id: number) => `/buildings/${id}`;

export const buildingsApi = {
  list: () => apiFetch<BuildingSummary[]>('GET', '/buildings'),
  create: (body: CreateBuildingBody) => apiFetch<Building>('POST', '/buildings', body),
  get: (id: number) => apiFetch<Building>('GET', b(id)),
  update: (id: number, body: UpdateBuildingBody) => apiFetch<Building>('PATCH', b(id), body),
};

export const membersApi = {
  list: (buildingId: number) => apiFetch<Member[]>('GET', `${b(buildingId)}/members`),
  add: (buildingId: number, body: AddMemberBody) => apiFetch<Member>('POST', `${b(buildingId)}/members`, body),
  update: (buildingId: number, memberId: string | number, body: UpdateMemberBody) =>
    apiFetch<Member>('PATCH', `${b(buildingId)}/members/${encodeURIComponent(memberId)}`, body),
  remove: (buildingId: number, memberId: string | number) =>
    apiFetch<void>('DELETE', `${b(buildingId)}/members/${encodeURIComponent(memberId)}`),
};

export const levelsApi = {
  list: (buildingId: number) => apiFetch<Level[]>('GET', `${b(buildingId)}/levels`),
  create: (buildingId: number, body: CreateLevelBody) => apiFetch<Level>('POST', `${b(buildingId)}/levels`, body),
  update: (buildingId: number, levelId: string, body: UpdateLevelBody) =>
    apiFetch<Level>('PATCH', `${b(buildingId)}/levels/${encodeURIComponent(levelId)}`, body),
  remove: (buildingId: number, levelId: string) =>
    apiFetch<void>('DELETE', `${b(buildingId)}/levels/${encodeURIComponent(levelId)}`),
  /** What moving the level would do to the stacks; stores nothing. */
  previewMove: (buildingId: number, levelId: string, elevation: number) =>
    apiFetch<LevelMovePreview>('POST', `${b(buildingId)}/levels/${encodeURIComponent(levelId)}/preview`, { elevation }),
};

export const scheduleApi = {
  get: (buildingId: number) => apiFetch<ColumnSchedule>('GET', `${b(buildingId)}/schedule`),
  /** Path of a download, for downloadFile. */
  file: (buildingId: number, format: 'csv' | 'xlsx' | 'dxf') => `${b(buildingId)}/schedule.${format}`,
};
