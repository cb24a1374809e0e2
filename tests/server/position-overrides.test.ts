// Areas set by hand at a further position of a typical column (docs/typical-columns.md, docs/building-model.md
// §Tributary areas): a void at one level of one position reduces that position's load, and only that position's;
// the write is the one write of area overrides (one transaction, the same broadcasts); viewers are refused,
// malformed bodies change nothing, and removing the position takes its overrides away.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Level, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import { buildingModelSchema, EMPTY_GRID, type BuildingModel } from '../../shared/schema/building.ts';
import { stackPositionsReplySchema, type PositionResult } from '../../shared/schema/stackPositions.ts';
import { analysisInputs, floorLoadsOf, positionPlaces } from '../../server/services/analysis.ts';
import { loadStackRow, placeOf } from '../../server/services/stackRows.ts';
import { addMember, errorCode, registerUser, startWithLeadAndBuilding, type TestServer } from './helpers.ts';
import { connect, next, request } from './liveHelpers.ts';
import { A1, B2, typicalColumnBuilding } from './typicalColumnFixture.ts';

// Options that make the design force a hand sum: EN 1990 eq. 6.10 alone, no imposed-load reduction, no self-weight.
const OPTIONS = { combination: '6.10', annex: 'EN', imposedReduction: false, selfWeight: false };

/**
 * The design force at the base of B/2 (the largest in the type there), by hand. EN 1990 eq. 6.10 with Table A1.2(B)
 * γG 1.35, γQ 1.5 and Table A1.1 ψ0 0.7 for category B, 0 for roofs (H); so the office (B) leads and the roof's
 * imposed load adds nothing. Loads of the fixture (typicalColumnFixture.ts): office gk 5, qk 2.5 kN/m² on First and
 * Second, roof gk 4, qk 0.6 kN/m².
 * `first` is the area of First in m², the others carry B2 = 25.3125 m².
 *   ΣGk = 5·first + 5·B2 + 4·B2, Qk(B) = 2.5·(first + B2), NEd = 1.35·ΣGk + 1.5·Qk(B).
 */
const baseNEd = (first: number) => 1.35 * (5 * first + 9 * B2) + 1.5 * 2.5 * (first + B2);
// The grid's area everywhere: 1.35 × 14 × 25.3125 + 1.5 × 5 × 25.3125 = 478.40625 + 189.84375 = 668.25 kN.
const FULL = 668.25;
// Half of First lost to a void (12.65625 m²): ΣGk = 63.28125 + 227.8125 = 291.09375 kN, Qk(B) = 94.921875 kN,
// NEd = 392.9765625 + 142.3828125 = 535.359375 kN.
const VOIDED = 535.359375;

