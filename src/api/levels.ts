// A building's levels (docs/contracts.md §REST routes); lists come lowest first.
import { z } from 'zod';
import type { CreateLevelBody, Level, LevelMovePreview, UpdateLevelBody } from '@shared/schema/api.ts';
import { levelMovePreviewSchema, levelSchema } from '@shared/schema/replies.ts';
import { http, seg } from './http.ts';

const levels = (buildingId: number) => `/buildings/${buildingId}/levels`;

export async function listLevels(buildingId: number): Promise<Level[]> {
  return z.array(levelSchema).parse(await http.get(levels(buildingId)));
}

export async function createLevel(buildingId: number, body: CreateLevelBody): Promise<Level> {
  return levelSchema.parse(await http.post(levels(buildingId), body));
}

export async function updateLevel(buildingId: number, levelId: string, body: UpdateLevelBody): Promise<Level> {
  return levelSchema.parse(await http.patch(`${levels(buildingId)}/${seg(levelId)}`, body));
}

export async function removeLevel(buildingId: number, levelId: string): Promise<void> {
  await http.delete(`${levels(buildingId)}/${seg(levelId)}`);
}

/** What moving the level would do to the stacks; stores nothing. */
export async function previewLevelMove(
  buildingId: number,
  levelId: string,
  elevation: number,
): Promise<LevelMovePreview> {
  return levelMovePreviewSchema.parse(await http.post(`${levels(buildingId)}/${seg(levelId)}/preview`, { elevation }));
}
