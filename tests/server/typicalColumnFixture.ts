// A building ready for typical columns over the API (docs/typical-columns.md): the small invented A–C × 1–2 grid,
// four levels, an office floor on the first and second and a roof on the roof, and stacks made from one template at
// the building's levels (not yet placed on the grid).
import type { Level, StackSummary } from '../../shared/schema/api.ts';
import { smallGrid } from '../engine/building-model-fixtures.ts';
import { createLevels, type TestServer } from './helpers.ts';

// Invented grid: x lines A 0, B 6, C 13.5 m; y lines 1 0, 2 7.5 m; no slab beyond the lines.
export const GRID = smallGrid();
/**
 * Office floor: slab gk 5 kN/m² (invented demo load); qk 2.5 kN/m², category B (EN 1991-1-1 Table 6.2 with the UK
 * National Annex for general office use, from memory).
 */
export const OFFICE = {
  id: 'office',
  name: 'Office',
  permanent: [{ label: 'Slab', gk: 5 }],
  imposed: { qk: 2.5, category: 'B' },
};
/** Roof: gk 4 kN/m² (invented demo load); qk 0.6 kN/m², category H (EN 1991-1-1 Table 6.10, UK NA, from memory). */
export const ROOF = {
  id: 'roof',
  name: 'Roof',
  permanent: [{ label: 'Roof', gk: 4 }],
  imposed: { qk: 0.6, category: 'H' },
};

// Hand figures (half the bay each side, no slab beyond the lines):
// A/1 carries (0 + 6/2)(0 + 7.5/2) = 3 × 3.75 = 11.25 m² per level;
// B/2 carries (6/2 + 7.5/2)(7.5/2 + 0) = 6.75 × 3.75 = 25.3125 m² per level.
export const A1 = 11.25;
export const B2 = 25.3125;

/** Levels Ground 0, First 4, Second 8, Roof 12 m, the model above, and a stack per name, in that order. */
export async function typicalColumnBuilding(
  s: TestServer,
  token: string,
  buildingId: number,
  names: readonly string[],
): Promise<{ levels: Level[]; stacks: StackSummary[] }> {
  const levels = await createLevels(s, token, buildingId, [
    ['Ground', 0],
    ['First', 4],
    ['Second', 8],
    ['Roof', 12],
  ]);
  const template = { elevations: [0, 4, 8, 12], sections: ['UKC 203x203x46'], Gk: 100, Qk: 50 };
  const stacks: StackSummary[] = [];
  for (const name of names)
    stacks.push(
      (await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name, template } }))
        .body as StackSummary,
    );
  await s.api('PUT', `/buildings/${buildingId}/grid`, { token, body: { grid: GRID } });
  await s.api('PUT', `/buildings/${buildingId}/buildups`, { token, body: { buildups: [OFFICE, ROOF] } });
  for (const level of levels.slice(1))
    await s.api('PUT', `/buildings/${buildingId}/levels/${level.id}/floor-load`, {
      token,
      body: { buildupId: level.name === 'Roof' ? 'roof' : 'office' },
    });
  return { levels, stacks };
}
