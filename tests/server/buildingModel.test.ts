// The building model over the API: grid, build-ups, floor loads, placement and area overrides; derived loads
// reach the stored results, a floor-load change re-analyses the stacks on that level and reaches live rooms.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Level, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { BuildingModelChanged, BuildingModelReply, Grid, Placement } from '../../shared/schema/building.ts';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { createLevels, errorCode, startWithLeadAndBuilding, type TestServer } from './helpers.ts';
import { connect, next, nextStackSummary, request, type LiveClient } from './liveHelpers.ts';
import { smallGrid } from '../engine/building-model-fixtures.ts';

// Invented grid: x lines A 0, B 6, C 13.5 m; y lines 1 0, 2 7.5 m; no slab beyond the lines.
const GRID = smallGrid();
const OFFICE = {
  id: 'office',
  name: 'Office',
  permanent: [
    { label: 'Slab', gk: 3.5 },
    { label: 'Finishes', gk: 1.5 },
  ],
  imposed: { qk: 2.5, category: 'B' },
};
const ROOF = { id: 'roof', name: 'Roof', permanent: [{ label: 'Roof', gk: 4 }], imposed: { qk: 0.6, category: 'H' } };

describe('the building model over the API', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  let levels: Level[];
  let stack: StackSummary;
  let other: StackSummary;

  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding('Model'));
    levels = await createLevels(s, token, buildingId, [
      ['Ground', 0],
      ['First', 4],
      ['Second', 8],
      ['Roof', 12],
    ]);
    const template = { elevations: [0, 4, 8, 12], sections: ['UKC 254x254x73'], Gk: 100, Qk: 50 };
    stack = (await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name: 'S1', template } }))
      .body as StackSummary;
    other = (await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name: 'S2', template } }))
      .body as StackSummary;
  });
  afterAll(async () => {
    await s?.close();
  });

  const detail = async (id: number) => (await s.api('GET', `/stacks/${id}`, { token })).body as StackDetail;

  it('starts with an empty model, and a stack off the grid keeps its typed loads', async () => {
    const r = await s.api('GET', `/buildings/${buildingId}/model`, { token });
    expect(r.body).toMatchObject({ version: 0, buildups: [], floors: [], grid: { x: { lines: [] } } });
    const d = await detail(stack.id);
    expect(d.results.takeDown.find((t) => t.elevation === 4)?.Gk).toBe(100);
    expect(d.results.floorLoads).toBeUndefined();
    expect(d.gridX).toBeUndefined();
  });

  it('stores the grid and build-ups, and names a placed stack after its lines', async () => {
    expect((await s.api('PUT', `/buildings/${buildingId}/grid`, { token, body: { grid: GRID } })).status).toBe(200);
    expect(
      (await s.api('PUT', `/buildings/${buildingId}/buildups`, { token, body: { buildups: [OFFICE, ROOF] } })).status,
    ).toBe(200);
    const r = await s.api('PUT', `/stacks/${stack.id}/placement`, { token, body: { gridX: 'B', gridY: 'y2' } });
    expect(r.status).toBe(200);
    expect(r.body as Placement).toMatchObject({ name: 'B/2', gridX: 'B', gridY: 'y2', webAlong: 'x' });
    // No floor loads yet: still the typed 100 kN
    expect((await detail(stack.id)).results.takeDown.find((t) => t.elevation === 4)?.Gk).toBe(100);
  });

  it('refuses a second stack on the same crossing, and grid lines the grid does not have', async () => {
    const taken = await s.api('PUT', `/stacks/${other.id}/placement`, { token, body: { gridX: 'B', gridY: 'y2' } });
    expect(taken.status).toBe(409);
    const missing = await s.api('PUT', `/stacks/${other.id}/placement`, { token, body: { gridX: 'Z', gridY: 'y2' } });
    expect(missing.status).toBe(422);
    expect(errorCode(missing.body)).toBe('unprocessable');
  });

  it('derives the loads of the stacks on a level when the level gets a floor load, and tells the building room', async () => {
    const live: LiveClient = await connect(s.url, token);
    try {
      expect((await request(live, 'building:join', { buildingId })).ok).toBe(true);
      const heard = next(live, 'building:model-changed');
      const stackHeard = nextStackSummary(live, (p) => p.stackId === stack.id);
      const first = levels[1];
      const r = await s.api('PUT', `/buildings/${buildingId}/levels/${first.id}/floor-load`, {
        token,
        body: { buildupId: 'office' },
      });
      expect(r.status).toBe(200);
      expect((r.body as BuildingModelReply).floors).toEqual([
        { levelId: first.id, buildupId: 'office', span: 'two-way', lines: [] },
      ]);
      const event: BuildingModelChanged = await heard;
      expect(event.model.floors).toHaveLength(1);
      await stackHeard;
    } finally {
      live.close();
    }
    // B/2: (3 + 3.75)(3.75 + 0) = 25.3125 m²; Gk = 5.0 × 25.3125 = 126.5625 kN, Qk = 2.5 × 25.3125 = 63.28125 kN
    const d = await detail(stack.id);
    const row = d.results.takeDown.find((t) => t.elevation === 4)!;
    expect(row.Gk).toBeCloseTo(126.5625, 9);
    expect(row.Qk).toBeCloseTo(63.28125, 9);
    // The stored document keeps the typed loads (one source of truth: the floors)
    const restraint = d.doc.nodes.find((n) => n.kind === 'restraint' && n.data.elevation === 4);
    expect(restraint?.kind === 'restraint' && restraint.data.Gk).toBe(100);
    // The other stack is off the grid: unchanged
    expect((await detail(other.id)).results.takeDown.find((t) => t.elevation === 4)?.Gk).toBe(100);
  });

  it('takes an area set by hand with its reason', async () => {
    const first = levels[1];
    const r = await s.api('PUT', `/stacks/${stack.id}/area-overrides`, {
      token,
      body: { overrides: [{ levelId: first.id, factor: 0.5, reason: 'Stair void' }] },
    });
    expect(r.status).toBe(200);
    const use = (await detail(stack.id)).results.floorLoads!.find((u) => u.levelId === first.id)!;
    expect(use).toMatchObject({
      area: expect.closeTo(12.65625, 9),
      gridArea: expect.closeTo(25.3125, 9),
      overrideReason: 'Stair void',
    });
    await s.api('PUT', `/stacks/${stack.id}/area-overrides`, { token, body: { overrides: [] } });
  });

  it('renames the stacks on a grid line when the line is renamed', async () => {
    const renamed: Grid = {
      ...GRID,
      x: { ...GRID.x, lines: GRID.x.lines.map((l) => (l.id === 'B' ? { ...l, name: 'B1' } : l)) },
    };
    expect((await s.api('PUT', `/buildings/${buildingId}/grid`, { token, body: { grid: renamed } })).status).toBe(200);
    expect((await detail(stack.id)).name).toBe('B1/2');
  });

  it('refuses to drop a grid line a stack stands on, and leaves the model as it was', async () => {
    const before = (await s.api('GET', `/buildings/${buildingId}/model`, { token })).body as BuildingModelReply;
    const without: Grid = { ...GRID, x: { ...GRID.x, lines: GRID.x.lines.filter((l) => l.id !== 'B') } };
    const r = await s.api('PUT', `/buildings/${buildingId}/grid`, { token, body: { grid: without } });
    expect(r.status).toBe(409);
    expect((await s.api('GET', `/buildings/${buildingId}/model`, { token })).body).toEqual(before);
  });

  it('refuses to drop a build-up a floor uses, and a line load off the edge of the grid', async () => {
    expect(
      (await s.api('PUT', `/buildings/${buildingId}/buildups`, { token, body: { buildups: [ROOF] } })).status,
    ).toBe(409);
    const inner = await s.api('PUT', `/buildings/${buildingId}/levels/${levels[2].id}/floor-load`, {
      token,
      body: { buildupId: 'office', lines: [{ gridLineId: 'B', label: 'Wall', gk: 5 }] },
    });
    expect(inner.status).toBe(422);
  });

  it('puts a line load on an edge line onto the stacks on it', async () => {
    await s.api('PUT', `/stacks/${other.id}/placement`, { token, body: { gridX: 'C', gridY: 'y2' } });
    const r = await s.api('PUT', `/buildings/${buildingId}/levels/${levels[2].id}/floor-load`, {
      token,
      body: { buildupId: 'office', lines: [{ gridLineId: 'C', label: 'Cladding', gk: 6 }] },
    });
    expect(r.status).toBe(200);
    // C/2: (3.75 + 0)(3.75 + 0) = 14.0625 m² → 5.0 × 14.0625 = 70.3125; cladding 6 × 3.75 = 22.5 → 92.8125 kN
    const use = (await detail(other.id)).results.floorLoads!.find((u) => u.levelId === levels[2].id)!;
    expect(use.Gk).toBeCloseTo(92.8125, 9);
    expect(use.lineGk).toBeCloseTo(22.5, 9);
  });

  it("freezes the model and each stack's place with the revision, beside the derived loads in its results", async () => {
    const r = await s.api('POST', `/buildings/${buildingId}/revisions`, {
      token,
      body: { note: 'Floor loads', purpose: 'preliminary', acknowledgeFailingLifts: true },
    });
    expect(r.status).toBe(201);
    const row = await s.ctx
      .db('revisions')
      .where({ id: (r.body as { id: number }).id })
      .first<{ snapshot: string }>('snapshot');
    const snapshot = JSON.parse(row.snapshot) as RevisionSnapshot;
    expect(snapshot.buildingModel?.floors.map((f) => f.levelId).sort()).toEqual([levels[1].id, levels[2].id].sort());
    const frozen = snapshot.stacks.find((st) => st.id === stack.id)!;
    expect(frozen.placement).toEqual({ gridX: 'B', gridY: 'y2', webAlong: 'x' });
    expect(frozen.results.floorLoads?.some((u) => u.levelId === levels[1].id)).toBe(true);
    expect(snapshot.stacks.find((st) => st.id === other.id)?.placement).toEqual({
      gridX: 'C',
      gridY: 'y2',
      webAlong: 'x',
    });
  });

  it('taking the floor load away gives the stacks their typed loads back', async () => {
    await s.api('PUT', `/buildings/${buildingId}/levels/${levels[1].id}/floor-load`, {
      token,
      body: { buildupId: null },
    });
    expect((await detail(stack.id)).results.takeDown.find((t) => t.elevation === 4)?.Gk).toBe(100);
  });

  it('re-analyses each stack of a floor-load change as it would alone, one version, ops row and audit row each', async () => {
    // Same documents at crossings whose floors differ (mirrored faces, an area set by hand): results
    // shared between stacks with equal inputs must never reach a stack whose inputs differ.
    const template = { elevations: [0, 4, 8, 12], sections: ['UKC 254x254x73'], Gk: 100, Qk: 50 };
    const create = async (name: string, gridX: string, gridY: string) => {
      const made = (await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name, template } }))
        .body as StackSummary;
      expect((await s.api('PUT', `/stacks/${made.id}/placement`, { token, body: { gridX, gridY } })).status).toBe(200);
      return made.id;
    };
    const mirrored = await create('S3', 'B', 'y1');
    const corner = await create('S4', 'A', 'y1');
    const reduced = await create('S5', 'A', 'y2');
    await s.api('PUT', `/stacks/${reduced}/area-overrides`, {
      token,
      body: { overrides: [{ levelId: levels[1].id, factor: 0.5, reason: 'Void' }] },
    });
    const ids = [stack.id, other.id, mirrored, corner, reduced];
    const before = new Map(await Promise.all(ids.map(async (id) => [id, (await detail(id)).version] as const)));
    // The building room hears the write once, with every stack it changed (docs/live-protocol.md).
    const live: LiveClient = await connect(s.url, token);
    const singles: number[] = [];
    live.on('building:stack-changed', (p) => singles.push(p.stackId));
    expect((await request(live, 'building:join', { buildingId })).ok).toBe(true);
    const together = next(live, 'building:stacks-changed');
    const r = await s.api('PUT', `/buildings/${buildingId}/levels/${levels[1].id}/floor-load`, {
      token,
      body: { buildupId: 'office' },
    });
    expect(r.status).toBe(200);
    const heard = await together;
    live.close();
    expect(heard.buildingId).toBe(buildingId);
    expect(heard.stacks.map((p) => [p.stackId, p.version]).sort((a, b) => a[0] - b[0])).toEqual(
      ids.map((id) => [id, before.get(id)! + 1]).sort((a, b) => a[0] - b[0]),
    );
    expect(singles).toEqual([]);
    const bulk = new Map(await Promise.all(ids.map(async (id) => [id, await detail(id)] as const)));
    for (const id of ids) {
      expect(bulk.get(id)!.version).toBe(before.get(id)! + 1);
      const ops = await s.ctx.db('stack_ops').where({ stack_id: id, version: before.get(id)! + 1 });
      expect(ops.map((o: { ops: string }) => o.ops)).toEqual(['[]']);
      const audit = await s.ctx.db('audit_log').where({ stack_id: id, version: before.get(id)! + 1 });
      expect(audit.map((a: { action: string }) => a.action)).toEqual(['level.floor-load']);
    }
    // B/1 and B/2 carry the same area from opposite sides: the same totals on mirrored faces
    const faces = (id: number) => bulk.get(id)!.results.floorLoads!.find((u) => u.levelId === levels[1].id)!.faces;
    expect(faces(mirrored)).not.toEqual(faces(stack.id));
    // Placing a stack where it stands analyses it alone: the stored results must not change
    for (const id of ids) {
      const { gridX, gridY } = bulk.get(id)!;
      expect((await s.api('PUT', `/stacks/${id}/placement`, { token, body: { gridX, gridY } })).status).toBe(200);
      expect((await detail(id)).results).toEqual(bulk.get(id)!.results);
    }
  });
});
