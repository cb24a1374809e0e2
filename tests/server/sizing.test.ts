// Sizing previews over HTTP (docs/analysis-rules.md §Sizing): a real server, a real SQLite file. Demo data, invented.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { BuildingSizingPreview, StackSizingPreview } from '../../shared/schema/sizing.ts';
import {
  addMember,
  createBuilding,
  errorCode,
  registerUser,
  startWithLeadAndBuilding,
  type TestServer,
} from './helpers.ts';

const template = {
  storeys: 6,
  storeyHeight: 3.6,
  spliceEvery: 2,
  sections: ['UKC 305x305x137', 'UKC 254x254x89', 'UKC 203x203x60'],
  Gk: 150,
  Qk: 75,
};

describe('sizing', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding());
  });
  afterAll(async () => {
    await s?.close();
  });

  const createStack = async (name: string, body: object = { template }) => {
    const r = await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name, ...body } });
    expect(r.status).toBe(201);
    return r.body as StackSummary;
  };
  const get = async (id: number) => (await s.api('GET', `/stacks/${id}`, { token })).body as StackDetail;
  const sizeStack = async (id: number, body: object = { series: 'UKC', grade: 'S355' }) =>
    s.api('POST', `/stacks/${id}/sizing`, { token, body });

  it('previews a stack: each lift before (as stored) and after, and the version to accept on, storing nothing', async () => {
    const stack = await createStack('A/1');
    const before = await get(stack.id);
    const r = await sizeStack(stack.id, { series: 'UKC', grade: 'S355', target: 0.9 });
    expect(r.status).toBe(200);
    const preview = r.body as StackSizingPreview;
    expect(preview).toMatchObject({
      stackId: stack.id,
      name: 'A/1',
      version: before.version,
      errors: [],
      complete: true,
    });
    expect(preview.lifts.map((l) => l.before.section)).toEqual(['UKC 305x305x137', 'UKC 254x254x89', 'UKC 203x203x60']);
    preview.lifts.forEach((l, i) => {
      expect(l.before.utilisation).toBeCloseTo(before.results.lifts[i].utilisation, 9);
      expect(l.after!.utilisation).toBeLessThanOrEqual(0.9);
    });
    expect(preview.massAfter).toBeLessThan(preview.massBefore!);
    const after = await get(stack.id);
    expect(after.version).toBe(before.version);
    expect(after.doc).toEqual(before.doc);
  });

  it('sizes with the building’s analysis options and levels', async () => {
    const stack = await createStack('A/2');
    const withSelfWeight = (await sizeStack(stack.id)).body as StackSizingPreview;
    const patched = await s.api('PATCH', `/buildings/${buildingId}`, {
      token,
      body: { options: { selfWeight: false } },
    });
    expect(patched.status).toBe(200);
    const without = (await sizeStack(stack.id)).body as StackSizingPreview;
    const stored = await get(stack.id);
    without.lifts.forEach((l, i) => expect(l.before.utilisation).toBeCloseTo(stored.results.lifts[i].utilisation, 9));
    expect(without.lifts[0].before.utilisation).toBeLessThan(withSelfWeight.lifts[0].before.utilisation!);
    await s.api('PATCH', `/buildings/${buildingId}`, { token, body: { options: { selfWeight: true } } });
  });

  it('accepted through the ops route, the stored results carry the utilisations the preview showed', async () => {
    const stack = await createStack('A/3');
    const preview = (await sizeStack(stack.id)).body as StackSizingPreview;
    const ops = preview.lifts
      .filter((l) => l.status === 'proposed')
      .map((l) => ({ op: 'updateNode', id: l.liftId, data: { section: l.after!.section, grade: l.after!.grade } }));
    expect(ops.length).toBeGreaterThan(0);
    const r = await s.api('POST', `/stacks/${stack.id}/ops`, { token, body: { ops, baseVersion: preview.version } });
    expect(r.status).toBe(200);
    const stored = await get(stack.id);
    expect(stored.results.lifts.map((l) => l.section)).toEqual(preview.lifts.map((l) => l.after!.section));
    stored.results.lifts.forEach((l, i) => expect(l.utilisation).toBeCloseTo(preview.lifts[i].after!.utilisation!, 9));
  });

  it('previews a building: every stack, a stack with errors reported and left out of the mass totals', async () => {
    const building = (await createBuilding(s, token, 'Sizing building')).id;
    for (const name of ['B/1', 'B/2']) {
      expect((await s.api('POST', `/buildings/${building}/stacks`, { token, body: { name, template } })).status).toBe(
        201,
      );
    }
    expect((await s.api('POST', `/buildings/${building}/stacks`, { token, body: { name: 'B/3' } })).status).toBe(201);
    const r = await s.api('POST', `/buildings/${building}/sizing`, {
      token,
      body: { series: 'UKC', grade: 'S355', sameSerialSize: true },
    });
    expect(r.status).toBe(200);
    const preview = r.body as BuildingSizingPreview;
    expect(preview.stacks.map((p) => p.name)).toEqual(['B/1', 'B/2', 'B/3']);
    const [one, two, empty] = preview.stacks;
    expect(empty.errors.length).toBeGreaterThan(0);
    expect(empty.massBefore).toBeNull();
    expect(one.serialSize).toMatch(/^UKC \d+x\d+$/);
    expect(preview.massBefore).toBeCloseTo(one.massBefore! + two.massBefore!, 6);
    expect(preview.massAfter).toBeCloseTo(one.massAfter! + two.massAfter!, 6);
  });

  it('refuses a target above 1 (400), a section outside the series (422) and a viewer (403)', async () => {
    const stack = await createStack('A/4');
    const high = await sizeStack(stack.id, { series: 'UKC', grade: 'S355', target: 1.2 });
    expect(high.status).toBe(400);
    const foreign = await sizeStack(stack.id, { series: 'UKC', grade: 'S355', allowed: ['UKB 457x191x67'] });
    expect(foreign.status).toBe(422);
    expect(errorCode(foreign.body)).toBe('unprocessable');
    // The building is sized on a worker thread; its refusal reaches the caller the same way.
    const wholeBuilding = await s.api('POST', `/buildings/${buildingId}/sizing`, {
      token,
      body: { series: 'UKC', grade: 'S355', allowed: ['UKB 457x191x67'] },
    });
    expect(wholeBuilding.status).toBe(422);
    expect(errorCode(wholeBuilding.body)).toBe('unprocessable');
    expect((wholeBuilding.body as { error: { message: string } }).error.message).toBe(
      (foreign.body as { error: { message: string } }).error.message,
    );
    const viewer = await registerUser(s, 'viewer');
    await addMember(s, token, buildingId, viewer.user.email, 'viewer');
    const refused = await s.api('POST', `/stacks/${stack.id}/sizing`, {
      token: viewer.token,
      body: { series: 'UKC', grade: 'S355' },
    });
    expect(refused.status).toBe(403);
  });
});
