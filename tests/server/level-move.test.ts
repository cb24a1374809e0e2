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
    const before = await stack();
    const r = await s.api('PATCH', `/buildings/${buildingId}/levels/${level('Level 2').id}`, {
      token,
      body: { elevation: 8.4 },
    });
    expect(r.status).toBe(200);
    const after = await stack();
    expect(after.version).toBe(before.version + 1);
    expect(spliceElevations(after)).toEqual([8.9]);
    expect(after.results.errors).toEqual([]);
    expect(after.results.lifts.map((l) => [l.bottom, l.top])).toEqual([
      [0, 8.9],
      [8.9, 16],
    ]);
    // The floor stands at the level: the analysis places it there (docs/stack-editing.md)
    expect(after.results.takeDown.map((row) => row.elevation)).toContain(8.4);
    expect(after.results.lifts[0].pieces.map((p) => p.to)).toContain(8.4);
  });

  it('writes nothing into the nodes tied to the level: the level row is the one place its elevation is kept', async () => {
    const before = await stack();
    const tied = (d: StackDetail) =>
      d.doc.nodes.filter((n) => n.kind === 'restraint' && n.data.levelId === level('Level 1').id);
    expect(tied(before)).toHaveLength(1);
    // Level 1 has no splice above it: only its floor follows, placed on the level where it is read
    const preview = (
      await s.api('POST', `/buildings/${buildingId}/levels/${level('Level 1').id}/preview`, {
        token,
        body: { elevation: 4.25 },
      })
    ).body as LevelMovePreview;
    expect(preview.stacks).toEqual([{ stackId, name: 'C/3', nodes: 1, splices: 0, breaks: [] }]);
    const r = await s.api('PATCH', `/buildings/${buildingId}/levels/${level('Level 1').id}`, {
      token,
      body: { elevation: 4.25 },
    });
    expect(r.status).toBe(200);
    const after = await stack();
    // Stored again with results at the level's new place, and no op written into the stack
    expect(after.version).toBe(before.version + 1);
    const ops = (await s.api('GET', `/stacks/${stackId}/ops?since=${before.version}`, { token })).body as {
      ops: unknown[];
    }[];
    expect(ops.map((c) => c.ops)).toEqual([[]]);
    expect(after.results.takeDown.map((row) => row.elevation)).toContain(4.25);
    expect(after.results.takeDown.map((row) => row.elevation)).not.toContain(4);
    // The stored row keeps its old copy; what the API sends is placed on the level
    expect(tied(after)[0].data).toMatchObject({ elevation: 4.25 });
    const stored = JSON.parse(
      (await s.ctx.db('stacks').where({ id: stackId }).first<{ doc: string }>('doc')).doc,
    ) as StackDetail['doc'];
    expect(stored.nodes.find((n) => n.id === tied(after)[0].id)?.data).toMatchObject({ elevation: 4 });
    // A version in the stack's history reads the level too
    const asOf = (await s.api('GET', `/stacks/${stackId}/versions/${before.version}`, { token })).body as {
      outline: { part: string; where: string }[];
    };
    expect(asOf.outline.map((r) => r.where)).toContain('Level 1 (+4.250)');
    await s.api('PATCH', `/buildings/${buildingId}/levels/${level('Level 1').id}`, { token, body: { elevation: 4 } });
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

  // The building range, −100 m to +1000 m, is common practice, no source (shared/schema/stack.ts)
  it('refuses a level elevation outside any building with the range in the message, changing nothing', async () => {
    const before = await stack();
    for (const [elevation, words] of [
      [1200, 'elevation: must be at most +1000 m: no building stands that tall'],
      [-150, 'elevation: must be at least \u2212100 m: no building goes deeper'],
    ] as const) {
      const r = await s.api('PATCH', `/buildings/${buildingId}/levels/${level('Roof').id}`, {
        token,
        body: { elevation },
      });
      expect(r.status).toBe(400);
      expect(errorCode(r.body)).toBe('validation_failed');
      expect((r.body as { error: { message: string } }).error.message).toBe(`Invalid input (${words})`);
    }
    const created = await s.api('POST', `/buildings/${buildingId}/levels`, {
      token,
      body: { name: 'Sky lobby', elevation: 1000.5 },
    });
    expect(created.status).toBe(400);
    expect((await stack()).version).toBe(before.version);
  });

  it('refuses a node elevation outside any building with the range in the message, changing nothing', async () => {
    const before = await stack();
    const splice = before.doc.nodes.find((n) => n.kind === 'splice');
    const r = await s.api('POST', `/stacks/${stackId}/ops`, {
      token,
      body: { baseVersion: before.version, ops: [{ op: 'updateNode', id: splice?.id, data: { elevation: 1500 } }] },
    });
    expect(r.status).toBe(400);
    expect(errorCode(r.body)).toBe('validation_failed');
    expect((r.body as { error: { message: string } }).error.message).toContain(
      'must be at most +1000 m: no building stands that tall',
    );
    expect((await stack()).version).toBe(before.version);
  });
});
