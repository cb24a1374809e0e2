import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Level, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import { createBuilding, errorCode, startWithLeadAndBuilding, type TestServer } from './helpers.ts';

describe('levels', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding());
  });
  afterAll(async () => {
    await s?.close();
  });

  const addLevel = async (name: string, elevation: number) =>
    (await s.api('POST', `/buildings/${buildingId}/levels`, { token, body: { name, elevation } })).body as Level;

  it('lists levels by elevation, with string ids', async () => {
    await addLevel('Level 2', 7);
    await addLevel('Ground', 0);
    await addLevel('Level 1', 3.5);
    const levels = (await s.api('GET', `/buildings/${buildingId}/levels`, { token })).body as Level[];
    expect(levels.map((l) => [l.name, l.elevation])).toEqual([
      ['Ground', 0],
      ['Level 1', 3.5],
      ['Level 2', 7],
    ]);
    expect(levels.every((l) => typeof l.id === 'string')).toBe(true);
  });

  it('renames a level', async () => {
    const l = await addLevel('Mezzanine', 2);
    const r = await s.api('PATCH', `/buildings/${buildingId}/levels/${l.id}`, { token, body: { name: 'Mezz' } });
    expect(r.body).toEqual({ id: l.id, name: 'Mezz', elevation: 2 });
  });

  it('refuses a second level of one name, in any letter case (409), and leaves the levels as they were', async () => {
    const roof = await addLevel('Roof', 30);
    const before = (await s.api('GET', `/buildings/${buildingId}/levels`, { token })).body as Level[];
    const again = await s.api('POST', `/buildings/${buildingId}/levels`, {
      token,
      body: { name: 'roof', elevation: 31 },
    });
    expect(again.status).toBe(409);
    expect(errorCode(again.body)).toBe('conflict');
    expect((again.body as { error: { message: string } }).error.message).toContain('"Roof"');
    const other = await addLevel('Plant deck', 33);
    const renamed = await s.api('PATCH', `/buildings/${buildingId}/levels/${other.id}`, {
      token,
      body: { name: 'ROOF' },
    });
    expect(renamed.status).toBe(409);
    // Renaming a level to its own name in another case is not a clash with itself.
    const own = await s.api('PATCH', `/buildings/${buildingId}/levels/${roof.id}`, { token, body: { name: 'ROOF' } });
    expect(own.status).toBe(200);
    const after = (await s.api('GET', `/buildings/${buildingId}/levels`, { token })).body as Level[];
    expect(after.filter((l) => l.name.toLowerCase() === 'roof')).toHaveLength(1);
    expect(after).toHaveLength(before.length + 1);
  });

  it('answers 404 for a level of another building', async () => {
    const otherBuilding = await createBuilding(s, token, 'Other');
    const foreign = (
      await s.api('POST', `/buildings/${otherBuilding.id}/levels`, { token, body: { name: 'X', elevation: 1 } })
    ).body as Level;
    const r = await s.api('PATCH', `/buildings/${buildingId}/levels/${foreign.id}`, { token, body: { name: 'Y' } });
    expect(r.status).toBe(404);
  });

  it('moves a level: every stack with a restraint on it gets a new version, the restraint follows, results are recomputed; other stacks are untouched', async () => {
    const b = await createBuilding(s, token, 'Move test');
    const mk = async (name: string, elevation: number) =>
      (await s.api('POST', `/buildings/${b.id}/levels`, { token, body: { name, elevation } })).body as Level;
    await mk('Ground', 0);
    const l1 = await mk('Level 1', 3.5);
    await mk('Level 2', 7);
    const template = { storeys: 3, storeyHeight: 3.5, spliceEvery: 3, sections: ['UKC 152x152x37'], Gk: 100, Qk: 50 };
    const create = async (name: string, t: object) =>
      ((await s.api('POST', `/buildings/${b.id}/stacks`, { token, body: { name, template: t } })).body as StackSummary)
        .id;
    const a = await create('A/1', template);
    const c = await create('C/1', template);
    // A stack whose floors are elsewhere does not use Level 1.
    const other = await create('D/1', { ...template, storeyHeight: 3 });
    const get = async (id: number) => (await s.api('GET', `/stacks/${id}`, { token })).body as StackDetail;
    const [a0, c0, o0] = [await get(a), await get(c), await get(other)];
    const restraint = a0.doc.nodes.find((n) => n.kind === 'restraint' && n.data.levelId === l1.id);
    expect(restraint).toBeDefined();

    const r = await s.api('PATCH', `/buildings/${b.id}/levels/${l1.id}`, { token, body: { elevation: 4.5 } });
    expect(r.status).toBe(200);
    const [a1, c1, o1] = [await get(a), await get(c), await get(other)];
    for (const [before, after] of [
      [a0, a1],
      [c0, c1],
    ]) {
      expect(after.version).toBe(before.version + 1);
      const moved = after.doc.nodes.find((n) => n.id === restraint?.id);
      expect(moved?.kind === 'restraint' && moved.data.elevation).toBe(4.5);
      // The bottom segment, which carries the largest force, grows from 3.5 m to 4.5 m between
      // pinned ends (k = 1.0): a longer buckling length lowers χ (EN 1993-1-1 eq. 6.49), so the
      // lift's utilisation must rise.
      expect(after.results.lifts[0].utilisation).toBeGreaterThan(before.results.lifts[0].utilisation);
      expect(after.results.lifts[0].pieces[0].LcrZ).toBeCloseTo(4.5, 6);
    }
    expect(o1.version).toBe(o0.version);
    const ops = (await s.api('GET', `/stacks/${a}/ops?since=${a0.version}`, { token })).body as { ops: unknown[] }[];
    // The level's elevation is kept in its row alone: the move writes nothing into the stacks' nodes
    expect(ops[0].ops).toEqual([]);
  });

  it("creates a stack at the building's own irregular levels: every restraint carries its level, and moving a level moves it", async () => {
    // Invented levels: a 4.5 m ground storey, 3.5 m office storeys and a 4.2 m plant storey under the roof.
    const b = await createBuilding(s, token, 'Irregular levels');
    for (const [name, elevation] of [
      ['Level 2', 8],
      ['Ground', 0],
      ['Level 1', 4.5],
      ['Roof', 15.7],
      ['Level 3', 11.5],
    ] as const) {
      await s.api('POST', `/buildings/${b.id}/levels`, { token, body: { name, elevation } });
    }
    const levels = (await s.api('GET', `/buildings/${b.id}/levels`, { token })).body as Level[];
    const template = {
      elevations: levels.map((l) => l.elevation),
      spliceEvery: 2,
      sections: ['UKC 203x203x60', 'UKC 152x152x37'],
      Gk: 120,
      Qk: 60,
    };
    const created = await s.api('POST', `/buildings/${b.id}/stacks`, { token, body: { name: 'F/3', template } });
    expect(created.status).toBe(201);
    const id = (created.body as StackSummary).id;
    const get = async () => (await s.api('GET', `/stacks/${id}`, { token })).body as StackDetail;
    const before = await get();
    expect(before.results.errors).toEqual([]);
    const restraints = before.doc.nodes.filter((n) => n.kind === 'restraint');
    const levelOf = new Map(levels.map((l) => [l.id, l]));
    expect(
      restraints.map((n) => n.kind === 'restraint' && [levelOf.get(n.data.levelId ?? '')?.name, n.data.elevation]),
    ).toEqual([
      ['Level 1', 4.5],
      ['Level 2', 8],
      ['Level 3', 11.5],
    ]);
    const at = (kind: string) => before.doc.nodes.find((n) => n.kind === kind)?.data;
    const levelId = (name: string) => levels.find((l) => l.name === name)?.id;
    expect(at('support')).toMatchObject({ elevation: 0, levelId: levelId('Ground') });
    expect(at('cap')).toMatchObject({ elevation: 15.7, levelId: levelId('Roof') });
    // The ground storey is the bottom piece: pinned at both ends, it buckles over its 4.5 m (Lcr = k·L, k = 1.0 for pinned ends: common practice, after BS 5950-1 Table 22).
    expect(before.results.lifts[0].pieces[0].LcrZ).toBeCloseTo(4.5, 6);

    const level1 = levels.find((l) => l.name === 'Level 1') as Level;
    expect(
      (await s.api('PATCH', `/buildings/${b.id}/levels/${level1.id}`, { token, body: { elevation: 5 } })).status,
    ).toBe(200);
    const after = await get();
    expect(after.version).toBe(before.version + 1);
    const moved = after.doc.nodes.find((n) => n.kind === 'restraint' && n.data.levelId === level1.id);
    expect(moved?.kind === 'restraint' && moved.data.elevation).toBe(5);
    expect(after.results.lifts[0].pieces[0].LcrZ).toBeCloseTo(5, 6);

    // The roof raised: the cap follows, and the top lift is checked over its new length.
    const roof = levels.find((l) => l.name === 'Roof') as Level;
    expect(
      (await s.api('PATCH', `/buildings/${b.id}/levels/${roof.id}`, { token, body: { elevation: 16.2 } })).status,
    ).toBe(200);
    const raised = await get();
    expect(raised.doc.nodes.find((n) => n.kind === 'cap')?.data).toMatchObject({ elevation: 16.2 });
    expect(raised.results.lifts.at(-1)?.top).toBeCloseTo(16.2, 9);
    expect(raised.results.takeDown[0].elevation).toBeCloseTo(16.2, 9);
    // A level the cap sits on cannot be deleted while it does.
    expect((await s.api('DELETE', `/buildings/${b.id}/levels/${roof.id}`, { token })).status).toBe(409);
  });

  it('refuses to delete a level that a restraint uses (409) and deletes an unused one', async () => {
    const b = await createBuilding(s, token, 'Delete test');
    const used = (await s.api('POST', `/buildings/${b.id}/levels`, { token, body: { name: 'Level 1', elevation: 4 } }))
      .body as Level;
    const unused = (await s.api('POST', `/buildings/${b.id}/levels`, { token, body: { name: 'Spare', elevation: 50 } }))
      .body as Level;
    await s.api('POST', `/buildings/${b.id}/stacks`, {
      token,
      body: { name: 'B/2', template: { storeys: 2, storeyHeight: 4, sections: ['UKC 152x152x37'] } },
    });
    const r = await s.api('DELETE', `/buildings/${b.id}/levels/${used.id}`, { token });
    expect(r.status).toBe(409);
    expect(errorCode(r.body)).toBe('conflict');
    expect((await s.api('DELETE', `/buildings/${b.id}/levels/${unused.id}`, { token })).status).toBe(204);
    const left = (await s.api('GET', `/buildings/${b.id}/levels`, { token })).body as Level[];
    expect(left.map((l) => l.name)).toEqual(['Level 1']);
  });
});
