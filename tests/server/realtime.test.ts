// Live co-editing over real socket.io-client connections (docs/live-protocol.md).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, Level, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { Op } from '../../shared/schema/ops.ts';
import type { StackEditAck, StackJoinAck } from '../../shared/schema/socket.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { applyOps } from '../../shared/ops/applyOps.ts';
import { addMember, createBuilding, registerUser, startTestServer, storedResults, type TestServer } from './helpers.ts';
import { connect, Editor, next, prng, request, type LiveClient } from './liveHelpers.ts';

let s: TestServer;
let lead: AuthResponse;
let engineers: AuthResponse[];
let viewer: AuthResponse;
let outsider: AuthResponse;
let buildingId: number;

const template = {
  storeys: 6,
  storeyHeight: 3.6,
  spliceEvery: 2,
  sections: ['UKC 254x254x89', 'UKC 203x203x46'],
  Gk: 120,
  Qk: 60,
};

async function newStack(name: string): Promise<number> {
  const r = await s.api('POST', `/buildings/${buildingId}/stacks`, { token: lead.token, body: { name, template } });
  expect(r.status).toBe(201);
  return (r.body as StackSummary).id;
}

async function dbStack(stackId: number): Promise<{ doc: StackDocument; version: number }> {
  const row = await s.ctx.db('stacks').where({ id: stackId }).first<{ doc: string; version: number }>('doc', 'version');
  return { doc: JSON.parse(row.doc) as StackDocument, version: row.version };
}

const open: LiveClient[] = [];
async function client(token: string | null): Promise<LiveClient> {
  const c = await connect(s.url, token);
  open.push(c);
  return c;
}

beforeAll(async () => {
  s = await startTestServer();
  lead = await registerUser(s, 'lead');
  buildingId = (await createBuilding(s, lead.token, 'Live test block')).id;
  engineers = [];
  for (let i = 0; i < 10; i += 1) {
    const e = await registerUser(s, `engineer${i}`);
    await addMember(s, lead.token, buildingId, e.user.email, 'engineer');
    engineers.push(e);
  }
  viewer = await registerUser(s, 'viewer');
  await addMember(s, lead.token, buildingId, viewer.user.email, 'viewer');
  outsider = await registerUser(s, 'outsider');
});

afterAll(async () => {
  for (const c of open) c.close();
  await s?.close();
});

describe('live channel: access', () => {
  it('refuses a connection without a valid token', async () => {
    await expect(connect(s.url, null)).rejects.toThrow(/sign in/i);
    await expect(connect(s.url, 'not-a-token')).rejects.toThrow(/invalid session token/i);
  });

  it('an outsider cannot join a stack (not found, as on the REST routes)', async () => {
    const stackId = await newStack('X/1');
    const c = await client(outsider.token);
    const r = await request<StackJoinAck>(c, 'stack:join', { stackId });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.code).toBe('not_found');
  });

  it('a viewer joins and watches but every edit is refused and the database is unchanged', async () => {
    const stackId = await newStack('V/1');
    const c = await client(viewer.token);
    const joined = await request<StackJoinAck>(c, 'stack:join', { stackId });
    expect(joined.ok).toBe(true);
    if (!joined.ok) return;
    const before = await dbStack(stackId);
    const restraint = joined.data.doc.nodes.find((n) => n.kind === 'restraint');
    const r = await request(c, 'stack:edit', {
      stackId,
      baseVersion: joined.data.version,
      ops: [{ op: 'updateNode', id: restraint!.id, data: { Gk: 999 } }],
    });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.code).toBe('forbidden');
    expect(await dbStack(stackId)).toEqual(before);
  });
});

