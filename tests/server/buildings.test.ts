import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Building, BuildingSummary, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import { DEFAULT_ANALYSIS_OPTIONS } from '../../shared/schema/results.ts';
import { createBuilding, errorCode, makeAdmin, registerUser, startTestServer, type TestServer } from './helpers.ts';

const template = { storeys: 4, storeyHeight: 3.5, spliceEvery: 2, sections: ['UKC 203x203x46'], Gk: 150, Qk: 100 };

describe('buildings', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => {
    await s?.close();
  });

  it('makes the creator the lead and starts from the default analysis options', async () => {
    const { token } = await registerUser(s, 'creator');
    const b = await createBuilding(s, token, 'Block one');
    expect(b).toMatchObject({
      name: 'Block one',
      role: 'lead',
      stackCount: 0,
      worstUtilisation: null,
      options: DEFAULT_ANALYSIS_OPTIONS,
    });
    const list = (await s.api('GET', '/buildings', { token })).body as BuildingSummary[];
    expect(list.map((x) => [x.id, x.role])).toEqual([[b.id, 'lead']]);
  });

  it('hides a building from a user who is not a member: absent from the list and 404 on read', async () => {
    const lead = await registerUser(s, 'lead');
    const other = await registerUser(s, 'other');
    const b = await createBuilding(s, lead.token);
    expect(
      ((await s.api('GET', '/buildings', { token: other.token })).body as BuildingSummary[]).some((x) => x.id === b.id),
    ).toBe(false);
    const r = await s.api('GET', `/buildings/${b.id}`, { token: other.token });
    expect(r.status).toBe(404);
    expect(errorCode(r.body)).toBe('not_found');
  });

  it('lists every building to a site admin, as a viewer where not a member', async () => {
    const lead = await registerUser(s, 'lead');
    const admin = await registerUser(s, 'admin');
    await makeAdmin(s, admin.user.id);
    const b = await createBuilding(s, lead.token, 'Seen by admin');
    const list = (await s.api('GET', '/buildings', { token: admin.token })).body as BuildingSummary[];
    expect(list.find((x) => x.id === b.id)?.role).toBe('viewer');
  });

  it('re-analyses every stack in one go when the lead changes the combination rule', async () => {
    const { token } = await registerUser(s, 'lead');
    const b = await createBuilding(s, token);
    const created = (await s.api('POST', `/buildings/${b.id}/stacks`, { token, body: { name: 'C/3', template } }))
      .body as StackSummary;
    const before = (await s.api('GET', `/stacks/${created.id}`, { token })).body as StackDetail;
    const r = await s.api('PATCH', `/buildings/${b.id}`, { token, body: { options: { combination: '6.10' } } });
    expect(r.status).toBe(200);
    expect((r.body as Building).options.combination).toBe('6.10');
    const after = (await s.api('GET', `/stacks/${created.id}`, { token })).body as StackDetail;
    expect(after.version).toBe(before.version + 1);
    // EN 1990 eq. 6.10 takes γG = 1.35 on all permanent load, 6.10b only ξ·γG (ξ = 0.925, UK NA):
    // with imposed load leading, 6.10 gives the larger design force, so utilisation must rise.
    expect(after.results.lifts[0].utilisation).toBeGreaterThan(before.results.lifts[0].utilisation);
    const audit = await s.ctx.db('audit_log').where({ building_id: b.id, action: 'building.reanalyse' });
    expect(audit).toHaveLength(1);
  });

  it('leaves versions alone when only the name changes', async () => {
    const { token } = await registerUser(s, 'lead');
    const b = await createBuilding(s, token);
    const st = (await s.api('POST', `/buildings/${b.id}/stacks`, { token, body: { name: 'A/1', template } }))
      .body as StackSummary;
    await s.api('PATCH', `/buildings/${b.id}`, { token, body: { name: 'Renamed', reference: 'R-1' } });
    const got = (await s.api('GET', `/buildings/${b.id}`, { token })).body as Building;
    expect([got.name, got.reference, got.stackCount]).toEqual(['Renamed', 'R-1', 1]);
    expect(((await s.api('GET', `/stacks/${st.id}`, { token })).body as StackDetail).version).toBe(0);
  });

  it('reports the worst governing utilisation of its stacks in the summary', async () => {
    const { token } = await registerUser(s, 'lead');
    const b = await createBuilding(s, token);
    await s.api('POST', `/buildings/${b.id}/stacks`, { token, body: { name: 'A/1', template } });
    await s.api('POST', `/buildings/${b.id}/stacks`, {
      token,
      body: { name: 'A/2', template: { ...template, Gk: 300 } },
    });
    const stacks = (await s.api('GET', `/buildings/${b.id}/stacks`, { token })).body as StackSummary[];
    const got = (await s.api('GET', `/buildings/${b.id}`, { token })).body as Building;
    expect(got.worstUtilisation).toBe(Math.max(...stacks.map((x) => x.utilisation ?? 0)));
    expect(stacks[1].utilisation).toBeGreaterThan(stacks[0].utilisation ?? Infinity);
  });
});
