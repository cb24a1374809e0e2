// A stack's history (docs/stack-history.md): who changed what and when, in words, and the stack as it was at a
// version, rebuilt from its starting document and the stored ops.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import type { StackAsOf, StackHistory } from '../../shared/history/historyTypes.ts';
import { getStack, nodeAt, seedBuilding } from '../fixtures/uploads.ts';
import { addMember, createBuilding, registerUser, startTestServer, type TestServer } from './helpers.ts';
import { connect, next, request } from './liveHelpers.ts';

let s: TestServer;
let lead: AuthResponse;
let engineer: AuthResponse;
let viewer: AuthResponse;
let stack: StackSummary;
let original: StackDetail;

async function edit(token: string, ops: unknown[]): Promise<number> {
  const current = await getStack(s, token, stack.id);
  const r = await s.api('POST', `/stacks/${stack.id}/ops`, { token, body: { baseVersion: current.version, ops } });
  expect(r.status).toBe(200);
  return (await getStack(s, token, stack.id)).version;
}

beforeAll(async () => {
  s = await startTestServer();
  lead = await registerUser(s, 'lead');
  engineer = await registerUser(s, 'engineer');
  viewer = await registerUser(s, 'viewer');
  const buildingId = (await createBuilding(s, lead.token, 'History block')).id;
  await addMember(s, lead.token, buildingId, engineer.user.email, 'engineer');
  await addMember(s, lead.token, buildingId, viewer.user.email, 'viewer');
  stack = (await seedBuilding(s, lead.token, buildingId, ['A/1'])).stacks[0]!;
  original = await getStack(s, lead.token, stack.id);
});

afterAll(async () => {
  await s?.close();
});

