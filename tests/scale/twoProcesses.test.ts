// docs/live-protocol.md §Several processes: two server processes on PostgreSQL sharing live rooms through Redis.
// Clients are spread across both; random concurrent edits converge with nothing lost. Runs only when
// TEST_DATABASE_URL and TEST_REDIS_URL are set (scripts/testScale.ts); each run has its own schema and key prefix.
import knex, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, Building, StackSummary } from '../../shared/schema/api.ts';
import type { Op } from '../../shared/schema/ops.ts';
import type { StackJoinAck } from '../../shared/schema/socket.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { applyOps } from '../../shared/ops/applyOps.ts';
import { connect, Editor, next, prng, request, type LiveClient } from '../server/liveHelpers.ts';
import { dropSchema } from '../server/helpers.ts';
import {
  api,
  databaseUrl,
  newTag,
  scaleEnv,
  scaleReady,
  signUp,
  startProcess,
  stopProcess,
  type Proc,
} from './procs.ts';

const describeScale = scaleReady ? describe : describe.skip;

describeScale('two server processes on PostgreSQL and Redis', () => {
  const tag = newTag();
  const env = scaleEnv(tag, { REGISTER_RATE_LIMIT: '10000' });
  let a: Proc;
  let b: Proc;
  let db: Knex;
  const sockets: LiveClient[] = [];
  let lead: AuthResponse;
  const engineers: AuthResponse[] = [];
  let buildingId: number;

  beforeAll(async () => {
    a = await startProcess(env);
    b = await startProcess(env);
    db = knex({ client: 'pg', connection: databaseUrl!, searchPath: [tag], pool: { min: 0, max: 2 } });
    // Registered, verified through the link the SMTP fake stored, then signed in (docs/access.md).
    const reg = (url: string, name: string) => signUp(url, db, `${name}-${tag}@example.test`, name);
    lead = await reg(a.url, 'lead');
    buildingId = (await api<Building>(b.url, 'POST', '/buildings', lead.token, { name: 'Scale test block' })).body.id;
    for (let i = 0; i < 6; i += 1) {
      const e = await reg(i % 2 ? a.url : b.url, `engineer${i}`);
      expect(
        (
          await api(a.url, 'POST', `/buildings/${buildingId}/members`, lead.token, {
            email: e.user.email,
            role: 'engineer',
          })
        ).status,
      ).toBe(201);
      engineers.push(e);
    }
  });

  afterAll(async () => {
    for (const s of sockets) s.close();
    await stopProcess(a);
    await stopProcess(b);
    await db?.destroy();
    if (databaseUrl) await dropSchema(databaseUrl, tag);
  });

  async function newStack(name: string): Promise<number> {
    const template = {
      storeys: 6,
      storeyHeight: 3.6,
      spliceEvery: 2,
      sections: ['UKC 254x254x89', 'UKC 203x203x46'],
      Gk: 120,
      Qk: 60,
    };
    const r = await api<StackSummary>(a.url, 'POST', `/buildings/${buildingId}/stacks`, lead.token, { name, template });
    expect(r.status).toBe(201);
    return r.body.id;
  }

  it('an edit on one process reaches a client of the other, and presence spans both', async () => {
    const stackId = await newStack('S/1');
    const onA = await connect(a.url, engineers[0].token);
    const onB = await connect(b.url, engineers[1].token);
    sockets.push(onA, onB);
    const ja = await request<StackJoinAck>(onA, 'stack:join', { stackId });
    const bothPresent = next(onA, 'presence', (p) => p.users.length === 2, 5000);
    await request<StackJoinAck>(onB, 'stack:join', { stackId });
    expect((await bothPresent).users.map((u) => u.userId).sort()).toEqual(
      [engineers[0].user.id, engineers[1].user.id].sort(),
    );
    if (!ja.ok) throw new Error(ja.error.message);
    const heard = next(onB, 'stack:changed', (p) => p.stackId === stackId);
    const restraint = ja.data.doc.nodes.find((n) => n.kind === 'restraint')!;
    const r = await request<{ version: number }>(onA, 'stack:edit', {
      stackId,
      baseVersion: ja.data.version,
      ops: [{ op: 'updateNode', id: restraint.id, data: { Gk: 222 } }],
    });
    expect(r.ok).toBe(true);
    expect((await heard).by.userId).toBe(engineers[0].user.id);
  });

  it('random concurrent edits from clients on both processes converge, and every acknowledged edit is kept', async () => {
    const stackId = await newStack('S/2');
    const initial = await db('stacks').where({ id: stackId }).first<{ doc: string; version: number }>('doc', 'version');
    const editors: Editor[] = [];
    for (let i = 0; i < 6; i += 1) {
      const socket = await connect(i % 2 ? a.url : b.url, engineers[i].token);
      sockets.push(socket);
      const e = new Editor(`p${i}`, socket, stackId, prng(101 + i));
      await e.join();
      editors.push(e);
    }
    await Promise.all(
      editors.map(async (e) => {
        for (let k = 0; k < 10; k += 1) await e.edit();
      }),
    );
    const final = await db('stacks').where({ id: stackId }).first<{ doc: string; version: number }>('doc', 'version');
    const finalDoc = JSON.parse(final.doc) as StackDocument;
    const deadline = Date.now() + 8000;
    while (editors.some((e) => e.version < final.version) && Date.now() < deadline)
      await new Promise((r) => setTimeout(r, 25));
    for (const e of editors) {
      expect(e.version).toBe(final.version);
      expect(e.doc).toEqual(finalDoc);
    }
    const rows = await db('stack_ops')
      .where({ stack_id: stackId })
      .orderBy('version')
      .select<{ version: number; ops: string }[]>('version', 'ops');
    const stored = new Map(rows.map((r) => [r.version, JSON.parse(r.ops) as Op[]]));
    const acked = editors.flatMap((e) => e.acked);
    for (const x of acked) expect(stored.get(x.version)).toEqual(x.ops);
    expect(final.version - initial.version).toBe(acked.length);
    let replay = JSON.parse(initial.doc) as StackDocument;
    for (const r of rows.filter((r) => r.version > initial.version))
      replay = applyOps(replay, JSON.parse(r.ops) as Op[]);
    expect(replay).toEqual(finalDoc);
    // Versions are unique per stack: no two processes committed on the same base version.
    expect(new Set(rows.map((r) => r.version)).size).toBe(rows.length);
  });
});
