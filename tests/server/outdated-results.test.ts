// Results stored by an older version of the rules are analysed again before a revision is frozen, so the
// package never prints old numbers under the current engine version (invented data).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import type { StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { RevisionDetail } from '../../shared/schema/revisions.ts';
import { reanalyseOutdatedOnStart } from '../../server/services/outdatedResults.ts';
import { replaceStoredResults, startWithLeadAndBuilding, type TestServer } from './helpers.ts';

const template = {
  storeys: 2,
  storeyHeight: 4,
  spliceEvery: 2,
  sections: ['UKC 203x203x46'],
  Gk: 100,
  Qk: 50,
  roofFaces: { yPlus: { Gk: 60, Qk: 20 } },
};

describe('results of older rules at freezing', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding());
  });
  afterAll(async () => {
    await s?.close();
  });

  const get = async (id: number) => (await s.api('GET', `/stacks/${id}`, { token })).body as StackDetail;

  it('marks stored results with the engine version that produced them', async () => {
    const sum = (await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name: 'V/1', template } }))
      .body as StackSummary;
    expect((await get(sum.id)).results.engineVersion).toBe(ENGINE_VERSION);
  });

  it('analyses again, as a new version, a stack whose results an older engine stored, then freezes the fresh figures', async () => {
    const sum = (await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name: 'V/2', template } }))
      .body as StackSummary;
    const fresh = await get(sum.id);
    // As an engine before 1.1.0 left them: no version mark, and (here) a lower utilisation.
    const old = { ...fresh.results, lifts: fresh.results.lifts.map((l) => ({ ...l, utilisation: l.utilisation / 2 })) };
    delete old.engineVersion;
    await replaceStoredResults(s.ctx.db, sum.id, old, 'text');

    const r = await s.api('POST', `/buildings/${buildingId}/revisions`, {
      token,
      body: { note: 'after an engine upgrade', purpose: 'preliminary' },
    });
    expect(r.status).toBe(201);
    const revision = r.body as RevisionDetail;
    expect(revision.engineVersion).toBe(ENGINE_VERSION);
    const frozen = revision.stacks.find((x) => x.id === sum.id)!;
    expect(frozen.version).toBe(fresh.version + 1);
    expect(frozen.utilisation).toBeCloseTo(Math.max(...fresh.results.lifts.map((l) => l.utilisation)), 12);
    const now = await get(sum.id);
    expect(now.version).toBe(fresh.version + 1);
    expect(now.results.engineVersion).toBe(ENGINE_VERSION);
    // V/1 was up to date and keeps its version
    const other = revision.stacks.find((x) => x.name === 'V/1')!;
    expect(other.version).toBe(0);
  });

  it('at start-up analyses again the stacks an older engine left, once: stored as text before, or packed', async () => {
    const create = async (name: string) =>
      (await s.api('POST', `/buildings/${buildingId}/stacks`, { token, body: { name, template } }))
        .body as StackSummary;
    const [text, packed] = [await create('V/3'), await create('V/4')];
    const fresh = [await get(text.id), await get(packed.id)];
    // V/3 as rows were stored before results were packed: JSON text, no version mark.
    const old = { ...fresh[0].results };
    delete old.engineVersion;
    await replaceStoredResults(s.ctx.db, text.id, old, 'text');
    // V/4 packed (docs/contracts.md §Stored results) by an engine of an earlier version.
    await replaceStoredResults(s.ctx.db, packed.id, { ...fresh[1].results, engineVersion: '1.0.0' });
    expect(await reanalyseOutdatedOnStart(s.ctx.db)).toBe(2);
    for (const [i, id] of [text.id, packed.id].entries()) {
      const now = await get(id);
      expect(now.version).toBe(fresh[i].version + 1);
      expect(now.results).toEqual(fresh[i].results);
    }
    expect(await reanalyseOutdatedOnStart(s.ctx.db)).toBe(0);
  });
});
