// Moving a level moves the column with it: the preview names the stacks it changes (and any it would break)
// before anything is stored; splices keep their offset above their floor; a move that would break a stack is
// refused with the reason and leaves every stack as it was; an elevation no building has is refused.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Level, LevelMovePreview, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import { errorCode, startWithLeadAndBuilding, type TestServer } from './helpers.ts';

describe('moving a level moves the column', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  let levels: Level[];
  let stackId: number;
  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding());
    for (const [name, elevation] of [
      ['Ground', 0],
      ['Level 1', 4],
      ['Level 2', 8],
      ['Level 3', 12],
      ['Roof', 16],
    ] as const) {
      await s.api('POST', `/buildings/${buildingId}/levels`, { token, body: { name, elevation } });
    }
    levels = (await s.api('GET', `/buildings/${buildingId}/levels`, { token })).body as Level[];
    // Built at the building's levels: floors tied to them, a splice 0.5 m above Level 2 (invented data)
    const r = await s.api('POST', `/buildings/${buildingId}/stacks`, {
      token,
      body: {
        name: 'C/3',
        template: { elevations: [0, 4, 8, 12, 16], spliceEvery: 2, sections: ['UKC 254x254x73'], Gk: 150, Qk: 60 },
      },
    });
    expect(r.status).toBe(201);
    stackId = (r.body as StackSummary).id;
  });
  afterAll(async () => {
    await s?.close();
  });

  const level = (name: string) => levels.find((l) => l.name === name) as Level;
  const stack = async () => (await s.api('GET', `/stacks/${stackId}`, { token })).body as StackDetail;
  const spliceElevations = (d: StackDetail) =>
    d.doc.nodes.flatMap((n) => (n.kind === 'splice' ? [n.data.elevation] : []));

  it('previews the stacks a move changes, storing nothing', async () => {
    const was = await stack();
    expect(spliceElevations(was)).toEqual([8.5]);
    const r = await s.api('POST', `/buildings/${buildingId}/levels/${level('Level 2').id}/preview`, {
      token,
      body: { elevation: 8.4 },
    });
    expect(r.status).toBe(200);
    const preview = r.body as LevelMovePreview;
    expect(preview.stacks).toEqual([{ stackId, name: 'C/3', nodes: 1, splices: 1, breaks: [] }]);
    expect((await stack()).version).toBe(was.version);
  });

  it('moves the floor on the level and the splice above it by the same amount, with no errors', async () => {
    const r = await s.api('PATCH', `/buildings/${buildingId}/levels/${level('Level 2').id}`, {
      token,
      body: { elevation: 8.4 },
    });
    expect(r.status).toBe(200);
    const after = await stack();
    expect(spliceElevations(after)).toEqual([8.9]);
    expect(
      after.doc.nodes.find((n) => n.kind === 'restraint' && n.data.levelId === level('Level 2').id)?.data,
    ).toMatchObject({ elevation: 8.4 });
    expect(after.results.errors).toEqual([]);
    expect(after.results.lifts.map((l) => [l.bottom, l.top])).toEqual([
      [0, 8.9],
      [8.9, 16],
    ]);
  });

  it('refuses a move that would break a stack, saying which and why, and changes nothing', async () => {
    const before = await stack();
    // Level 1 above Level 2's floor: the floor on Level 1 would leave its lift
    const preview = (
      await s.api('POST', `/buildings/${buildingId}/levels/${level('Level 1').id}/preview`, {
        token,
        body: { elevation: 9.5 },
      })
    ).body as LevelMovePreview;
    expect(preview.stacks[0].breaks.length).toBeGreaterThan(0);
    const r = await s.api('PATCH', `/buildings/${buildingId}/levels/${level('Level 1').id}`, {
      token,
      body: { elevation: 9.5 },
    });
    expect(r.status).toBe(422);
    expect((r.body as { error: { message: string } }).error.message).toMatch(
      /^Moving Level 1 to \+9\.500 m would break a stack \(C\/3: .+\); nothing was changed$/,
    );
    const after = await stack();
    expect(after.version).toBe(before.version);
    expect(
      ((await s.api('GET', `/buildings/${buildingId}/levels`, { token })).body as Level[]).find(
        (l) => l.name === 'Level 1',
      )?.elevation,
    ).toBe(4);
  });

  it('refuses an elevation outside any building with the range in the message', async () => {
    const r = await s.api('PATCH', `/buildings/${buildingId}/levels/${level('Roof').id}`, {
      token,
      body: { elevation: 950 },
    });
    expect(r.status).toBe(400);
    expect(errorCode(r.body)).toBe('validation_failed');
    expect(JSON.stringify(r.body)).toContain('at most 900 m');
  });
});
