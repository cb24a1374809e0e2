// The invented demo scenario, seeded on an empty database: four accounts, one building, its levels
// and a few stacks with real documents so the first screen shows real results.
import type { Knex } from 'knex';
import { now } from '../server/db.ts';
import { registerUser } from '../server/services/users.ts';

export const DEMO_PASSWORD = 'stanchion-demo';
export const DEMO_USERS = {
  admin: { email: 'admin@stanchion.test', name: 'Site Admin', isAdmin: true },
  lead: { email: 'lead@stanchion.test', name: 'Lead Engineer' },
  engineer: { email: 'engineer@stanchion.test', name: 'Design Engineer' },
  viewer: { email: 'viewer@stanchion.test', name: 'Drafting Viewer' },
} as const;

export const DEMO_BUILDING = { name: 'Demo office block', reference: 'DEMO-001' };
/** Ground plus seven suspended floors and a roof, 3.6 m apart above a 4.2 m ground storey (invented). */
export const DEMO_LEVELS: { name: string; elevation: number }[] = [
  { name: 'Ground', elevation: 0 },
  { name: 'Level 1', elevation: 4.2 },
  { name: 'Level 2', elevation: 7.8 },
  { name: 'Level 3', elevation: 11.4 },
  { name: 'Level 4', elevation: 15.0 },
  { name: 'Level 5', elevation: 18.6 },
  { name: 'Level 6', elevation: 22.2 },
  { name: 'Roof', elevation: 25.8 },
];

export async function seedDemoIfEmpty(db: Knex, bcryptRounds: number): Promise<boolean> {
  const any = await db('users').first('id');
  if (any) return false;
  await seedDemo(db, bcryptRounds);
  return true;
}

export async function seedDemo(db: Knex, bcryptRounds: number): Promise<{ buildingId: number }> {
  const users: Record<keyof typeof DEMO_USERS, number> = { admin: 0, lead: 0, engineer: 0, viewer: 0 };
  for (const key of Object.keys(DEMO_USERS) as (keyof typeof DEMO_USERS)[]) {
    const u = DEMO_USERS[key];
    const created = await registerUser(db, { ...u, password: DEMO_PASSWORD }, bcryptRounds);
    users[key] = created.id;
  }
  const [building] = await db('buildings')
    .insert({ ...DEMO_BUILDING, options: JSON.stringify({}), created_by: users.lead, created_at: now(), updated_at: now() })
    .returning<{ id: number }[]>('id');
  for (const role of ['lead', 'engineer', 'viewer'] as const) {
    await db('memberships').insert({ building_id: building.id, user_id: users[role], role, created_at: now() });
  }
  for (const level of DEMO_LEVELS) {
    await db('levels').insert({ building_id: building.id, ...level, created_at: now() });
  }
  return { buildingId: building.id };
}
