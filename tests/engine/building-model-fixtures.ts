// An invented building for the building-model tests: an irregular grid with a cantilever and a slab edge,
// an office build-up and a roof build-up (demo data, no real building).
import type { Buildup, BuildingModel, Grid } from '../../shared/schema/building.ts';

/** x lines A 0, B 6, C 13.5, D 21 m; y lines 1 0, 2 7.5, 3 15 m. The floor runs 0.3 m beyond A, 1.5 m beyond D, 0.2 m beyond 3. */
export const GRID: Grid = {
  x: {
    lines: [
      { id: 'A', name: 'A', position: 0 },
      { id: 'B', name: 'B', position: 6 },
      { id: 'C', name: 'C', position: 13.5 },
      { id: 'D', name: 'D', position: 21 },
    ],
    edgeBefore: 0.3,
    edgeAfter: 1.5,
  },
  y: {
    lines: [
      { id: 'y1', name: '1', position: 0 },
      { id: 'y2', name: '2', position: 7.5 },
      { id: 'y3', name: '3', position: 15 },
    ],
    edgeBefore: 0,
    edgeAfter: 0.2,
  },
};

/** gk = 3.5 + 1.2 + 0.5 + 0.3 = 5.5 kN/m²; qk = 2.5 + 1.0 (movable partitions, imposed) = 3.5 kN/m², category B. */
export const OFFICE: Buildup = {
  id: 'office',
  name: 'Office floor',
  permanent: [
    { label: 'Slab', gk: 3.5 },
    { label: 'Finishes', gk: 1.2 },
    { label: 'Services', gk: 0.5 },
    { label: 'Ceiling', gk: 0.3 },
  ],
  imposed: { qk: 2.5, category: 'B' },
  partitions: { load: 1.0, as: 'imposed' },
};

/** gk = 3.0 + 1.0 = 4.0 kN/m²; qk = 0.6 kN/m², category H. */
export const ROOF: Buildup = {
  id: 'roof',
  name: 'Roof',
  permanent: [
    { label: 'Slab', gk: 3.0 },
    { label: 'Roofing', gk: 1.0 },
  ],
  imposed: { qk: 0.6, category: 'H' },
};

export function officeModel(
  levels: { floors: string[]; roof?: string },
  lines: BuildingModel['floors'][number]['lines'] = [],
): BuildingModel {
  return {
    grid: GRID,
    buildups: [OFFICE, ROOF],
    floors: [
      ...levels.floors.map((levelId) => ({ levelId, buildupId: 'office', span: 'two-way' as const, lines })),
      ...(levels.roof ? [{ levelId: levels.roof, buildupId: 'roof', span: 'two-way' as const, lines: [] }] : []),
    ],
    overrides: {},
  };
}

/**
 * A smaller invented grid for the API and plan-view tests: x lines A 0, B 6, C 13.5 m; y lines 1 0, 2 7.5 m;
 * `edgeBeforeX` m of slab beyond A, none beyond the other lines.
 */
export function smallGrid(edgeBeforeX = 0): Grid {
  return {
    x: {
      lines: [
        { id: 'A', name: 'A', position: 0 },
        { id: 'B', name: 'B', position: 6 },
        { id: 'C', name: 'C', position: 13.5 },
      ],
      edgeBefore: edgeBeforeX,
      edgeAfter: 0,
    },
    y: {
      lines: [
        { id: 'y1', name: '1', position: 0 },
        { id: 'y2', name: '2', position: 7.5 },
      ],
      edgeBefore: 0,
      edgeAfter: 0,
    },
  };
}
