// Requests a client got wrong are answered 4xx with the error shape, never 500 (docs/faults.md):
// a body that does not match its Content-Encoding, text with a NUL character (PostgreSQL cannot store
// it), and stack documents that name a missing level, join a missing node or loop — refused the same
// way by the ops route and by the whole-document PUT, leaving the stack as it was.
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Level, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { errorCode, startWithLeadAndBuilding, type TestServer } from './helpers.ts';

describe('client errors are 4xx', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  let stack: StackDetail;
  let level: Level;

  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding());
    level = (
      await s.api('POST', `/buildings/${buildingId}/levels`, { token, body: { name: 'Level 1', elevation: 3.6 } })
    ).body as Level;
    const created = (
      await s.api('POST', `/buildings/${buildingId}/stacks`, {
        token,
        body: {
          name: 'C/1',
          template: { storeys: 3, storeyHeight: 3.6, sections: ['UKC 203x203x46'], Gk: 50, Qk: 20 },
        },
      })
    ).body as StackSummary;
    stack = (await s.api('GET', `/stacks/${created.id}`, { token })).body as StackDetail;
  });
  afterAll(async () => {
    await s?.close();
  });

  it('answers 400 to a body marked gzip that is not gzip, and reads a real gzip body', async () => {
    const bad = await s.api('POST', '/buildings', {
      token,
      raw: '{"name":"Not zipped"}',
      headers: { 'Content-Encoding': 'gzip' },
    });
    expect(bad.status).toBe(400);
    expect(errorCode(bad.body)).toBe('bad_request');
    const res = await fetch(`${s.url}/api/buildings`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', 'Content-Encoding': 'gzip', Authorization: `Bearer ${token}` },
      body: gzipSync(Buffer.from(JSON.stringify({ name: 'Zipped' }))),
    });
    expect(res.status).toBe(201);
  });

  it('answers 400 to a name with a NUL character, on every route that takes text', async () => {
    const cases: [string, string, unknown][] = [
      ['POST', '/buildings', { name: 'Bad\u0000name' }],
      ['POST', `/buildings/${buildingId}/stacks`, { name: 'S\u0000/1' }],
      ['POST', `/buildings/${buildingId}/levels`, { name: 'L\u0000', elevation: 9 }],
      ['PATCH', `/stacks/${stack.id}`, { name: 'x\u0000' }],
      ['POST', `/buildings/${buildingId}/revisions`, { purpose: 'preliminary', note: 'why\u0000' }],
    ];
    for (const [method, path, body] of cases) {
      const r = await s.api(method, path, { token, body });
      expect(r.status, `${method} ${path}`).toBe(400);
      expect(errorCode(r.body)).toBe('bad_request');
    }
    expect(
      ((await s.api('GET', `/buildings/${buildingId}/stacks`, { token })).body as StackSummary[]).map((x) => x.name),
    ).toEqual(['C/1']);
  });

  const restraintOf = (doc: StackDocument) => doc.nodes.find((n) => n.kind === 'restraint')!;

  it('refuses an edit that puts a node on a level the building does not have, on both paths', async () => {
    const r = restraintOf(stack.doc);
    const ops = await s.api('POST', `/stacks/${stack.id}/ops`, {
      token,
      body: { baseVersion: stack.version, ops: [{ op: 'updateNode', id: r.id, data: { levelId: '999999' } }] },
    });
    expect(ops.status).toBe(422);
    expect((ops.body as { error: { message: string } }).error.message).toMatch(/no longer has/);
    const doc: StackDocument = {
      ...stack.doc,
      nodes: stack.doc.nodes.map((n) =>
        n.id === r.id ? ({ ...n, data: { ...n.data, levelId: '999999' } } as typeof n) : n,
      ),
    };
    const put = await s.api('PUT', `/stacks/${stack.id}`, { token, body: { baseVersion: stack.version, doc } });
    expect(put.status).toBe(422);
    // A level that exists is accepted.
    const ok = await s.api('POST', `/stacks/${stack.id}/ops`, {
      token,
      body: { baseVersion: stack.version, ops: [{ op: 'updateNode', id: r.id, data: { levelId: level.id } }] },
    });
    expect(ok.status).toBe(200);
    stack = (await s.api('GET', `/stacks/${stack.id}`, { token })).body as StackDetail;
  });

  it('refuses a whole document with an edge to a missing node, as the ops route does', async () => {
    const edge = { id: 'e-ghost', source: stack.doc.nodes[0].id, target: 'ghost' };
    const put = await s.api('PUT', `/stacks/${stack.id}`, {
      token,
      body: { baseVersion: stack.version, doc: { ...stack.doc, edges: [...stack.doc.edges, edge] } },
    });
    expect(put.status).toBe(422);
    expect((put.body as { error: { message: string } }).error.message).toMatch(/ghost does not exist/);
    const ops = await s.api('POST', `/stacks/${stack.id}/ops`, {
      token,
      body: { baseVersion: stack.version, ops: [{ op: 'addEdge', edge }] },
    });
    expect(ops.status).toBe(422);
  });

  it('refuses a loop of connections on both paths and leaves the stack as it was', async () => {
    const first = stack.doc.edges[0];
    const back = { id: 'e-back', source: first.target, target: first.source };
    const put = await s.api('PUT', `/stacks/${stack.id}`, {
      token,
      body: { baseVersion: stack.version, doc: { ...stack.doc, edges: [...stack.doc.edges, back] } },
    });
    expect(put.status).toBe(422);
    expect((put.body as { error: { message: string } }).error.message).toMatch(/loop/);
    const ops = await s.api('POST', `/stacks/${stack.id}/ops`, {
      token,
      body: { baseVersion: stack.version, ops: [{ op: 'addEdge', edge: back }] },
    });
    expect(ops.status).toBe(422);
    const after = (await s.api('GET', `/stacks/${stack.id}`, { token })).body as StackDetail;
    expect(after.version).toBe(stack.version);
    expect(after.doc).toEqual(stack.doc);
  });
});