describe('a stack’s history', () => {
  it('says who changed what, in words with the old and the new value, newest first', async () => {
    // The template puts Gk 100 kN on each floor (tests/fixtures/uploads.ts); Level 3 is at +10.800.
    const level3 = nodeAt(original.doc, 10.8)!;
    await edit(engineer.token, [{ op: 'updateNode', id: level3.id, data: { Gk: 150 } }]);
    const top = original.results.lifts.at(-1)!;
    await edit(lead.token, [
      { op: 'updateNode', id: top.liftId, data: { section: 'UKC 203x203x60' } },
      { op: 'moveNode', id: top.liftId, position: { x: 40, y: 0 } },
    ]);

    const r = await s.api('GET', `/stacks/${stack.id}/history`, { token: viewer.token });
    expect(r.status).toBe(200);
    const history = r.body as StackHistory;
    expect(history.complete).toBe(true);
    expect(history.entries.map((e) => e.version)).toEqual([2, 1, 0]);
    const [second, first, created] = history.entries;
    expect(created).toMatchObject({
      action: 'stack.create',
      by: { name: lead.user.name },
      changes: ['Created the stack'],
    });
    expect(first).toMatchObject({
      action: 'stack.edit',
      by: { name: engineer.user.name },
      changes: ['Gk at Level 3 100 → 150 kN'],
    });
    expect(second!.by?.name).toBe(lead.user.name);
    expect(second!.changes).toEqual([
      `Section at lift ${top.label} UKC 203x203x46 → UKC 203x203x60`,
      'Rearranged the drawing (1 part moved)',
    ]);
    expect(Date.parse(second!.at)).toBeGreaterThanOrEqual(Date.parse(first!.at));
  });

  it('shows the stack as it was at each version, and the current version as stored', async () => {
    const current = await getStack(s, viewer.token, stack.id);
    const asOf = async (v: number) => {
      const r = await s.api('GET', `/stacks/${stack.id}/versions/${v}`, { token: viewer.token });
      expect(r.status).toBe(200);
      return r.body as StackAsOf;
    };
    const at = async (v: number): Promise<StackDocument> => (await asOf(v)).doc;
    expect(await at(0)).toEqual(original.doc);
    const v1 = await at(1);
    const level3 = nodeAt(v1, 10.8);
    expect(level3?.kind === 'restraint' && level3.data.Gk).toBe(150);
    // The outline reads bottom first: the support, the lifts and the floors named by their levels.
    const outline = (await asOf(1)).outline;
    expect(outline[0]).toMatchObject({ part: 'Support', where: 'Ground (+0.000)' });
    expect(outline.find((o) => o.where === 'Level 3 (+10.800)')?.details).toMatch(/^Gk 150 kN, Qk 50 kN/);
    expect((await asOf(0)).outline.find((o) => o.where === 'Level 3 (+10.800)')?.details).toMatch(/^Gk 100 kN/);
    expect(outline.filter((o) => o.part === 'Lift').map((o) => o.where)).toEqual([
      'L1: +0.000 to +7.700',
      'L2: +7.700 to +14.400',
    ]);
    // A splice comes before the lift that starts on it.
    expect(outline.findIndex((o) => o.part === 'Splice')).toBe(outline.findIndex((o) => o.where.startsWith('L2')) - 1);
    // Replaying every stored op from the starting document gives exactly the stored current document.
    const rebuilt = await s.api('GET', `/stacks/${stack.id}/versions/${current.version - 1}`, { token: viewer.token });
    expect(rebuilt.status).toBe(200);
    expect(await at(current.version)).toEqual(current.doc);
    const replayed = (await s.ctx.db('stacks').where({ id: stack.id }).first<{ doc: string }>('doc'))!;
    expect(JSON.parse(replayed.doc)).toEqual(current.doc);
  });

  it('restores an earlier version as a new version, broadcast to the stack room, and restores back again', async () => {
    const watcher = await connect(s.url, viewer.token);
    try {
      const joined = await request<{ version: number }>(watcher, 'stack:join', { stackId: stack.id });
      expect(joined.ok).toBe(true);
      const before = await getStack(s, engineer.token, stack.id);
      const heard = next(watcher, 'stack:changed', (p) => p.stackId === stack.id);
      const r = await s.api('POST', `/stacks/${stack.id}/versions/0/restore`, {
        token: engineer.token,
        body: { baseVersion: before.version },
      });
      expect(r.status).toBe(200);
      const restored = r.body as StackDetail;
      expect(restored.version).toBe(before.version + 1);
      expect(restored.doc).toEqual(original.doc);
      expect(restored.results.lifts.map((l) => l.utilisation)).toEqual(
        original.results.lifts.map((l) => l.utilisation),
      );
      const change = await heard;
      expect(change.version).toBe(restored.version);
      expect(change.by.name).toBe(engineer.user.name);
      // The history says what the restore changed back, in the same words as any edit.
      const history = (await s.api('GET', `/stacks/${stack.id}/history`, { token: viewer.token })).body as StackHistory;
      expect(history.entries[0]!.changes).toEqual(expect.arrayContaining(['Gk at Level 3 150 → 100 kN']));
      // Undone by restoring the version before it.
      const back = await s.api('POST', `/stacks/${stack.id}/versions/${before.version}/restore`, {
        token: engineer.token,
        body: { baseVersion: restored.version },
      });
      expect(back.status).toBe(200);
      expect((back.body as StackDetail).doc).toEqual(before.doc);
    } finally {
      watcher.disconnect();
    }
  });

  it('refuses a restore from a stale version or by a viewer, and leaves the stack as it was', async () => {
    const before = await getStack(s, engineer.token, stack.id);
    const stale = await s.api('POST', `/stacks/${stack.id}/versions/0/restore`, {
      token: engineer.token,
      body: { baseVersion: before.version - 1 },
    });
    expect(stale.status).toBe(409);
    const viewed = await s.api('POST', `/stacks/${stack.id}/versions/0/restore`, {
      token: viewer.token,
      body: { baseVersion: before.version },
    });
    expect(viewed.status).toBe(403);
    expect(await getStack(s, engineer.token, stack.id)).toEqual(before);
  });

  it('refuses a version that does not exist and a malformed one, in the API error shape', async () => {
    const ahead = await s.api('GET', `/stacks/${stack.id}/versions/99`, { token: viewer.token });
    expect(ahead.status).toBe(404);
    expect(ahead.body).toMatchObject({ error: { code: 'not_found' } });
    const bad = await s.api('GET', `/stacks/${stack.id}/versions/-1`, { token: viewer.token });
    expect(bad.status).toBe(400);
    expect(bad.body).toMatchObject({ error: { code: expect.any(String) } });
  });
});