describe('live channel: edits', () => {
  it('acknowledges an edit only after commit and sends the new results to everyone in the room', async () => {
    const stackId = await newStack('A/1');
    const [a, b] = [await client(engineers[0].token), await client(engineers[1].token)];
    const ja = await request<StackJoinAck>(a, 'stack:join', { stackId });
    await request<StackJoinAck>(b, 'stack:join', { stackId });
    if (!ja.ok) throw new Error('join failed');
    const lift = ja.data.doc.nodes.find((n) => n.kind === 'lift')!;
    const oldUtil = ja.data.results.lifts.find((l) => l.liftId === lift.id)!.utilisation;
    const seen = next(b, 'stack:changed', (p) => p.stackId === stackId);
    const r = await request<{ version: number }>(a, 'stack:edit', {
      stackId,
      baseVersion: ja.data.version,
      ops: [{ op: 'updateNode', id: lift.id, data: { section: 'UKC 152x152x23' } }],
    });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // Committed before the acknowledgement: the database already holds the acknowledged version.
    expect((await dbStack(stackId)).version).toBe(r.data.version);
    const changed = await seen;
    expect(changed.version).toBe(r.data.version);
    expect(changed.by.userId).toBe(engineers[0].user.id);
    const newUtil = changed.results.lifts.find((l) => l.liftId === lift.id)!.utilisation;
    // A much lighter section must carry a higher utilisation.
    expect(newUtil).toBeGreaterThan(oldUtil);
  });

  it('the join answers all the stack page needs: document, results, name, building, role and levels', async () => {
    const stackId = await newStack('J/1');
    const levels = [
      { name: 'Level 1', elevation: 3.6 },
      { name: 'Ground', elevation: 0 },
    ];
    for (const body of levels) {
      const r = await s.api('POST', `/buildings/${buildingId}/levels`, { token: lead.token, body });
      expect(r.status).toBe(201);
    }
    const stored = (await s.api('GET', `/stacks/${stackId}`, { token: lead.token })).body as StackDetail;
    const byViewer = await request<StackJoinAck>(await client(viewer.token), 'stack:join', { stackId });
    const byEngineer = await request<StackJoinAck>(await client(engineers[9].token), 'stack:join', { stackId });
    if (!byViewer.ok || !byEngineer.ok) throw new Error('join failed');
    expect(byViewer.data.doc).toEqual(stored.doc);
    expect(byViewer.data.version).toBe(stored.version);
    expect(byViewer.data.results).toEqual(stored.results);
    expect(byViewer.data.name).toBe('J/1');
    expect(byViewer.data.buildingId).toBe(buildingId);
    expect(byViewer.data.buildingName).toBe('Live test block');
    expect(byViewer.data.role).toBe('viewer');
    expect(byEngineer.data.role).toBe('engineer');
    // Lowest first, as GET /buildings/:id/levels lists them.
    const listed = (await s.api('GET', `/buildings/${buildingId}/levels`, { token: lead.token })).body as Level[];
    expect(byViewer.data.levels).toEqual(listed);
    expect(byViewer.data.levels.map((l) => l.name).slice(0, 2)).toEqual(['Ground', 'Level 1']);
  });

  it("echoes an edit's id in its ack and its stack:changed, and refuses a malformed one", async () => {
    const stackId = await newStack('E/1');
    const [a, b] = [await client(engineers[4].token), await client(engineers[5].token)];
    const ja = await request<StackJoinAck>(a, 'stack:join', { stackId });
    await request<StackJoinAck>(b, 'stack:join', { stackId });
    if (!ja.ok) throw new Error('join failed');
    const node = ja.data.doc.nodes[0];
    const move = (x: number) => [{ op: 'moveNode', id: node.id, position: { x, y: 0 } }];
    for (const editId of ['', 'has space', 'x'.repeat(65), 42]) {
      const r = await request(a, 'stack:edit', { stackId, baseVersion: ja.data.version, ops: move(1), editId });
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error.code).toBe('validation_failed');
    }
    expect((await dbStack(stackId)).version).toBe(ja.data.version);
    const seenByA = next(a, 'stack:changed', (p) => p.stackId === stackId);
    const seenByB = next(b, 'stack:changed', (p) => p.stackId === stackId);
    const r = await request<StackEditAck>(a, 'stack:edit', {
      stackId,
      baseVersion: ja.data.version,
      ops: move(2),
      editId: 'mr1a2b-7-q9z8y7x6',
    });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.data).toEqual({ version: ja.data.version + 1, editId: 'mr1a2b-7-q9z8y7x6' });
    expect((await seenByA).editId).toBe('mr1a2b-7-q9z8y7x6');
    expect((await seenByB).editId).toBe('mr1a2b-7-q9z8y7x6');
    // An edit without an id (an older client) is answered as before, with no id in the broadcast.
    const plain = next(b, 'stack:changed', (p) => p.stackId === stackId && p.version === ja.data.version + 2);
    const r2 = await request<StackEditAck>(a, 'stack:edit', { stackId, baseVersion: r.data.version, ops: move(3) });
    if (!r2.ok) throw new Error(r2.error.message);
    expect(r2.data).toEqual({ version: ja.data.version + 2 });
    expect('editId' in (await plain)).toBe(false);
  });

  it('refuses malformed payloads with the error shape and leaves the room undisturbed', async () => {
    const stackId = await newStack('M/1');
    const [a, b] = [await client(engineers[2].token), await client(engineers[3].token)];
    const ja = await request<StackJoinAck>(a, 'stack:join', { stackId });
    await request<StackJoinAck>(b, 'stack:join', { stackId });
    if (!ja.ok) throw new Error('join failed');
    const before = await dbStack(stackId);
    let changes = 0;
    b.on('stack:changed', () => (changes += 1));
    const bad: unknown[] = [
      null,
      'text',
      [],
      { stackId: 'one', baseVersion: 0, ops: [] },
      { stackId, baseVersion: -1, ops: [{ op: 'moveNode', id: 'x', position: { x: 0, y: 0 } }] },
      { stackId, baseVersion: before.version, ops: [] },
      { stackId, baseVersion: before.version, ops: [{ op: 'explode', id: 'x' }] },
      {
        stackId,
        baseVersion: before.version,
        ops: [{ op: 'updateNode', id: ja.data.doc.nodes[0].id, data: { elevation: 'NaN' } }],
      },
      { stackId, baseVersion: before.version, ops: [{ op: 'removeNode', id: 'no-such-node' }] },
      {
        stackId,
        baseVersion: before.version,
        ops: [{ op: 'moveNode', id: ja.data.doc.nodes[0].id, position: { x: Infinity, y: 0 } }],
      },
      { stackId, baseVersion: before.version, ops: [{ op: 'addEdge', edge: { id: 'e', source: 'a' } }], extra: true },
    ];
    for (const payload of bad) {
      const r = await request(a, 'stack:edit', payload);
      expect(r.ok).toBe(false);
      if (!r.ok) {
        expect(['validation_failed', 'unprocessable', 'bad_request']).toContain(r.error.code);
        expect(r.error.message.length).toBeGreaterThan(0);
      }
    }
    const badJoin = await request(a, 'stack:join', { stackId: -4 });
    expect(badJoin.ok).toBe(false);
    expect(await dbStack(stackId)).toEqual(before);
    // The connection and the room still work.
    const node = ja.data.doc.nodes[0];
    const ok = await request<{ version: number }>(a, 'stack:edit', {
      stackId,
      baseVersion: before.version,
      ops: [{ op: 'moveNode', id: node.id, position: { x: 5, y: 5 } }],
    });
    expect(ok.ok).toBe(true);
    await next(b, 'stack:changed', (p) => p.stackId === stackId);
    expect(changes).toBe(1);
  });

  it('merges an edit on an older version when it touches other nodes, and refuses one that clashes', async () => {
    const stackId = await newStack('C/1');
    const [a, b] = [await client(engineers[4].token), await client(engineers[5].token)];
    const ja = await request<StackJoinAck>(a, 'stack:join', { stackId });
    const jb = await request<StackJoinAck>(b, 'stack:join', { stackId });
    if (!ja.ok || !jb.ok) throw new Error('join failed');
    const [r1, r2] = ja.data.doc.nodes.filter((n) => n.kind === 'restraint');
    const base = ja.data.version;
    const first = await request<{ version: number }>(a, 'stack:edit', {
      stackId,
      baseVersion: base,
      ops: [{ op: 'updateNode', id: r1.id, data: { Gk: 150 } }],
    });
    expect(first.ok).toBe(true);
    const merged = await request<{ version: number }>(b, 'stack:edit', {
      stackId,
      baseVersion: base,
      ops: [{ op: 'updateNode', id: r2.id, data: { Qk: 80 } }],
    });
    expect(merged.ok).toBe(true);
    const clash = await request(b, 'stack:edit', {
      stackId,
      baseVersion: base,
      ops: [{ op: 'updateNode', id: r1.id, data: { Gk: 10 } }],
    });
    expect(clash.ok).toBe(false);
    if (!clash.ok) expect(clash.error.code).toBe('conflict');
    const { doc } = await dbStack(stackId);
    const byId = new Map(doc.nodes.map((n) => [n.id, n]));
    expect(byId.get(r1.id)?.data).toMatchObject({ Gk: 150 });
    expect(byId.get(r2.id)?.data).toMatchObject({ Qk: 80 });
  });
});

