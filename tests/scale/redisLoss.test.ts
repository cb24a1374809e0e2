// Losing Redis (docs/faults.md): two server processes on PostgreSQL share rooms through a Redis of
// this suite's own, which is killed and restarted while edits and sign-ins go on. No process ends,
// every acknowledged edit is stored, sign-in answers 503 quickly meanwhile, and live updates cross
// processes again once Redis is back. A process started with Redis unreachable serves degraded.
import knex, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, Building, StackSummary } from '../../shared/schema/api.ts';
import type { Op } from '../../shared/schema/ops.ts';
import type { StackJoinAck } from '../../shared/schema/socket.ts';
import { dropSchema } from '../server/helpers.ts';
import { connect, next, request, type LiveClient } from '../server/liveHelpers.ts';
import {
  api,
  databaseUrl,
  eventually,
  freePort,
  newTag,
  PASSWORD,
  signUp,
  OwnRedis,
  scaleEnv,
  scaleReady,
  sleep,
  startProcess,
  stopProcess,
  type Proc,
} from './procs.ts';

const describeScale = scaleReady ? describe : describe.skip;

describeScale('losing Redis under two server processes', () => {
  const tag = newTag();
  let redis: OwnRedis;
  let env: NodeJS.ProcessEnv;
  let a: Proc;
  let b: Proc;
  let db: Knex;
  const sockets: LiveClient[] = [];
  let lead: AuthResponse;

  beforeAll(async () => {
    redis = new OwnRedis(await freePort());
    await redis.start();
    env = scaleEnv(tag, { REDIS_URL: redis.url });
    a = await startProcess(env);
    b = await startProcess(env);
    db = knex({ client: 'pg', connection: databaseUrl!, searchPath: [tag], pool: { min: 0, max: 2 } });
    lead = await signUp(a.url, db, `lead-${tag}@example.test`, 'Lead');
  });

  afterAll(async () => {
    for (const s of sockets) s.close();
    await stopProcess(a);
    await stopProcess(b);
    await redis?.kill();
    await db?.destroy();
    if (databaseUrl) await dropSchema(databaseUrl, tag);
  });

  it('keeps both processes serving while Redis is killed and restarted, and live updates resume', async () => {
    const building = (await api<Building>(a.url, 'POST', '/buildings', lead.token, { name: 'Redis loss block' })).body;
    const template = {
      storeys: 4,
      storeyHeight: 3.6,
      spliceEvery: 2,
      sections: ['UKC 254x254x89', 'UKC 203x203x46'],
      Gk: 120,
      Qk: 60,
    };
    const stack = (
      await api<StackSummary>(a.url, 'POST', `/buildings/${building.id}/stacks`, lead.token, { name: 'R/1', template })
    ).body;
    const onA = await connect(a.url, lead.token);
    const onB = await connect(b.url, lead.token);
    sockets.push(onA, onB);
    const joinA = await request<StackJoinAck>(onA, 'stack:join', { stackId: stack.id });
    await request<StackJoinAck>(onB, 'stack:join', { stackId: stack.id });
    if (!joinA.ok) throw new Error(joinA.error.message);
    const restraints = joinA.data.doc.nodes.filter((n) => n.kind === 'restraint');
    expect(restraints.length).toBeGreaterThanOrEqual(2);

    // Each socket edits its own restraint, so edits on old bases merge and every one is acknowledged.
    const acked: { version: number; ops: Op[] }[] = [];
    let failedEdits = 0;
    let running = true;
    const editLoop = async (socket: LiveClient, nodeId: string, seed: number) => {
      let base = joinA.data.version;
      for (let k = 0; running; k += 1) {
        const ops: Op[] = [{ op: 'updateNode', id: nodeId, data: { Gk: 100 + seed + k } }];
        const r = await request<{ version: number }>(socket, 'stack:edit', {
          stackId: stack.id,
          baseVersion: base,
          ops,
        }).catch(() => null);
        if (r?.ok) {
          acked.push({ version: r.data.version, ops });
          base = r.data.version;
        } else failedEdits += 1;
        await sleep(40);
      }
    };
    const signIns: number[] = [];
    const slowSignIns: number[] = [];
    const signInLoop = async () => {
      for (let k = 0; running; k += 1) {
        const t0 = Date.now();
        const r = await api<unknown>(k % 2 ? a.url : b.url, 'POST', '/auth/login', null, {
          email: lead.user.email,
          password: PASSWORD,
        });
        signIns.push(r.status);
        if (Date.now() - t0 > 2500) slowSignIns.push(Date.now() - t0);
        if (r.status !== 200) expect(r.body).toMatchObject({ error: { code: 'unavailable' } });
        await sleep(100);
      }
    };
    const loops = Promise.all([
      editLoop(onA, restraints[0].id, 0),
      editLoop(onB, restraints[1].id, 1000),
      signInLoop(),
    ]);

    await sleep(800);
    await redis.kill();
    await sleep(2500);
    // REST keeps serving on both processes with Redis gone.
    expect((await api(a.url, 'GET', `/stacks/${stack.id}`, lead.token)).status).toBe(200);
    expect((await api(b.url, 'GET', `/buildings/${building.id}/stacks`, lead.token)).status).toBe(200);
    const down = await api<unknown>(a.url, 'POST', '/auth/login', null, { email: lead.user.email, password: PASSWORD });
    expect(down.status).toBe(503);
    await sleep(5500);
    await redis.start();
    expect(
      await eventually(
        async () =>
          (await api(b.url, 'POST', '/auth/login', null, { email: lead.user.email, password: PASSWORD })).status ===
          200,
        15_000,
      ),
    ).toBe(true);
    await sleep(1500);
    running = false;
    await loops;

    expect(a.child.exitCode).toBeNull();
    expect(b.child.exitCode).toBeNull();
    expect(signIns).toContain(503);
    expect(slowSignIns).toEqual([]);
    expect(failedEdits).toBe(0);
    expect(acked.length).toBeGreaterThan(20);
    const rows = await db('stack_ops')
      .where({ stack_id: stack.id })
      .select<{ version: number; ops: string }[]>('version', 'ops');
    const stored = new Map(rows.map((r) => [r.version, JSON.parse(r.ops) as Op[]]));
    for (const x of acked) expect(stored.get(x.version)).toEqual(x.ops);

    // Live updates cross processes again: an edit on A reaches the client on B.
    const current = (await db('stacks').where({ id: stack.id }).first<{ version: number }>('version')).version;
    expect(
      await eventually(async () => {
        const heard = next(onB, 'stack:changed', (p) => p.stackId === stack.id, 1500).then(
          () => true,
          () => false,
        );
        const r = await request<{ version: number }>(onA, 'stack:edit', {
          stackId: stack.id,
          baseVersion: current,
          ops: [{ op: 'updateNode', id: restraints[0].id, data: { Gk: 77 } }],
        });
        expect(r.ok).toBe(true);
        return heard;
      }, 15_000),
    ).toBe(true);
  });

  it('starts with Redis unreachable within a bounded time, serves degraded, and recovers when Redis comes', async () => {
    const port = await freePort();
    const late = new OwnRedis(port);
    const t0 = Date.now();
    const c = await startProcess({ ...env, REDIS_URL: late.url }, 20_000);
    try {
      expect(Date.now() - t0).toBeLessThan(15_000);
      expect((await api(c.url, 'GET', '/health', null)).status).toBe(200);
      const t1 = Date.now();
      const r = await api<unknown>(c.url, 'POST', '/auth/login', null, { email: lead.user.email, password: PASSWORD });
      expect(r.status).toBe(503);
      expect(r.body).toMatchObject({ error: { code: 'unavailable', message: expect.any(String) } });
      expect(Number(r.headers.get('retry-after'))).toBeGreaterThan(0);
      expect(Date.now() - t1).toBeLessThan(2500);
      // REST that needs no Redis works.
      expect((await api(c.url, 'GET', '/buildings', lead.token)).status).toBe(200);
      await late.start();
      expect(
        await eventually(
          async () =>
            (await api(c.url, 'POST', '/auth/login', null, { email: lead.user.email, password: PASSWORD })).status ===
            200,
          15_000,
        ),
      ).toBe(true);
      expect(c.child.exitCode).toBeNull();
    } finally {
      await stopProcess(c);
      await late.kill();
    }
  });
});
