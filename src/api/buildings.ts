// Buildings (docs/contracts.md §REST routes): the list, one building with its analysis options.
import { z } from 'zod';
import type { Building, BuildingSummary, CreateBuildingBody, UpdateBuildingBody } from '@shared/schema/api.ts';
import { buildingSchema, buildingSummarySchema } from '@shared/schema/replies.ts';
import { http } from './http.ts';

export async function listBuildings(): Promise<BuildingSummary[]> {
  return z.array(buildingSummarySchema).parse(await http.get('/buildings'));
}

export async function createBuilding(body: CreateBuildingBody): Promise<Building> {
  return buildingSchema.parse(await http.post('/buildings', body));
}

export async function getBuilding(id: number): Promise<Building> {
  return buildingSchema.parse(await http.get(`/buildings/${id}`));
}

export async function updateBuilding(id: number, body: UpdateBuildingBody): Promise<Building> {
  return buildingSchema.parse(await http.patch(`/buildings/${id}`, body));
}
