// Typical columns over the API (docs/typical-columns.md): a stack applied to a further grid position is checked
// there with that position's own floor loads; the governing position is named, refused writes change nothing,
// and a floor-load change reaches the building room with every position's check.
import { PDFParse } from 'pdf-parse';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Level, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { Grid } from '../../shared/schema/building.ts';
import type { ColumnSchedule } from '../../shared/schedule/columnSchedule.ts';
import {
  buildingPositionsReplySchema,
  stackPositionsReplySchema,
  type StackPositionsReply,
} from '../../shared/schema/stackPositions.ts';
import { analyse, analysisInputs } from '../../server/services/analysis.ts';
import { loadStackRow, placeOf } from '../../server/services/stackRows.ts';
import { errorCode, startWithLeadAndBuilding, type TestServer } from './helpers.ts';
import { connect, nextStackSummary, request } from './liveHelpers.ts';
import { A1, B2, GRID, OFFICE, ROOF, typicalColumnBuilding } from './typicalColumnFixture.ts';

describe('typical columns over the API', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  let levels: Level[];
  let typical: StackSummary;
  let other: StackSummary;
  let loose: StackSummary;

  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding('Typical'));
    let stacks: StackSummary[];
    ({ levels, stacks } = await typicalColumnBuilding(s, token, buildingId, ['S1', 'S2', 'S3']));
    [typical, other, loose] = stacks as [StackSummary, StackSummary, StackSummary];
    await s.api('PUT', `/stacks/${typical.id}/placement`, { token, body: { gridX: 'A', gridY: 'y1' } });
    await s.api('PUT', `/stacks/${other.id}/placement`, { token, body: { gridX: 'C', gridY: 'y1' } });
  });
  afterAll(async () => {
    await s?.close();
  });

  const detail = async (id: number) => (await s.api('GET', `/stacks/${id}`, { token })).body as StackDetail;
  const summary = async (id: number) =>
    ((await s.api('GET', `/buildings/${buildingId}/stacks`, { token })).body as StackSummary[]).find(
      (x) => x.id === id,
    )!;
  const positionRows = () => s.ctx.db('stack_positions').orderBy('id').select();

  it('applies the stack at B/2 and names B/2, the larger tributary area, as governing', async () => {
    const r = await s.api('POST', `/stacks/${typical.id}/positions`, { token, body: { gridX: 'B', gridY: 'y2' } });
    expect(r.status).toBe(201);
    const reply = stackPositionsReplySchema.parse(r.body);
    expect(reply.positions).toEqual([
      {
        id: expect.any(Number),
        stackId: typical.id,
        gridX: 'B',
        gridY: 'y2',
        webAlong: 'x',
        name: 'B/2',
        overrides: [],
      },
    ]);
    expect(reply.results.map((p) => [p.name, p.positionId])).toEqual([
      ['A/1', null],
      ['B/2', reply.positions[0]!.id],
    ]);
    // Two floors and the roof each: 3 × 11.25 = 33.75 m² and 3 × 25.3125 = 75.9375 m².
    expect(reply.results[0]!.area).toBeCloseTo(3 * A1, 9);
    expect(reply.results[1]!.area).toBeCloseTo(3 * B2, 9);
    expect(reply.governingPosition).toBe('B/2');
    expect(reply.results[1]!.utilisation!).toBeGreaterThan(reply.results[0]!.utilisation!);
  });

  it("keeps the stack's own results for its own place, and summarises the type by its governing position", async () => {
    const d = await detail(typical.id);
    // A/1 at the first floor: Gk = 5 × 11.25 = 56.25 kN, Qk = 2.5 × 11.25 = 28.125 kN
    const first = d.results.takeDown.find((t) => t.elevation === 4)!;
    expect(first.Gk).toBeCloseTo(56.25, 9);
    expect(first.Qk).toBeCloseTo(28.125, 9);
    expect(d.results.governingPosition).toBe('B/2');
    const b2 = d.results.positions!.find((p) => p.name === 'B/2')!;
    expect((await summary(typical.id)).utilisation).toBeCloseTo(b2.utilisation!, 12);
    const listed = buildingPositionsReplySchema.parse(
      (await s.api('GET', `/buildings/${buildingId}/stack-positions`, { token })).body,
    );
    expect(listed.stacks.map((x) => [x.stackId, x.governingPosition, x.results.length])).toEqual([
      [typical.id, 'B/2', 2],
    ]);
  });

  it('refuses a crossing that is taken, a grid line the grid lacks, bad bodies and a stack off the grid, changing nothing', async () => {
    const before = await positionRows();
    const version = (await detail(typical.id)).version;
    const post = (id: number, body: unknown) => s.api('POST', `/stacks/${id}/positions`, { token, body });
    const cases: [number, unknown, number][] = [
      [typical.id, { gridX: 'B', gridY: 'y2' }, 409], // already a position of this stack
      [typical.id, { gridX: 'A', gridY: 'y1' }, 409], // its own place
      [typical.id, { gridX: 'C', gridY: 'y1' }, 409], // another stack's place
      [other.id, { gridX: 'B', gridY: 'y2' }, 409], // another stack's typical position
      [typical.id, { gridX: 'Z', gridY: 'y1' }, 422],
      [loose.id, { gridX: 'B', gridY: 'y1' }, 422], // the stack is off the grid
      [typical.id, { gridX: 'B' }, 400],
      [typical.id, { gridX: 'B', gridY: 'y1', extra: 1 }, 400],
      [typical.id, { gridX: 'B', gridY: 'y1', webAlong: 'z' }, 400],
      [typical.id, { gridX: 'B b', gridY: 'y1' }, 400],
      [typical.id, [], 400],
    ];
    for (const [id, body, status] of cases) {
      const r = await post(id, body);
      expect([JSON.stringify(body), r.status]).toEqual([JSON.stringify(body), status]);
      expect(errorCode(r.body)).toBeDefined();
    }
    expect((await s.api('POST', '/stacks/999999/positions', { token, body: { gridX: 'B', gridY: 'y1' } })).status).toBe(
      404,
    );
    const wrongStack = await s.api('DELETE', `/stacks/${other.id}/positions/${before[0].id}`, { token });
    expect(wrongStack.status).toBe(404);
    expect((await s.api('DELETE', `/stacks/${typical.id}/positions/x`, { token })).status).toBe(400);
    expect(await positionRows()).toEqual(before);
    expect((await detail(typical.id)).version).toBe(version);
  });

  it('keeps a typical position free of other stacks, and the type on the grid while it has positions', async () => {
    const onIt = await s.api('PUT', `/stacks/${other.id}/placement`, { token, body: { gridX: 'B', gridY: 'y2' } });
    expect(onIt.status).toBe(409);
    const off = await s.api('PUT', `/stacks/${typical.id}/placement`, { token, body: { gridX: null, gridY: null } });
    expect(off.status).toBe(409);
    const without: Grid = { ...GRID, x: { ...GRID.x, lines: GRID.x.lines.filter((l) => l.id !== 'B') } };
    expect((await s.api('PUT', `/buildings/${buildingId}/grid`, { token, body: { grid: without } })).status).toBe(409);
    expect((await detail(typical.id)).gridX).toBe('A');
  });

  it('re-checks every position when a floor load changes, and the building room hears each position', async () => {
    const live = await connect(s.url, token);
    try {
      expect((await request(live, 'building:join', { buildingId })).ok).toBe(true);
      const heard = nextStackSummary(live, (p) => p.stackId === typical.id);
      const r = await s.api('PUT', `/buildings/${buildingId}/levels/${levels[1]!.id}/floor-load`, {
        token,
        body: { buildupId: null },
      });
      expect(r.status).toBe(200);
      const event = await heard;
      // The first floor no longer carries a floor load: the second floor and the roof remain.
      expect(event.positions?.map((p) => [p.name, p.area])).toEqual([
        ['A/1', expect.closeTo(2 * A1, 9)],
        ['B/2', expect.closeTo(2 * B2, 9)],
      ]);
      expect(event.governingPosition).toBe('B/2');
      expect(event.utilisation).toBeCloseTo(event.positions![1]!.utilisation!, 12);
    } finally {
      live.close();
    }
  });

  it('sizes the type for its worst position', async () => {
    const r = await s.api('POST', `/stacks/${typical.id}/sizing`, { token, body: { series: 'UKC', grade: 'S355' } });
    expect(r.status).toBe(200);
    const lifts = (r.body as { lifts: { before: { utilisation: number } }[] }).lifts;
    const b2 = (await detail(typical.id)).results.positions!.find((p) => p.name === 'B/2')!;
    // "before" is the current sections' utilisation at the worst position, lift by lift.
    expect(lifts.map((l) => l.before.utilisation)).toEqual(b2.lifts.map((l) => expect.closeTo(l.utilisation, 9)));
  });

  it('re-analyses every position on the worker thread when the lead changes the analysis options', async () => {
    const before = (await detail(typical.id)).version;
    const r = await s.api('PATCH', `/buildings/${buildingId}`, {
      token,
      body: { options: { bucklingLengths: 'critical' } },
    });
    expect(r.status).toBe(200);
    const d = await detail(typical.id);
    expect(d.version).toBe(before + 1);
    expect(d.results.criticalBuckling).toBeDefined();
    // The same as analysing the stored stack here, on the main thread, with the stored inputs.
    const inputs = await analysisInputs(s.ctx.db, buildingId);
    const row = await loadStackRow(s.ctx.db, typical.id);
    const again = analyse(d.doc, inputs, placeOf(row));
    expect(d.results.positions).toEqual(again.positions);
    expect(d.results.governingPosition).toBe('B/2');
  });

  it('lists each position in the column schedule as rows of one type, with its own utilisation and mass', async () => {
    const r = await s.api('GET', `/buildings/${buildingId}/schedule`, { token });
    expect(r.status).toBe(200);
    const { rows, types } = r.body as ColumnSchedule;
    const own = rows.filter((x) => x.stackId === typical.id && x.stack === 'A/1');
    const at = rows.filter((x) => x.stackId === typical.id && x.stack === 'B/2');
    expect(own.length).toBeGreaterThan(0);
    expect(at.map((x) => [x.lift, x.type, x.section, x.mass])).toEqual(
      own.map((x) => [x.lift, x.type, x.section, x.mass]),
    );
    const b2 = (await detail(typical.id)).results.positions!.find((p) => p.name === 'B/2')!;
    expect(at.map((x) => x.utilisation)).toEqual(b2.lifts.map((l) => l.utilisation));
    expect(types.find((t) => t.type === own[0]!.type)!.stacks).toEqual(expect.arrayContaining(['A/1', 'B/2']));
  });

  it('will not freeze a revision while a further position fails unless that is acknowledged', async () => {
    // Scale every floor so that A/1 passes and B/2 (2.25 times the area) fails: k = 1/√(uA·uB) puts them near
    // √(uA/uB) and √(uB/uA), either side of 1 (utilisation is close to proportional to the load here).
    const now = (await detail(typical.id)).results.positions!;
    const [uA, uB] = [now[0]!.utilisation!, now[1]!.utilisation!];
    const k = 1 / Math.sqrt(uA * uB);
    const scaled = [OFFICE, ROOF].map((b) => ({
      ...b,
      permanent: b.permanent.map((p) => ({ ...p, gk: p.gk * k })),
      imposed: { ...b.imposed, qk: b.imposed.qk * k },
    }));
    await s.api('PUT', `/buildings/${buildingId}/buildups`, { token, body: { buildups: scaled } });
    const checks = (await detail(typical.id)).results.positions!;
    expect(checks.map((p) => [p.name, p.status])).toEqual([
      ['A/1', 'passes'],
      ['B/2', 'fails'],
    ]);
    const refused = await s.api('POST', `/buildings/${buildingId}/revisions`, {
      token,
      body: { note: 'Typical columns', purpose: 'preliminary' },
    });
    expect(refused.status).toBe(422);
    const reasons = (refused.body as { error: { details: { reasons: { stackId: number; stack: string }[] } } }).error
      .details.reasons;
    // The stack is named after its own place, A/1.
    expect(reasons.filter((r) => r.stackId === typical.id).map((r) => r.stack)).toContain('A/1 at B/2');
    const frozen = await s.api('POST', `/buildings/${buildingId}/revisions`, {
      token,
      body: { note: 'Typical column B/2 to be resized', purpose: 'preliminary', acknowledgeFailingLifts: true },
    });
    expect(frozen.status).toBe(201);
    // The package says, for the type, every position's utilisation and whose working it prints.
    const res = await fetch(`${s.url}/api/revisions/${(frozen.body as { id: number }).id}/calc.pdf`, {
      headers: { Authorization: `Bearer ${token}` },
    });
    expect(res.status).toBe(200);
    const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
    let text: string;
    try {
      text = (await parser.getText()).text.replace(/\s+/g, ' ');
    } finally {
      await parser.destroy();
    }
    const b2 = checks[1]!.utilisation!.toFixed(3);
    expect(text).toContain('Typical column at 2 positions');
    expect(text).toContain(`B/2 ${b2} (governs)`);
    // The summary of stacks names the position that governs the type.
    // (its row: name, 2 lifts, no base force of the own place, the governing lift at its position)
    expect(text).toMatch(/A\/1 2 – L\d at B\/2 UKC 203x203x46/);
    // B/2 governs, so its take-down and working are printed too, after the own place's (docs/typical-columns.md).
    const there = text.slice(text.indexOf('Stack A/1 at B/2, the position that governs the type'));
    expect(there.length).toBeLessThan(text.length);
    expect(there).toContain('Member checks at B/2');
    expect(there).toContain(b2);
    // Frozen with the revision: the same engine and inputs give the utilisation the position's check reported.
    const stored = await s.ctx
      .db('revisions')
      .where({ id: (frozen.body as { id: number }).id })
      .first<{ snapshot: string }>('snapshot');
    const snap = (JSON.parse(stored.snapshot) as RevisionSnapshot).stacks.find((x) => x.id === typical.id)!;
    expect(snap.governingWorking?.position).toBe('B/2');
    const working = snap.governingWorking!.results;
    const governingLift = working.lifts.find((l) => l.liftId === working.governingLiftId)!;
    expect(governingLift.utilisation).toBeCloseTo(checks[1]!.utilisation!, 12);
    await s.api('PUT', `/buildings/${buildingId}/buildups`, { token, body: { buildups: [OFFICE, ROOF] } });
  });

  it('frees the crossings of a deleted stack', async () => {
    const spare = await s.api('POST', `/stacks/${other.id}/positions`, { token, body: { gridX: 'C', gridY: 'y2' } });
    expect(spare.status).toBe(201);
    expect((await s.api('DELETE', `/stacks/${other.id}`, { token })).status).toBe(204);
    expect(await s.ctx.db('stack_positions').where({ stack_id: other.id })).toEqual([]);
    const reused = await s.api('PUT', `/stacks/${loose.id}/placement`, { token, body: { gridX: 'C', gridY: 'y2' } });
    expect(reused.status).toBe(200);
  });

  it('takes the position away again: one place, the summary of its own results', async () => {
    const id = (await positionRows())[0].id as number;
    const r = await s.api('DELETE', `/stacks/${typical.id}/positions/${id}`, { token });
    expect(r.status).toBe(200);
    expect(r.body as StackPositionsReply).toMatchObject({ positions: [], results: [], governingPosition: null });
    const d = await detail(typical.id);
    expect(d.results.positions).toBeUndefined();
    const own = d.results.lifts.find((l) => l.liftId === d.results.governingLiftId)!;
    expect((await summary(typical.id)).utilisation).toBeCloseTo(own.utilisation, 12);
  });
});