describe('live channel: random concurrent edits', () => {
  for (const [clients, seed] of [
    [2, 11],
    [5, 23],
    [10, 37],
  ] as const) {
    it(`${clients} clients converge to the database's document and no acknowledged edit is lost`, async () => {
      const stackId = await newStack(`R/${clients}`);
      const initial = await dbStack(stackId);
      const editors: Editor[] = [];
      for (let i = 0; i < clients; i += 1) {
        const e = new Editor(`c${i}`, await client(engineers[i].token), stackId, prng(seed + i));
        await e.join();
        editors.push(e);
      }
      await Promise.all(
        editors.map(async (e) => {
          for (let k = 0; k < 8; k += 1) await e.edit();
        }),
      );
      const final = await dbStack(stackId);
      // Every client catches up to the database's version through stack:changed alone.
      const deadline = Date.now() + 5000;
      while (editors.some((e) => e.version < final.version) && Date.now() < deadline)
        await new Promise((r) => setTimeout(r, 20));
      for (const e of editors) {
        expect(e.version).toBe(final.version);
        expect(e.doc).toEqual(final.doc);
      }
      // Every acknowledged edit is stored at its version with exactly its ops…
      const rows = await s.ctx
        .db('stack_ops')
        .where({ stack_id: stackId })
        .orderBy('version')
        .select<{ version: number; ops: string }[]>('version', 'ops');
      const stored = new Map(rows.map((r) => [r.version, JSON.parse(r.ops) as Op[]]));
      const acked = editors.flatMap((e) => e.acked);
      expect(acked.length).toBeGreaterThan(0);
      for (const a of acked) expect(stored.get(a.version)).toEqual(a.ops);
      // …and the stored document is exactly the initial one with every committed edit replayed in order.
      let replay = initial.doc;
      for (const r of rows.filter((r) => r.version > initial.version))
        replay = applyOps(replay, JSON.parse(r.ops) as Op[]);
      expect(replay).toEqual(final.doc);
      expect(final.version - initial.version).toBe(acked.length);
    });
  }
});

