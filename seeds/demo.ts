// The invented demo scenario, seeded on an empty database: four accounts and two buildings. The first has its
// levels and a few stacks with loads typed on each restraint, so the first screen shows real results; the
// second (seeds/demoGrid.ts) is built on a grid, its loads coming from the floors.
import type { Knex } from 'knex';
import type { StackTemplate, User } from '../shared/schema/api.ts';
import { now } from '../server/db.ts';
import { createStack } from '../server/services/stacks.ts';
import { registerUser } from '../server/services/users.ts';
import { seedGridBuilding } from './demoGrid.ts';
import { storeyLevels } from './storeyLevels.ts';

export const DEMO_PASSWORD = 'stanchion-demo';
export const DEMO_USERS = {
  admin: { email: 'admin@stanchion.test', name: 'Site Admin', isAdmin: true },
  lead: { email: 'lead@stanchion.test', name: 'Lead Engineer' },
  engineer: { email: 'engineer@stanchion.test', name: 'Design Engineer' },
  viewer: { email: 'viewer@stanchion.test', name: 'Drafting Viewer' },
} as const;

export const DEMO_BUILDING = { name: 'Demo office block', reference: 'DEMO-001' };
/** Ground, six suspended floors and a roof, 3.8 m apart (invented). */
export const DEMO_STOREY_HEIGHT = 3.8;
export const DEMO_LEVELS = storeyLevels(6, DEMO_STOREY_HEIGHT);

/** Invented stacks: an internal, an edge and a corner column, with floor loads per level in kN. */
export const DEMO_STACKS: { name: string; template: StackTemplate }[] = [
  {
    name: 'C/4',
    template: demoTemplate({
      Gk: 240,
      Qk: 120,
      sections: ['UKC 305x305x118', 'UKC 254x254x89', 'UKC 203x203x60', 'UKC 203x203x46'],
    }),
  },
  {
    name: 'B/2',
    template: demoTemplate({ Gk: 160, Qk: 80, sections: ['UKC 254x254x89', 'UKC 254x254x73', 'UKC 203x203x46'] }),
  },
  {
    name: 'A/1',
    template: demoTemplate({ Gk: 80, Qk: 35, spliceEvery: 3, sections: ['UKC 203x203x46', 'UKC 152x152x37'] }),
  },
];

function demoTemplate(p: Pick<StackTemplate, 'Gk' | 'Qk' | 'sections'> & { spliceEvery?: number }): StackTemplate {
  return {
    storeys: 7,
    storeyHeight: DEMO_STOREY_HEIGHT,
    baseElevation: 0,
    spliceEvery: 2,
    grade: 'S355',
    baseFixity: 'pinned',
    ...p,
  };
}

export async function seedDemoIfEmpty(db: Knex, bcryptRounds: number): Promise<boolean> {
  const any = await db('users').first('id');
  if (any) return false;
  await seedDemo(db, bcryptRounds);
  return true;
}

export async function seedDemo(
  db: Knex,
  bcryptRounds: number,
): Promise<{ buildingId: number; gridBuildingId: number }> {
  const accounts: Partial<Record<keyof typeof DEMO_USERS, User>> = {};
  for (const key of Object.keys(DEMO_USERS) as (keyof typeof DEMO_USERS)[]) {
    accounts[key] = await registerUser(db, { ...DEMO_USERS[key], password: DEMO_PASSWORD }, bcryptRounds, {
      verified: true,
    });
  }
  const lead = accounts.lead as User;
  const users = { lead: lead.id, engineer: accounts.engineer?.id, viewer: accounts.viewer?.id };
  const [building] = await db('buildings')
    .insert({
      ...DEMO_BUILDING,
      options: JSON.stringify({}),
      created_by: users.lead,
      created_at: now(),
      updated_at: now(),
    })
    .returning<{ id: number }[]>('id');
  for (const role of ['lead', 'engineer', 'viewer'] as const) {
    await db('memberships').insert({ building_id: building.id, user_id: users[role], role, created_at: now() });
  }
  for (const level of DEMO_LEVELS) {
    await db('levels').insert({ building_id: building.id, ...level, created_at: now() });
  }
  for (const stack of DEMO_STACKS) await createStack(db, building.id, stack, lead);
  const grid = await seedGridBuilding(db, {
    lead,
    engineer: accounts.engineer as User,
    viewer: accounts.viewer as User,
  });
  return { buildingId: building.id, gridBuildingId: grid.buildingId };
}
