// The second invented demo building: a braced steel frame on a grid, so a first look meets the building model
// (docs/building-model.md): grid lines, floor build-ups, a floor load on every suspended level, and stacks on the
// crossings whose restraint loads come from their tributary areas. Four stacks stand for all sixteen crossings as
// typical columns (docs/typical-columns.md): a corner, an edge of each kind and an internal column. Every figure
// is invented. Built through the server's own services, so validation, results and the audit trail are real.
import type { Knex } from 'knex';
import { pino } from 'pino';
import type { Level, StackTemplate, User } from '../shared/schema/api.ts';
import type { Buildup, Grid } from '../shared/schema/building.ts';
import type { ServerContext } from '../server/context.ts';
import { createBuilding } from '../server/services/buildings.ts';
import { nullBroadcaster } from '../server/services/broadcast.ts';
import { putBuildups, putFloorLoad, putGrid, placeStack } from '../server/services/buildingModel.ts';
import { createLevel } from '../server/services/levels.ts';
import { addMember } from '../server/services/members.ts';
import { addStackPosition } from '../server/services/stackPositions.ts';
import { createStack } from '../server/services/stacks.ts';
import { storeyLevels } from './storeyLevels.ts';

export const DEMO_GRID_BUILDING = { name: 'Demo steel frame on a grid', reference: 'DEMO-002' };

/** Ground, five office floors and a roof, 4.0 m apart (invented). */
export const DEMO_GRID_STOREY_HEIGHT = 4;
export const DEMO_GRID_LEVELS = storeyLevels(5, DEMO_GRID_STOREY_HEIGHT);

/** The slab runs this far beyond the outermost grid lines on every side (m). */
export const DEMO_SLAB_EDGE = 0.3;

/** Lines named as their ids: the two families' names differ (letters along x, numbers along y). */
const lines = (names: string[], spacing: number) => names.map((name, i) => ({ id: name, name, position: i * spacing }));

/** Three bays of 7.5 m along x (A–D) and three of 6.0 m along y (1–4). */
export const DEMO_GRID: Grid = {
  x: { lines: lines(['A', 'B', 'C', 'D'], 7.5), edgeBefore: DEMO_SLAB_EDGE, edgeAfter: DEMO_SLAB_EDGE },
  y: { lines: lines(['1', '2', '3', '4'], 6), edgeBefore: DEMO_SLAB_EDGE, edgeAfter: DEMO_SLAB_EDGE },
};

/** The same slab and ceiling under the offices and the roof. */
const SLAB = { label: 'Composite slab, 150 mm', gk: 2.8 };
const CEILING = { label: 'Ceiling and services', gk: 0.5 };

export const DEMO_BUILDUPS: Buildup[] = [
  {
    id: 'office',
    name: 'Office floor',
    permanent: [SLAB, { label: 'Screed, 50 mm', gk: 1.2 }, CEILING],
    imposed: { qk: 2.5, category: 'B' },
    // Movable partitions, taken as imposed load (EN 1991-1-1 6.3.1.2(8)).
    partitions: { load: 1, as: 'imposed' },
  },
  {
    id: 'roof',
    name: 'Roof',
    permanent: [SLAB, { label: 'Insulation, membrane and ballast', gk: 0.7 }, CEILING],
    imposed: { qk: 0.6, category: 'H' },
  },
];

/** Every floor above the ground is an office floor but the roof; the ground slab bears on the ground. */
const buildupOf = (level: string): string | null => (level === 'Ground' ? null : level === 'Roof' ? 'roof' : 'office');

/**
 * The four designs, each at its own crossing (`x line/y line`) and at the crossings alike to it, with a section per
 * lift. The typed loads are nil: every level has a floor load, so the restraints and the cap take theirs from the
 * floors.
 */
export const DEMO_GRID_STACKS: { at: string; alsoAt: string[]; sections: string[] }[] = [
  { at: 'A/1', alsoAt: ['D/1', 'A/4', 'D/4'], sections: ['UKC 203x203x46', 'UKC 152x152x44', 'UKC 152x152x37'] },
  { at: 'B/1', alsoAt: ['C/1', 'B/4', 'C/4'], sections: ['UKC 203x203x71', 'UKC 203x203x52', 'UKC 203x203x46'] },
  { at: 'A/2', alsoAt: ['A/3', 'D/2', 'D/3'], sections: ['UKC 203x203x71', 'UKC 203x203x52', 'UKC 203x203x46'] },
  { at: 'B/2', alsoAt: ['C/2', 'B/3', 'C/3'], sections: ['UKC 254x254x107', 'UKC 254x254x73', 'UKC 203x203x46'] },
];

/** The grid lines of a crossing named `x line/y line`: each line's id is its name. */
function crossing(name: string): { gridX: string; gridY: string; webAlong: 'x' } {
  const [gridX, gridY] = name.split('/');
  return { gridX, gridY, webAlong: 'x' };
}

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
  const levels: Level[] = [];
  for (const level of DEMO_GRID_LEVELS) levels.push(await createLevel(db, building.id, level, lead));
  await putGrid(ctx, building.id, DEMO_GRID, lead);
  await putBuildups(ctx, building.id, DEMO_BUILDUPS, lead);
  for (const level of levels) {
    const buildupId = buildupOf(level.name);
    if (buildupId)
      await putFloorLoad(ctx, building.id, Number(level.id), { buildupId, span: 'two-way', lines: [] }, lead);
  }
  for (const { at, alsoAt, sections } of DEMO_GRID_STACKS) {
    const stack = await createStack(db, building.id, { name: at, template: gridTemplate(sections) }, lead);
    await placeStack(ctx, stack.id, crossing(at), lead);
    for (const further of alsoAt) await addStackPosition(ctx, stack.id, crossing(further), lead);
  }
  return { buildingId: building.id };
}
