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
import { apiFetch } from './http.ts';

export type ModelCsvKind = 'grid' | 'floor-loads';

function form(file: File, fileHash?: string): FormData {
  const body = new FormData();
  if (fileHash) body.append('fileHash', fileHash);
  body.append('file', file);
  return body;
}

export type FloorLoadBody = z.input<typeof putFloorLoadBodySchema>;

const b = (id: number) => `/buildings/${id}`;

export const buildingModelApi = {
  get: (buildingId: number) => apiFetch<BuildingModelReply>('GET', `${b(buildingId)}/model`),
  putGrid: (buildingId: number, grid: Grid) => apiFetch<BuildingModelReply>('PUT', `${b(buildingId)}/grid`, { grid }),
  putBuildups: (buildingId: number, buildups: Buildup[]) =>
    apiFetch<BuildingModelReply>('PUT', `${b(buildingId)}/buildups`, { buildups }),
  putFloorLoad: (buildingId: number, levelId: string, body: FloorLoadBody) =>
    apiFetch<BuildingModelReply>('PUT', `${b(buildingId)}/levels/${encodeURIComponent(levelId)}/floor-load`, body),
  place: (stackId: number, placement: StackPlacement) =>
    apiFetch<Placement>('PUT', `/stacks/${stackId}/placement`, placement),
  previewCsv: (buildingId: number, kind: ModelCsvKind, file: File) =>
    apiFetch<GridPreview | FloorLoadsPreview>('POST', `${b(buildingId)}/imports/${kind}`, form(file)),
  applyCsv: (buildingId: number, kind: ModelCsvKind, file: File, fileHash: string) =>
    apiFetch<unknown>('POST', `${b(buildingId)}/imports/${kind}/apply`, form(file, fileHash)),
  putAreaOverrides: (stackId: number, overrides: AreaOverride[]) =>
    apiFetch<BuildingModelReply>('PUT', `/stacks/${stackId}/area-overrides`, { overrides }),
};