describe('areas set by hand at a position of a typical column', () => {
  let s: TestServer;
  let lead: string;
  let engineer: string;
  let viewer: string;
  let buildingId: number;
  let levels: Level[];
  let typical: StackSummary;
  let other: StackSummary;
  let positionId: number;
  let otherPositionId: number;

  const first = () => levels.find((l) => l.name === 'First')!;
  const detail = async (id: number) => (await s.api('GET', `/stacks/${id}`, { token: lead })).body as StackDetail;
  const model = async () =>
    (await s.api('GET', `/buildings/${buildingId}/model`, { token: lead })).body as BuildingModel & {
      version: number;
    };
  const at = (results: StackDetail['results'], name: string): PositionResult =>
    results.positions!.find((p) => p.name === name)!;
  const baseOf = (p: PositionResult) => Math.max(...p.lifts.map((l) => l.NEd));
  const put = (token: string, body: unknown, path = `/stacks/${typical.id}/positions/${positionId}/area-overrides`) =>
    s.api('PUT', path, { token, body });
  /** What a refused write must leave as it was. */
  const state = async () => ({
    model: await s.ctx.db('building_models').where({ building_id: buildingId }).first('model', 'version'),
    stacks: await s.ctx.db('stacks').where({ building_id: buildingId }).orderBy('id').select('id', 'version'),
    audit: await s.ctx.db('audit_log').count('* as n'),
    ops: await s.ctx.db('stack_ops').count('* as n'),
  });

  beforeAll(async () => {
    ({ s, token: lead, buildingId } = await startWithLeadAndBuilding('Voids'));
    const eng = await registerUser(s, 'engineer');
    const view = await registerUser(s, 'viewer');
    await addMember(s, lead, buildingId, eng.user.email, 'engineer');
    await addMember(s, lead, buildingId, view.user.email, 'viewer');
    engineer = eng.token;
    viewer = view.token;
    expect((await s.api('PATCH', `/buildings/${buildingId}`, { token: lead, body: { options: OPTIONS } })).status).toBe(
      200,
    );
    let stacks: StackSummary[];
    ({ levels, stacks } = await typicalColumnBuilding(s, lead, buildingId, ['S1', 'S2']));
    [typical, other] = stacks as [StackSummary, StackSummary];
    await s.api('PUT', `/stacks/${typical.id}/placement`, { token: lead, body: { gridX: 'A', gridY: 'y1' } });
    await s.api('PUT', `/stacks/${other.id}/placement`, { token: lead, body: { gridX: 'C', gridY: 'y1' } });
    const added = await s.api('POST', `/stacks/${typical.id}/positions`, {
      token: engineer,
      body: { gridX: 'B', gridY: 'y2' },
    });
    positionId = stackPositionsReplySchema.parse(added.body).positions[0]!.id;
    const otherAdded = await s.api('POST', `/stacks/${other.id}/positions`, {
      token: engineer,
      body: { gridX: 'C', gridY: 'y2' },
    });
    otherPositionId = stackPositionsReplySchema.parse(otherAdded.body).positions[0]!.id;
  });
  afterAll(async () => {
    await s?.close();
  });

  it('carries the full tributary area at B/2 until told otherwise', async () => {
    const b2 = at((await detail(typical.id)).results, 'B/2');
    expect(b2.area).toBeCloseTo(3 * B2, 9);
    expect(baseOf(b2)).toBeCloseTo(baseNEd(B2), 6);
    expect(baseOf(b2)).toBeCloseTo(FULL, 6);
  });

  it('a void at First of B/2 halves its area there: B/2 carries the reduced load, A/1 is untouched', async () => {
    const live = await connect(s.url, lead);
    try {
      expect((await request(live, 'building:join', { buildingId })).ok).toBe(true);
      expect((await request(live, 'stack:join', { stackId: typical.id })).ok).toBe(true);
      const before = { stack: (await detail(typical.id)).version, model: (await model()).version };
      const heardModel = next(live, 'building:model-changed', (p) => p.buildingId === buildingId);
      const heardStack = next(live, 'building:stack-changed', (p) => p.stackId === typical.id);
      const heardRoom = next(live, 'stack:changed', (p) => p.stackId === typical.id);
      const overrides = [{ levelId: first().id, factor: 0.5, reason: 'Stair void' }];
      const r = await put(engineer, { overrides });
      expect(r.status).toBe(200);
      const reply = stackPositionsReplySchema.parse(r.body);
      expect(reply.positions.map((p) => [p.name, p.overrides])).toEqual([['B/2', overrides]]);
      expect(reply.version).toBe(before.stack + 1);

      // First at B/2: 0.5 × 25.3125 = 12.65625 m²; Gk = 5 × 12.65625 = 63.28125 kN, Qk = 2.5 × 12.65625 = 31.640625 kN.
      const inputs = await analysisInputs(s.ctx.db, buildingId);
      const [place] = positionPlaces(inputs, placeOf(await loadStackRow(s.ctx.db, typical.id)));
      const loads = floorLoadsOf(inputs, place!.place)!;
      expect(loads.get(first().id)).toMatchObject({ area: B2 / 2, gridArea: B2, overrideReason: 'Stair void' });
      expect(loads.get(first().id)!.Gk).toBeCloseTo(63.28125, 9);
      expect(loads.get(first().id)!.Qk).toBeCloseTo(31.640625, 9);

      const b2 = reply.results.find((p) => p.name === 'B/2')!;
      // 2.5 floors' worth of B/2's area: 12.65625 + 2 × 25.3125 = 63.28125 m².
      expect(b2.area).toBeCloseTo(63.28125, 9);
      expect(baseOf(b2)).toBeCloseTo(baseNEd(B2 / 2), 6);
      expect(baseOf(b2)).toBeCloseTo(VOIDED, 6);
      // The own place keeps the grid's area at every level: 3 × 11.25 m².
      const own = reply.results.find((p) => p.positionId === null)!;
      expect(own.area).toBeCloseTo(3 * A1, 9);

      // Heard as a stack's own overrides are: the model, then the stack's change in both rooms.
      const m = await heardModel;
      expect(m.version).toBe(before.model + 1);
      expect(m.model.overrides).toEqual({ [`p${positionId}`]: overrides });
      const changed = await heardStack;
      expect(changed.version).toBe(before.stack + 1);
      expect(changed.positions?.find((p) => p.name === 'B/2')?.area).toBeCloseTo(63.28125, 9);
      expect((await heardRoom).version).toBe(before.stack + 1);
      // The model's audit row (the stack's version has its own, as for any re-analysis).
      const audit = await s.ctx
        .db('audit_log')
        .where({ action: 'stack.area-overrides', building_id: buildingId })
        .whereNull('stack_id')
        .orderBy('id', 'desc')
        .first('detail');
      expect(JSON.parse(audit.detail)).toEqual({ stackId: typical.id, positionId, overrides: 1 });
    } finally {
      live.close();
    }
  });

  it("keeps the stack's own overrides and a position's apart", async () => {
    const second = levels.find((l) => l.name === 'Second')!;
    const own = [{ levelId: second.id, area: 0, reason: 'Atrium' }];
    const r = await s.api('PUT', `/stacks/${typical.id}/area-overrides`, { token: engineer, body: { overrides: own } });
    expect(r.status).toBe(200);
    expect(Object.keys((await model()).overrides).sort()).toEqual([String(typical.id), `p${positionId}`].sort());
    const results = (await detail(typical.id)).results;
    // A/1 loses Second: 2 × 11.25 m²; B/2 keeps its own void only: 63.28125 m².
    expect(at(results, 'A/1').area).toBeCloseTo(2 * A1, 9);
    expect(at(results, 'B/2').area).toBeCloseTo(63.28125, 9);
    await s.api('PUT', `/stacks/${typical.id}/area-overrides`, { token: engineer, body: { overrides: [] } });
    expect(Object.keys((await model()).overrides)).toEqual([`p${positionId}`]);
  });

  it('takes an area in m² as well as a factor', async () => {
    const roof = levels.find((l) => l.name === 'Roof')!;
    const overrides = [
      { levelId: first().id, factor: 0.5, reason: 'Stair void' },
      { levelId: roof.id, area: 10, reason: 'Plant well' },
    ];
    const reply = stackPositionsReplySchema.parse((await put(engineer, { overrides })).body);
    // 12.65625 + 25.3125 + 10 = 47.96875 m²
    expect(reply.results.find((p) => p.name === 'B/2')!.area).toBeCloseTo(47.96875, 9);
    const back = stackPositionsReplySchema.parse((await put(lead, { overrides: overrides.slice(0, 1) })).body);
    expect(back.results.find((p) => p.name === 'B/2')!.area).toBeCloseTo(63.28125, 9);
  });

  it('refuses viewers, malformed bodies, unknown levels and positions of another stack, changing nothing', async () => {
    const before = await state();
    const good = { overrides: [{ levelId: first().id, factor: 0.25, reason: 'Lift core' }] };
    const cases: [string, () => Promise<{ status: number; body: unknown }>, number][] = [
      ['a viewer', () => put(viewer, good), 403],
      ['an area and a factor', () => put(engineer, { overrides: [{ ...good.overrides[0], area: 3 }] }), 400],
      ['no reason', () => put(engineer, { overrides: [{ levelId: first().id, factor: 0.5, reason: ' ' }] }), 400],
      ['a negative area', () => put(engineer, { overrides: [{ levelId: first().id, area: -1, reason: 'x' }] }), 400],
      ['an extra field', () => put(engineer, { ...good, positionId }), 400],
      ['a list for a body', () => put(engineer, good.overrides), 400],
      [
        'a position id that is not a number',
        () => put(engineer, good, `/stacks/${typical.id}/positions/x/area-overrides`),
        400,
      ],
      [
        'two overrides of one level',
        () => put(engineer, { overrides: [...good.overrides, { levelId: first().id, area: 3, reason: 'Core' }] }),
        422,
      ],
      [
        'a level the building lacks',
        () => put(engineer, { overrides: [{ ...good.overrides[0], levelId: '999999' }] }),
        422,
      ],
      [
        'a position of another stack',
        () => put(engineer, good, `/stacks/${typical.id}/positions/${otherPositionId}/area-overrides`),
        404,
      ],
      [
        'a position nobody has',
        () => put(engineer, good, `/stacks/${typical.id}/positions/999999/area-overrides`),
        404,
      ],
      ['a stack nobody has', () => put(engineer, good, `/stacks/999999/positions/${positionId}/area-overrides`), 404],
    ];
    for (const [name, send, status] of cases) {
      const r = await send();
      expect([name, r.status]).toEqual([name, status]);
      expect(errorCode(r.body)).toBeDefined();
    }
    expect(await state()).toEqual(before);
  });

  it('keeps only stack ids and p<position id> as keys of the overrides, so old models stay valid', () => {
    const with_ = (overrides: Record<string, never[]>) =>
      buildingModelSchema.safeParse({ grid: EMPTY_GRID, buildups: [], floors: [], overrides }).success;
    expect(with_({})).toBe(true);
    expect(with_({ '12': [], p3: [] })).toBe(true);
    for (const key of ['x1', 'p', '0', 'p0', '-3', '1.5', ' 7'])
      expect([key, with_({ [key]: [] })]).toEqual([key, false]);
  });

  it('removing the position takes its overrides away with it, and a new position there starts from the grid', async () => {
    const live = await connect(s.url, lead);
    try {
      expect((await request(live, 'building:join', { buildingId })).ok).toBe(true);
      const version = (await model()).version;
      const heardModel = next(live, 'building:model-changed', (p) => p.buildingId === buildingId);
      const r = await s.api('DELETE', `/stacks/${typical.id}/positions/${positionId}`, { token: engineer });
      expect(r.status).toBe(200);
      const after = await model();
      expect(after.overrides).toEqual({});
      expect(after.version).toBe(version + 1);
      expect((await heardModel).model.overrides).toEqual({});
    } finally {
      live.close();
    }
    const again = await s.api('POST', `/stacks/${typical.id}/positions`, {
      token: engineer,
      body: { gridX: 'B', gridY: 'y2' },
    });
    const reply = stackPositionsReplySchema.parse(again.body);
    expect(reply.positions.map((p) => [p.name, p.overrides])).toEqual([['B/2', []]]);
    expect(reply.results.find((p) => p.name === 'B/2')!.area).toBeCloseTo(3 * B2, 9);
    positionId = reply.positions[0]!.id;
  });

  it('removing a position without overrides leaves the model as it was', async () => {
    const before = await s.ctx.db('building_models').where({ building_id: buildingId }).first('model', 'version');
    expect((await s.api('DELETE', `/stacks/${typical.id}/positions/${positionId}`, { token: lead })).status).toBe(200);
    expect(await s.ctx.db('building_models').where({ building_id: buildingId }).first('model', 'version')).toEqual(
      before,
    );
  });

  it("deleting a stack takes its own and its positions' areas out of the model, and leaves other stacks' alone", async () => {
    const own = [{ levelId: first().id, factor: 0.25, reason: 'Lift shaft' }];
    const atPosition = [{ levelId: first().id, area: 2, reason: 'Riser' }];
    const kept = [{ levelId: first().id, factor: 0.5, reason: 'Stair void' }];
    const puts = [
      [`/stacks/${other.id}/area-overrides`, own],
      [`/stacks/${other.id}/positions/${otherPositionId}/area-overrides`, atPosition],
      [`/stacks/${typical.id}/area-overrides`, kept],
    ] as const;
    for (const [path, overrides] of puts) {
      expect((await s.api('PUT', path, { token: engineer, body: { overrides } })).status).toBe(200);
    }
    expect(Object.keys((await model()).overrides).sort()).toEqual(
      [String(other.id), `p${otherPositionId}`, String(typical.id)].sort(),
    );
    const live = await connect(s.url, lead);
    try {
      expect((await request(live, 'building:join', { buildingId })).ok).toBe(true);
      const version = (await model()).version;
      const heardModel = next(live, 'building:model-changed', (p) => p.buildingId === buildingId);
      expect((await s.api('DELETE', `/stacks/${other.id}`, { token: engineer })).status).toBe(403);
      expect(Object.keys((await model()).overrides)).toHaveLength(3);
      expect((await s.api('DELETE', `/stacks/${other.id}`, { token: lead })).status).toBe(204);
      const after = await model();
      expect(after.overrides).toEqual({ [String(typical.id)]: kept });
      expect(after.version).toBe(version + 1);
      expect((await heardModel).model.overrides).toEqual({ [String(typical.id)]: kept });
    } finally {
      live.close();
    }
    expect(await s.ctx.db('stack_positions').where({ stack_id: other.id }).select('id')).toEqual([]);
    // The remaining stack keeps its own void: A/1 carries 0.5 × 11.25 = 5.625 m² at First.
    const inputs = await analysisInputs(s.ctx.db, buildingId);
    const place = placeOf(await loadStackRow(s.ctx.db, typical.id));
    expect(floorLoadsOf(inputs, place)!.get(first().id)).toMatchObject({ area: A1 / 2, gridArea: A1 });
    await s.api('PUT', `/stacks/${typical.id}/area-overrides`, { token: lead, body: { overrides: [] } });
  });

  it('deleting a stack with no areas set by hand leaves the model as it was', async () => {
    const template = { elevations: [0, 4, 8, 12], sections: ['UKC 203x203x46'], Gk: 100, Qk: 50 };
    const created = await s.api('POST', `/buildings/${buildingId}/stacks`, {
      token: lead,
      body: { name: 'S3', template },
    });
    const spare = created.body as StackSummary;
    const before = await s.ctx.db('building_models').where({ building_id: buildingId }).first('model', 'version');
    expect((await s.api('DELETE', `/stacks/${spare.id}`, { token: lead })).status).toBe(204);
    expect(await s.ctx.db('building_models').where({ building_id: buildingId }).first('model', 'version')).toEqual(
      before,
    );
  });
});
