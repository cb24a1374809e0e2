// The second invented demo building: a braced steel frame on a grid, so a first look meets the building model
// (docs/building-model.md): grid lines, floor build-ups, a floor load on every suspended level, and stacks on the
// crossings whose restraint loads come from their tributary areas. Four stacks stand for all sixteen crossings as
// typical columns (docs/typical-columns.md): a corner, an edge of each kind and an internal column. Every figure
// is invented. Built through the server's own services, so validation, results and the audit trail are real.
import type { Knex } from 'knex';
import { pino } from 'pino';
import type { StackTemplate, User } from '../shared/schema/api.ts';
import type { Buildup, Grid } from '../shared/schema/building.ts';
import type { ServerContext } from '../server/context.ts';
import { createBuilding } from '../server/services/buildings.ts';
import { nullBroadcaster } from '../server/services/broadcast.ts';
import { putBuildups, putFloorLoad, putGrid, placeStack } from '../server/services/buildingModel.ts';
import { createLevel } from '../server/services/levels.ts';
import { addMember } from '../server/services/members.ts';
import { addStackPosition } from '../server/services/stackPositions.ts';
import { createStack } from '../server/services/stacks.ts';

export const DEMO_GRID_BUILDING = { name: 'Demo steel frame on a grid', reference: 'DEMO-002' };

/** Ground, five office floors and a roof, 4.0 m apart (invented). */
export const DEMO_GRID_STOREY_HEIGHT = 4;
export const DEMO_GRID_LEVELS: { name: string; elevation: number }[] = [
  'Ground',
  'Level 1',
  'Level 2',
  'Level 3',
  'Level 4',
  'Level 5',
  'Roof',
].map((name, i) => ({ name, elevation: i * DEMO_GRID_STOREY_HEIGHT }));

/** The slab runs this far beyond the outermost grid lines on every side (m). */
export const DEMO_SLAB_EDGE = 0.3;

/** Lines named as their ids: the two families' names differ (letters along x, numbers along y). */
const lines = (names: string[], spacing: number) => names.map((name, i) => ({ id: name, name, position: i * spacing }));

/** Three bays of 7.5 m along x (A–D) and three of 6.0 m along y (1–4). */
export const DEMO_GRID: Grid = {
  x: { lines: lines(['A', 'B', 'C', 'D'], 7.5), edgeBefore: DEMO_SLAB_EDGE, edgeAfter: DEMO_SLAB_EDGE },
  y: { lines: lines(['1', '2', '3', '4'], 6), edgeBefore: DEMO_SLAB_EDGE, edgeAfter: DEMO_SLAB_EDGE },
};

export const DEMO_BUILDUPS: Buildup[] = [
  {
    id: 'office',
    name: 'Office floor',
    permanent: [
      { label: 'Composite slab, 150 mm', gk: 2.8 },
      { label: 'Screed, 50 mm', gk: 1.2 },
      { label: 'Ceiling and services', gk: 0.5 },
    ],
    imposed: { qk: 2.5, category: 'B' },
    // Movable partitions, taken as imposed load (EN 1991-1-1 6.3.1.2(8)).
    partitions: { load: 1, as: 'imposed' },
  },
  {
    id: 'roof',
    name: 'Roof',
    permanent: [
      { label: 'Composite slab, 150 mm', gk: 2.8 },
      { label: 'Insulation, membrane and ballast', gk: 0.7 },
      { label: 'Ceiling and services', gk: 0.5 },
    ],
    imposed: { qk: 0.6, category: 'H' },
  },
];

/** The build-up of each level's floor by level name; the ground slab bears on the ground, not on the columns. */
export const DEMO_FLOORS: Record<string, string> = {
  'Level 1': 'office',
  'Level 2': 'office',
  'Level 3': 'office',
  'Level 4': 'office',
  'Level 5': 'office',
  Roof: 'roof',
};

interface Crossing {
  gridX: string;
  gridY: string;
}

/**
 * The four designs, each at its own place and the crossings alike to it. The typed loads are nil: every level
 * has a floor load, so the restraints and the cap take theirs from the floors.
 */