describe('live channel: presence and reconnection', () => {
  it('shows who is in the stack and what each has selected', async () => {
    const stackId = await newStack('P/1');
    const a = await client(engineers[6].token);
    await request(a, 'stack:join', { stackId });
    const b = await client(engineers[7].token);
    const both = next(a, 'presence', (p) => p.stackId === stackId && p.users.length === 2);
    const jb = await request<StackJoinAck>(b, 'stack:join', { stackId });
    expect((await both).users.map((u) => u.userId).sort()).toEqual([engineers[6].user.id, engineers[7].user.id].sort());
    if (!jb.ok) return;
    const nodeId = jb.data.doc.nodes[1].id;
    const selected = next(a, 'presence', (p) => p.users.some((u) => u.selection.includes(nodeId)));
    await request(b, 'stack:select', { stackId, nodeIds: [nodeId] });
    expect((await selected).users.find((u) => u.userId === engineers[7].user.id)?.selection).toEqual([nodeId]);
    const gone = next(a, 'presence', (p) => p.stackId === stackId && p.users.length === 1);
    b.close();
    expect((await gone).users[0].userId).toBe(engineers[6].user.id);
  });

  it('a client that drops and returns catches up from its last version', async () => {
    const stackId = await newStack('R/back');
    const a = await client(engineers[8].token);
    const ja = await request<StackJoinAck>(a, 'stack:join', { stackId });
    if (!ja.ok) throw new Error('join failed');
    const lastVersion = ja.data.version;
    a.close();
    const b = await client(engineers[9].token);
    const jb = await request<StackJoinAck>(b, 'stack:join', { stackId });
    if (!jb.ok) throw new Error('join failed');
    const restraint = jb.data.doc.nodes.find((n) => n.kind === 'restraint')!;
    await request(b, 'stack:edit', {
      stackId,
      baseVersion: jb.data.version,
      ops: [{ op: 'updateNode', id: restraint.id, data: { Gk: 321 } }],
    });
    // Back online: the ops since its last version bring it to the server's document.
    const back = await client(engineers[8].token);
    const since = await s.api('GET', `/stacks/${stackId}/ops?since=${lastVersion}`, { token: engineers[8].token });
    expect(since.status).toBe(200);
    let doc = ja.data.doc;
    for (const c of since.body as { ops: Op[] }[]) doc = applyOps(doc, c.ops);
    const rejoin = await request<StackJoinAck>(back, 'stack:join', { stackId });
    if (!rejoin.ok) throw new Error('rejoin failed');
    expect(doc).toEqual(rejoin.data.doc);
    expect(rejoin.data.version).toBe(lastVersion + 1);
  });

  it("the building room hears each stack's new governing utilisation", async () => {
    const stackId = await newStack('B/1');
    const a = await client(engineers[0].token);
    expect((await request(a, 'building:join', { buildingId })).ok).toBe(true);
    const o = await client(outsider.token);
    const refused = await request(o, 'building:join', { buildingId });
    expect(refused.ok).toBe(false);
    const heard = next(a, 'building:stack-changed', (p) => p.stackId === stackId);
    const { version, doc } = await dbStack(stackId);
    const restraint = doc.nodes.find((n) => n.kind === 'restraint')!;
    const r = await s.api('POST', `/stacks/${stackId}/ops`, {
      token: engineers[0].token,
      body: { baseVersion: version, ops: [{ op: 'updateNode', id: restraint.id, data: { Gk: 400 } }] },
    });
    expect(r.status).toBe(200);
    const p = await heard;
    expect(p.version).toBe(version + 1);
    expect(p.utilisation).toBeGreaterThan(0);
    // The building's table names the governing lift as engineers do, with its section, from the same results.
    const stored = await storedResults(s.ctx.db, stackId);
    const governing = stored.lifts.find((l) => l.liftId === stored.governingLiftId)!;
    expect(p.governingLiftId).toBe(governing.liftId);
    expect(p.governingLiftLabel).toMatch(/^L\d+$/);
    expect(p.governingLiftLabel).toBe(governing.label);
    expect(p.governingSection).toBe(governing.section);
  });
});
