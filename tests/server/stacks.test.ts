import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { migrationSource } from '../../migrations/index.ts';
import { sweepResults } from '../../server/services/stackRows.ts';
import {
  addMember,
  errorCode,
  registerUser,
  replaceStoredResults,
  startWithLeadAndBuilding,
  storedResults,
  type TestServer,
} from './helpers.ts';

const template = {
  storeys: 4,
  storeyHeight: 3.6,
  spliceEvery: 2,
  sections: ['UKC 254x254x89', 'UKC 203x203x46'],
  Gk: 120,
  Qk: 60,
};

describe('stacks', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding());
  });
  afterAll(async () => {
    await s?.close();
  });

  const create = async (body: object) => {
    const r = await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body });
    expect(r.status).toBe(201);
    return r.body as StackSummary;
  };
  const get = async (id: number) => (await s.api('GET', `/stacks/${id}`, { token })).body as StackDetail;

  it('creates a stack from a template with results and reads it back as { id, name, doc, version, results }', async () => {
    const sum = await create({ name: 'B/2', template });
    expect(sum).toMatchObject({ name: 'B/2', version: 0, liftCount: 2, status: 'passes', buildingId });
    const d = await get(sum.id);
    expect(Object.keys(d).sort()).toEqual(['buildingId', 'doc', 'id', 'name', 'results', 'version']);
    expect(d.results.errors).toEqual([]);
    expect(d.results.lifts.map((l) => l.section)).toEqual(['UKC 254x254x89', 'UKC 203x203x46']);
    expect(sum.utilisation).toBe(Math.max(...d.results.lifts.map((l) => l.utilisation)));
    const governing = d.results.lifts.find((l) => l.liftId === d.results.governingLiftId)!;
    expect(sum).toMatchObject({
      governingLiftId: governing.liftId,
      governingLiftLabel: governing.label,
      governingSection: governing.section,
    });
  });

  it('creates a stack with beam reactions on every floor and the roof, and checks their nominal moments', async () => {
    const faces = { yPlus: { Gk: 40, Qk: 25 } };
    const sum = await create({ name: 'F/1', template: { ...template, faces, roofFaces: faces } });
    const d = await get(sum.id);
    const faced = d.doc.nodes.filter((n) => (n.kind === 'restraint' || n.kind === 'cap') && n.data.faces);
    expect(faced).toHaveLength(4);
    expect(d.results.lifts.every((l) => l.pieces.every((p) => p.combined?.combination))).toBe(true);
    const bad = await s.api('POST', `/buildings/${buildingId}/stacks`, {
      token,
      body: { name: 'F/2', template: { ...template, roofFaces: { up: { Gk: 1, Qk: 0 } } } },
    });
    expect(bad.status).toBe(400);
  });

  it('fills the governing lift label of stacks stored before the column existed when migrating up', async () => {
    const sum = await create({ name: 'M/1', template });
    // Stacks stored then held their results as JSON text (results are packed since 202612040750).
    for (const { id } of await s.ctx.db('stacks').select<{ id: number }[]>('id'))
      await replaceStoredResults(s.ctx.db, id, await storedResults(s.ctx.db, id), 'text');
    // By name: later migrations must stay in place.
    const migrationConfig = { migrationSource, name: '202612020900_add_stack_governing_label' };
    await s.ctx.db.migrate.down(migrationConfig);
    expect(await s.ctx.db.schema.hasColumn('stacks', 'governing_lift_label')).toBe(false);
    await s.ctx.db.migrate.latest(migrationConfig);
    const listed = (await s.api('GET', `/buildings/${buildingId}/stacks`, { token })).body as StackSummary[];
    expect(listed.find((x) => x.id === sum.id)?.governingLiftLabel).toBe(sum.governingLiftLabel);
    expect(sum.governingLiftLabel).toMatch(/^L\d+$/);
  });

  it('creates an empty stack, and saves an invalid document with its errors instead of results', async () => {
    const empty = await create({ name: 'E/1' });
    expect((await get(empty.id)).doc).toEqual({ nodes: [], edges: [] });
    const doc: StackDocument = {
      nodes: [{ id: 'L1', kind: 'lift', data: { section: 'UKC 203x203x46', grade: 'S355' } }],
      edges: [],
    };
    const bad = await create({ name: 'E/2', doc });
    expect(bad.status).toBe('errors');
    expect(bad.utilisation).toBeNull();
    expect((await get(bad.id)).results.errors.length).toBeGreaterThan(0);
  });

  it('refuses a document that uses one id twice with 422', async () => {
    const doc = {
      nodes: [{ id: 'X', kind: 'splice', data: { elevation: 1 } }],
      edges: [{ id: 'X', source: 'X', target: 'X' }],
    };
    const r = await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name: 'Dup', doc } });
    expect(r.status).toBe(422);
  });

  it('serves stored results on read without recomputing them, packed or as text stored before', async () => {
    const sum = await create({ name: 'R/1', template });
    const row = await s.ctx.db('stacks').where({ id: sum.id }).first<{ results: string; results_hash: string }>();
    // New versions are stored packed, by the digest of their JSON (docs/contracts.md §Stored results).
    expect(row.results).toBe('');
    expect(row.results_hash).toMatch(/^[0-9a-f]{64}$/);
    const stored = await storedResults(s.ctx.db, sum.id);
    // A marker only the stored copy can carry: were the read to recompute, it would vanish.
    stored.warnings.push({ message: 'stored-marker' });
    await replaceStoredResults(s.ctx.db, sum.id, stored);
    expect((await get(sum.id)).results.warnings.map((w) => w.message)).toContain('stored-marker');
    // A row stored before results were packed holds JSON text and names no packed results: read as it is.
    stored.warnings.push({ message: 'text-marker' });
    await replaceStoredResults(s.ctx.db, sum.id, stored, 'text');
    expect((await get(sum.id)).results.warnings.map((w) => w.message)).toContain('text-marker');
  });

  it('stores the same results once, and removes results no stack names an hour after they were last taken', async () => {
    // Two stacks from one template with the same loads: the engine gives the same results, stored once.
    const [a, b] = [await create({ name: 'D/1', template }), await create({ name: 'D/2', template })];
    const refs = await s.ctx
      .db('stacks')
      .whereIn('id', [a.id, b.id])
      .orderBy('id')
      .select<{ results_hash: string }[]>('results_hash');
    expect(refs[0].results_hash).toBe(refs[1].results_hash);
    const held = () => s.ctx.db('stack_results').where({ hash: refs[0].results_hash }).first();
    expect(await held()).toBeDefined();
    // Once D/1 changes and D/2 is deleted, no stack names them; the sweep keeps them an hour (docs/contracts.md).
    const lift = (await get(a.id)).doc.nodes.find((n) => n.kind === 'lift')!;
    const edited = await s.api('POST', `/stacks/${a.id}/ops`, {
      token,
      body: { baseVersion: 0, ops: [{ op: 'updateNode', id: lift.id, data: { section: 'UKC 254x254x73' } }] },
    });
    expect(edited.status).toBe(200);
    expect((await s.api('DELETE', `/stacks/${b.id}`, { token })).status).toBe(204);
    expect(await sweepResults(s.ctx.db)).toBe(0);
    expect(await held()).toBeDefined();
    const later = Date.now() + 61 * 60 * 1000;
    expect(await sweepResults(s.ctx.db, later)).toBeGreaterThanOrEqual(1);
    expect(await held()).toBeUndefined();
    // Every stack still reads its results: the sweep took only what nobody names.
    expect((await get(a.id)).results.lifts[0].section).toBe('UKC 254x254x73');
    const named = await s.ctx.db('stacks').whereNotNull('results_hash').select<{ id: number }[]>('id');
    for (const { id } of named) expect((await get(id)).results.lifts.length).toBeGreaterThanOrEqual(0);
    const dangling = await s.ctx
      .db('stacks')
      .leftJoin('stack_results', 'stack_results.hash', 'stacks.results_hash')
      .whereNotNull('stacks.results_hash')
      .whereNull('stack_results.hash')
      .count<{ n: number }[]>({ n: '*' });
    expect(Number(dangling[0].n)).toBe(0);
  });

  it('writes a whole document with PUT on the current version, and refuses a stale one with 409', async () => {
    const sum = await create({ name: 'P/1', template });
    const d0 = await get(sum.id);
    const doc = structuredClone(d0.doc);
    const lift = doc.nodes.find((n) => n.id === 'lift-2');
    if (lift?.kind === 'lift') lift.data.section = 'UKC 254x254x73';
    const ok = await s.api('PUT', `/stacks/${sum.id}`, { token, body: { doc, baseVersion: 0 } });
    expect(ok.status).toBe(200);
    expect((ok.body as StackDetail).version).toBe(1);
    expect((ok.body as StackDetail).results.lifts[1].section).toBe('UKC 254x254x73');
    const stale = await s.api('PUT', `/stacks/${sum.id}`, { token, body: { doc: d0.doc, baseVersion: 0 } });
    expect(stale.status).toBe(409);
    expect(errorCode(stale.body)).toBe('conflict');
    const ops = (await s.api('GET', `/stacks/${sum.id}/ops?since=0`, { token })).body as {
      version: number;
      ops: unknown[];
    }[];
    expect(ops).toEqual([
      expect.objectContaining({
        version: 1,
        ops: [{ op: 'updateNode', id: 'lift-2', data: { section: 'UKC 254x254x73', grade: 'S355' } }],
      }),
    ]);
  });

  it('two PUTs on the same baseVersion: exactly one wins, the other gets 409, and the winner is what is stored', async () => {
    const sum = await create({ name: 'P/2', template });
    const base = await get(sum.id);
    const variant = (section: string) => {
      const doc = structuredClone(base.doc);
      const lift = doc.nodes.find((n) => n.id === 'lift-1');
      if (lift?.kind === 'lift') lift.data.section = section;
      return doc;
    };
    const [a, b] = await Promise.all([
      s.api('PUT', `/stacks/${sum.id}`, { token, body: { doc: variant('UKC 305x305x118'), baseVersion: 0 } }),
      s.api('PUT', `/stacks/${sum.id}`, { token, body: { doc: variant('UKC 305x305x97'), baseVersion: 0 } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const winner = (a.status === 200 ? a : b).body as StackDetail;
    const now = await get(sum.id);
    expect(now.version).toBe(1);
    expect(now.doc).toEqual(winner.doc);
  });

  it('two op lists on the same baseVersion touching the same node: one wins, the other gets 409', async () => {
    const sum = await create({ name: 'O/1', template });
    const edit = (Gk: number) =>
      s.api('POST', `/stacks/${sum.id}/ops`, {
        token,
        body: { baseVersion: 0, ops: [{ op: 'updateNode', id: 'restraint-1', data: { Gk } }] },
      });
    const [a, b] = await Promise.all([edit(200), edit(300)]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const d = await get(sum.id);
    const r = d.doc.nodes.find((n) => n.id === 'restraint-1');
    expect(r?.kind === 'restraint' && r.data.Gk).toBe(a.status === 200 ? 200 : 300);
  });

  it('two op lists on the same baseVersion touching different nodes: both are applied and nothing is lost', async () => {
    const sum = await create({ name: 'O/2', template });
    const edit = (id: string, Gk: number) =>
      s.api('POST', `/stacks/${sum.id}/ops`, {
        token,
        body: { baseVersion: 0, ops: [{ op: 'updateNode', id, data: { Gk } }] },
      });
    const [a, b] = await Promise.all([edit('restraint-1', 210), edit('restraint-2', 220)]);
    expect([a.status, b.status]).toEqual([200, 200]);
    const d = await get(sum.id);
    expect(d.version).toBe(2);
    const gk = (id: string) => {
      const n = d.doc.nodes.find((x) => x.id === id);
      return n?.kind === 'restraint' ? n.data.Gk : null;
    };
    expect([gk('restraint-1'), gk('restraint-2')]).toEqual([210, 220]);
  });

  it('refuses an edit whose base version conflicts with a removal of the same node', async () => {
    const sum = await create({ name: 'O/3', template });
    await s.api('POST', `/stacks/${sum.id}/ops`, {
      token,
      body: { baseVersion: 0, ops: [{ op: 'removeNode', id: 'restraint-1' }] },
    });
    const r = await s.api('POST', `/stacks/${sum.id}/ops`, {
      token,
      body: { baseVersion: 0, ops: [{ op: 'moveNode', id: 'restraint-1', position: { x: 1, y: 2 } }] },
    });
    expect(r.status).toBe(409);
  });

  it('answers 422 naming the op and the id when an op cannot be applied', async () => {
    const sum = await create({ name: 'O/4', template });
    const r = await s.api('POST', `/stacks/${sum.id}/ops`, {
      token,
      body: {
        baseVersion: 0,
        ops: [
          { op: 'moveNode', id: 'lift-1', position: { x: 0, y: 0 } },
          { op: 'updateNode', id: 'ghost', data: { Gk: 1 } },
        ],
      },
    });
    expect(r.status).toBe(422);
    expect(r.body).toMatchObject({ error: { code: 'unprocessable', details: { opIndex: 1, id: 'ghost' } } });
    const neg = await s.api('POST', `/stacks/${sum.id}/ops`, {
      token,
      body: { baseVersion: 0, ops: [{ op: 'updateNode', id: 'restraint-1', data: { Gk: -5 } }] },
    });
    expect(neg.status).toBe(422);
    expect((await get(sum.id)).version).toBe(0);
  });

  it('renames (engineer) and deletes (lead only) a stack, with an audit row for each write', async () => {
    const eng = await registerUser(s, 'eng');
    await addMember(s, token, buildingId, eng.user.email, 'engineer');
    const sum = await create({ name: 'Z/9', template });
    const renamed = await s.api('PATCH', `/stacks/${sum.id}`, { token: eng.token, body: { name: 'Z/10' } });
    expect((renamed.body as StackSummary).name).toBe('Z/10');
    expect((await s.api('DELETE', `/stacks/${sum.id}`, { token: eng.token })).status).toBe(403);
    expect((await s.api('DELETE', `/stacks/${sum.id}`, { token })).status).toBe(204);
    expect((await s.api('GET', `/stacks/${sum.id}`, { token })).status).toBe(404);
    const actions = (
      await s.ctx.db('audit_log').where({ stack_id: sum.id }).orderBy('id').select<{ action: string }[]>('action')
    ).map((r) => r.action);
    expect(actions).toEqual(['stack.create', 'stack.rename', 'stack.delete']);
  });

  it('refuses a second stack of one grid reference, in any letter case (409), by create or rename, storing nothing', async () => {
    const first = await create({ name: 'Q/1', template });
    const count = async () =>
      ((await s.api('GET', `/buildings/${buildingId}/stacks`, { token })).body as StackSummary[]).length;
    const before = await count();
    const again = await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name: 'q/1', template } });
    expect(again.status).toBe(409);
    expect(errorCode(again.body)).toBe('conflict');
    expect(await count()).toBe(before);
    const other = await create({ name: 'Q/2' });
    const renamed = await s.api('PATCH', `/stacks/${other.id}`, { token, body: { name: 'Q/1' } });
    expect(renamed.status).toBe(409);
    expect((await get(other.id)).name).toBe('Q/2');
    expect((await s.api('PATCH', `/stacks/${first.id}`, { token, body: { name: 'q/1' } })).status).toBe(200);
  });

  it('says which template field is wrong when the floors are given neither way or both ways', async () => {
    const refuse = async (t: object) => {
      const r = await s.api('POST', `/buildings/${buildingId}/stacks`, {
        token,
        body: { name: 'W/1', template: { sections: ['UKC 203x203x46'], ...t } },
      });
      expect(r.status).toBe(400);
      expect(errorCode(r.body)).toBe('validation_failed');
      return (r.body as { error: { message: string } }).error.message;
    };
    expect(await refuse({})).toBe('Invalid input (template.storeys: is required (or give elevations instead))');
    expect(await refuse({ elevations: [0, 4, 8], storeyHeight: 4 })).toBe(
      'Invalid input (template.storeyHeight: must be left out when elevations are given)',
    );
    expect(await refuse({ elevations: [0, 4, 3.9] })).toContain('template.elevations.2: must rise from floor to floor');
  });

  it('finds catalogue sections for the picker with their nominal mass', async () => {
    const r = await s.api('GET', '/sections?q=UKC%20203x203&limit=10', { token });
    const hits = r.body as { designation: string; series: string; massPerMetre: number }[];
    // BS 4-1: the designation's last number is the nominal mass in kg/m.
    expect(hits.find((h) => h.designation === 'UKC 203x203x46')?.massPerMetre).toBeCloseTo(46, 0);
    const shs = (await s.api('GET', '/sections?q=&series=SHS&limit=5', { token })).body as { series: string }[];
    expect(shs.length).toBe(5);
    expect(shs.every((h) => h.series === 'SHS')).toBe(true);
  });
});