export const DEMO_GRID_STACKS: { at: Crossing; alsoAt: Crossing[]; sections: string[] }[] = [
  {
    at: { gridX: 'A', gridY: '1' },
    alsoAt: [
      { gridX: 'D', gridY: '1' },
      { gridX: 'A', gridY: '4' },
      { gridX: 'D', gridY: '4' },
    ],
    sections: ['UKC 203x203x46', 'UKC 152x152x44', 'UKC 152x152x37'],
  },
  {
    at: { gridX: 'B', gridY: '1' },
    alsoAt: [
      { gridX: 'C', gridY: '1' },
      { gridX: 'B', gridY: '4' },
      { gridX: 'C', gridY: '4' },
    ],
    sections: ['UKC 203x203x71', 'UKC 203x203x52', 'UKC 203x203x46'],
  },
  {
    at: { gridX: 'A', gridY: '2' },
    alsoAt: [
      { gridX: 'A', gridY: '3' },
      { gridX: 'D', gridY: '2' },
      { gridX: 'D', gridY: '3' },
    ],
    sections: ['UKC 203x203x71', 'UKC 203x203x52', 'UKC 203x203x46'],
  },
  {
    at: { gridX: 'B', gridY: '2' },
    alsoAt: [
      { gridX: 'C', gridY: '2' },
      { gridX: 'B', gridY: '3' },
      { gridX: 'C', gridY: '3' },
    ],
    sections: ['UKC 254x254x107', 'UKC 254x254x73', 'UKC 203x203x46'],
  },
];

const gridTemplate = (sections: string[]): StackTemplate => ({
  storeys: DEMO_GRID_LEVELS.length - 1,
  storeyHeight: DEMO_GRID_STOREY_HEIGHT,
  baseElevation: 0,
  spliceEvery: 2,
  grade: 'S355',
  baseFixity: 'pinned',
  sections,
  Gk: 0,
  Qk: 0,
});

/**
 * The model services take a server context but read only its database, broadcaster and log. The seed runs before
 * the server has the rest: nobody is in a live room yet, and the demo accounts are verified, so no mail goes out
 * and no worker thread is needed. The missing parts throw, so a service that comes to need one says so here.
 */
function seedingContext(db: Knex): ServerContext {
  const missing = (part: string): never => {
    throw new Error(`The demo seed runs without a ${part}`);
  };
  return {
    db,
    log: pino({ level: 'error' }),
    broadcaster: nullBroadcaster,
    redis: null,
    outbox: { kick: () => missing('mail sender') },
    get config() {
      return missing('configuration');
    },
    get mailer() {
      return missing('mailer');
    },
    get offThread() {
      return missing('worker thread');
    },
  };
}

/** The demo accounts are verified, so they join at once and no invitation (with its link) is written. */
const NO_INVITATION = { link: '', days: 0 };

export async function seedGridBuilding(
  db: Knex,
  accounts: { lead: User; engineer: User; viewer: User },
): Promise<{ buildingId: number }> {
  const ctx = seedingContext(db);
  const { lead } = accounts;
  const building = await createBuilding(db, lead, DEMO_GRID_BUILDING);
  for (const role of ['engineer', 'viewer'] as const)
    await addMember(db, ctx.outbox, building.id, accounts[role].email, role, lead, NO_INVITATION);
  const levels = new Map<string, string>();
  for (const level of DEMO_GRID_LEVELS) levels.set(level.name, (await createLevel(db, building.id, level, lead)).id);
  await putGrid(ctx, building.id, DEMO_GRID, lead);
  await putBuildups(ctx, building.id, DEMO_BUILDUPS, lead);
  for (const [level, buildupId] of Object.entries(DEMO_FLOORS)) {
    const input = { buildupId, span: 'two-way' as const, lines: [] };
    await putFloorLoad(ctx, building.id, Number(levels.get(level)), input, lead);
  }
  for (const { at, alsoAt, sections } of DEMO_GRID_STACKS) {
    const stack = await createStack(
      db,
      building.id,
      { name: `${at.gridX}/${at.gridY}`, template: gridTemplate(sections) },
      lead,
    );
    await placeStack(ctx, stack.id, { ...at, webAlong: 'x' }, lead);
    for (const crossing of alsoAt) await addStackPosition(ctx, stack.id, { ...crossing, webAlong: 'x' }, lead);
  }
  return { buildingId: building.id };
}
