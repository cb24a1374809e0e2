// The building model (docs/building-model.md): grid, build-ups, floor loads, a stack's place and its areas set by hand.
import type { z } from 'zod';
import type {
  AreaOverride,
  Buildup,
  BuildingModelReply,
  Grid,
  Placement,
  putFloorLoadBodySchema,
  StackPlacement,
} from '@shared/schema/building.ts';
import type { FloorLoadsPreview, GridPreview } from '@shared/schema/imports.ts';
import { buildingModelReplySchema, modelCsvPreviewSchema, placementSchema } from '@shared/schema/replies.ts';
import { http, seg } from './http.ts';

export type ModelCsvKind = 'grid' | 'floor-loads';
export type FloorLoadBody = z.input<typeof putFloorLoadBodySchema>;

function form(file: File, fileHash?: string): FormData {
  const body = new FormData();
  if (fileHash) body.append('fileHash', fileHash);
  body.append('file', file);
  return body;
}

const b = (id: number) => `/buildings/${id}`;
const model = (reply: unknown): BuildingModelReply => buildingModelReplySchema.parse(reply);

export async function getModel(buildingId: number): Promise<BuildingModelReply> {
  return model(await http.get(`${b(buildingId)}/model`));
}

export async function putGrid(buildingId: number, grid: Grid): Promise<BuildingModelReply> {
  return model(await http.put(`${b(buildingId)}/grid`, { grid }));
}

export async function putBuildups(buildingId: number, buildups: Buildup[]): Promise<BuildingModelReply> {
  return model(await http.put(`${b(buildingId)}/buildups`, { buildups }));
}

export async function putFloorLoad(
  buildingId: number,
  levelId: string,
  body: FloorLoadBody,
): Promise<BuildingModelReply> {
  return model(await http.put(`${b(buildingId)}/levels/${seg(levelId)}/floor-load`, body));
}

export async function placeStack(stackId: number, placement: StackPlacement): Promise<Placement> {
  return placementSchema.parse(await http.put(`/stacks/${stackId}/placement`, placement));
}

export async function putAreaOverrides(stackId: number, overrides: AreaOverride[]): Promise<BuildingModelReply> {
  return model(await http.put(`/stacks/${stackId}/area-overrides`, { overrides }));
}

export async function previewModelCsv(
  buildingId: number,
  kind: ModelCsvKind,
  file: File,
): Promise<GridPreview | FloorLoadsPreview> {
  return modelCsvPreviewSchema.parse(await http.post(`${b(buildingId)}/imports/${kind}`, form(file)));
}

/** Applies a checked file; the model that results arrives on the building's live channel. */
export async function applyModelCsv(
  buildingId: number,
  kind: ModelCsvKind,
  file: File,
  fileHash: string,
): Promise<void> {
  await http.post(`${b(buildingId)}/imports/${kind}/apply`, form(file, fileHash));
}
