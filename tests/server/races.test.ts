// Races the database settles (docs/faults.md): parallel creates of one name in mixed letter case give
// one 201 and 409s (the unique index on lower(name)), parallel freezes give one revision, two leads
// removing each other leave one lead, and a site admin can give a building with no lead a lead again.
// On PostgreSQL (server-pg) these run against real concurrent transactions; tests/scale repeats them
// across two processes.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, Member } from '../../shared/schema/api.ts';
import { migrationSource } from '../../migrations/index.ts';
import {
  addMember,
  createBuilding,
  errorCode,
  makeAdmin,
  registerUser,
  startTestServer,
  type TestServer,
} from './helpers.ts';

async function hasIndexMigration(s: TestServer): Promise<boolean> {
  const [done] = (await s.ctx.db.migrate.list({ migrationSource })) as [{ name: string }[], unknown];
  return done.some((m) => m.name === '202612031100_add_stack_name_index');
}

describe('races answer 409 or succeed, never 500', () => {
  let s: TestServer;
  let lead: AuthResponse;

  beforeAll(async () => {
    s = await startTestServer();
    lead = await registerUser(s, 'lead');
  });
  afterAll(async () => {
    await s?.close();
  });

  it('20 parallel creates of one stack name in mixed case: one 201, nineteen 409', async () => {
    const b = await createBuilding(s, lead.token, 'Race block');
    const names = Array.from({ length: 20 }, (_, i) => (i % 2 ? 'Core/1' : 'CORE/1'));
    const replies = await Promise.all(
      names.map((name) => s.api('POST', `/buildings/${b.id}/stacks`, { token: lead.token, body: { name } })),
    );
    expect(replies.filter((r) => r.status === 201)).toHaveLength(1);
    expect(replies.filter((r) => r.status === 409)).toHaveLength(19);
    for (const r of replies.filter((x) => x.status === 409)) expect(errorCode(r.body)).toBe('conflict');
    expect(
      await s.ctx
        .db('stacks')
        .where({ building_id: b.id })
        .count<{ n: number | string }[]>({ n: '*' })
        .then((x) => Number(x[0].n)),
    ).toBe(1);
  });

  it('parallel creates of one level name: one 201, the rest 409', async () => {
    const b = await createBuilding(s, lead.token, 'Level race block');
    const replies = await Promise.all(
      ['Roof', 'roof', 'ROOF', 'Roof'].map((name, i) =>
        s.api('POST', `/buildings/${b.id}/levels`, { token: lead.token, body: { name, elevation: 20 + i } }),
      ),
    );
    expect(replies.map((r) => r.status).sort()).toEqual([201, 409, 409, 409]);
  });

  it('the database refuses a second stack of one name in another case even when the service check is passed by', async () => {
    const b = await createBuilding(s, lead.token, 'Index block');
    await s.api('POST', `/buildings/${b.id}/stacks`, { token: lead.token, body: { name: 'Edge/1' } });
    const row = (name: string) => ({
      building_id: b.id,
      name,
      doc: '{"nodes":[],"edges":[]}',
      version: 0,
      results: '{}',
      status: 'errors',
      created_at: new Date().toISOString(),
      updated_at: new Date().toISOString(),
    });
    await expect(s.ctx.db('stacks').insert(row('EDGE/1'))).rejects.toThrow(/unique|duplicate/i);
    // The same row under a free name is stored: the refusal above is the index's.
    await s.ctx.db('stacks').insert(row('Edge/2'));
  });

  it('migrating an old database with duplicate names renames the later rows with a suffix and logs it', async () => {
    const b = await createBuilding(s, lead.token, 'Old duplicates block');
    const config = { migrationSource };
    const [, pending] = await s.ctx.db.migrate.list(config);
    expect(pending).toEqual([]);
    // Back to before the name indexes, then store what races used to make.
    for (let i = 0; i < 20 && (await hasIndexMigration(s)); i += 1) await s.ctx.db.migrate.down(config);
    const at = new Date().toISOString();
    const stack = (name: string) => ({
      building_id: b.id,
      name,
      doc: '{"nodes":[],"edges":[]}',
      version: 0,
      results: '{}',
      status: 'errors',
      created_at: at,
      updated_at: at,
    });
    await s.ctx.db('stacks').insert([stack('Dup/1'), stack('DUP/1'), stack('dup/1'), stack('Dup/1 (2)')]);
    await s.ctx.db('levels').insert([
      { building_id: b.id, name: 'Roof', elevation: 20, created_at: at },
      { building_id: b.id, name: 'roof', elevation: 21, created_at: at },
    ]);
    await s.ctx.db.migrate.latest(config);
    const names = await s.ctx.db('stacks').where({ building_id: b.id }).orderBy('id').pluck('name');
    expect(names).toEqual(['Dup/1', 'DUP/1 (3)', 'dup/1 (4)', 'Dup/1 (2)']);
    expect(await s.ctx.db('levels').where({ building_id: b.id }).orderBy('id').pluck('name')).toEqual([
      'Roof',
      'roof (2)',
    ]);
    expect(
      await s.ctx
        .db('audit_log')
        .where({ building_id: b.id, action: 'stack.rename-duplicate' })
        .count<{ n: number | string }[]>({ n: '*' })
        .then((x) => Number(x[0].n)),
    ).toBe(2);
  });

  it('6 parallel freezes, each based on the revisions its sender saw (as the app sends): one 201, five 409', async () => {
    const b = await createBuilding(s, lead.token, 'Freeze race block');
    const template = { storeys: 2, storeyHeight: 3.5, sections: ['UKC 203x203x46'], Gk: 50, Qk: 20 };
    for (const name of ['F/1', 'F/2', 'F/3'])
      await s.api('POST', `/buildings/${b.id}/stacks`, { token: lead.token, body: { name, template } });
    const replies = await Promise.all(
      Array.from({ length: 6 }, () =>
        s.api('POST', `/buildings/${b.id}/revisions`, {
          token: lead.token,
          body: { purpose: 'preliminary', note: 'race', afterRevisionId: null },
        }),
      ),
    );
    expect(replies.map((r) => r.status).sort()).toEqual([201, 409, 409, 409, 409, 409]);
    expect(await s.ctx.db('revisions').where({ building_id: b.id }).pluck('code')).toEqual(['P01']);
    const p01 = (await s.ctx.db('revisions').where({ building_id: b.id }).first<{ id: number }>('id')).id;
    // A later freeze, by someone who has seen P01, is an ordinary P02; one still based on nothing is refused.
    expect(
      (
        await s.api('POST', `/buildings/${b.id}/revisions`, {
          token: lead.token,
          body: { purpose: 'preliminary', note: 'stale', afterRevisionId: null },
        })
      ).status,
    ).toBe(409);
    expect(
      (
        await s.api('POST', `/buildings/${b.id}/revisions`, {
          token: lead.token,
          body: { purpose: 'preliminary', note: 'next', afterRevisionId: p01 },
        })
      ).status,
    ).toBe(201);
    // Without the field (an older client) the freeze goes through as before.
    expect(
      (
        await s.api('POST', `/buildings/${b.id}/revisions`, {
          token: lead.token,
          body: { purpose: 'preliminary', note: 'old client' },
        })
      ).status,
    ).toBe(201);
  });

  it('two leads removing each other at once leave one lead', async () => {
    const other = await registerUser(s, 'lead2');
    const b = await createBuilding(s, lead.token, 'Two leads block');
    await addMember(s, lead.token, b.id, other.user.email, 'lead');
    const [r1, r2] = await Promise.all([
      s.api('DELETE', `/buildings/${b.id}/members/${other.user.id}`, { token: lead.token }),
      s.api('DELETE', `/buildings/${b.id}/members/${lead.user.id}`, { token: other.token }),
    ]);
    // The second finds itself no longer a member (404) or, if it got past the role check first, no
    // longer a lead under the lock (403).
    expect([r1.status, r2.status].filter((x) => x === 204)).toHaveLength(1);
    expect([r1.status, r2.status].every((x) => x === 204 || x === 403 || x === 404)).toBe(true);
    const leads = await s.ctx.db('memberships').where({ building_id: b.id, role: 'lead' }).pluck('user_id');
    expect(leads).toHaveLength(1);
  });

  it('a site admin gives a building with no lead a lead again; refused while it has one', async () => {
    const admin = await registerUser(s, 'admin');
    await makeAdmin(s, admin.user.id);
    const engineer = await registerUser(s, 'engineer');
    const b = await createBuilding(s, lead.token, 'Leaderless block');
    await addMember(s, lead.token, b.id, engineer.user.email, 'engineer');
    const path = `/admin/buildings/${b.id}/lead`;
    expect((await s.api('POST', path, { token: admin.token, body: { email: engineer.user.email } })).status).toBe(409);
    // A building left with no lead (as a race before the lock could, or a hand-edited database).
    await s.ctx.db('memberships').where({ building_id: b.id, role: 'lead' }).delete();
    expect((await s.api('POST', path, { token: engineer.token, body: { email: engineer.user.email } })).status).toBe(
      403,
    );
    expect((await s.api('POST', path, { token: admin.token, body: { email: 'nobody@example.test' } })).status).toBe(
      422,
    );
    expect((await s.api('POST', path, { token: admin.token, body: { email: 'not an address' } })).status).toBe(400);
    expect(
      (
        await s.api('POST', `/admin/buildings/999999/lead`, {
          token: admin.token,
          body: { email: engineer.user.email },
        })
      ).status,
    ).toBe(404);
    const r = await s.api('POST', path, { token: admin.token, body: { email: engineer.user.email } });
    expect(r.status).toBe(200);
    expect((r.body as Member).role).toBe('lead');
    // The restored lead manages the building again.
    expect(
      (await s.api('PATCH', `/buildings/${b.id}`, { token: engineer.token, body: { name: 'Led again' } })).status,
    ).toBe(200);
  });
});
