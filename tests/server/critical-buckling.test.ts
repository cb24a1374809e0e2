// A building whose buckling lengths come from the critical buckling analysis: the option is stored and
// re-analyses every stack, results carry αcr and the buckled shapes, and the package prints them (invented data).
import { EMPTY_MODEL } from '../../shared/schema/building.ts';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Building, StackDetail } from '../../shared/schema/api.ts';
import type { RevisionDetail } from '../../shared/schema/revisions.ts';
import { inputsKey, precomputedFor } from '../../server/services/reanalysis.ts';
import type { StackRow } from '../../server/services/stackRows.ts';
import { startTestServer, type TestServer } from './helpers.ts';
import { revisionFixture, type RevisionFixture } from './revisionsFixture.ts';

const squash = (t: string) => t.replace(/\s+/g, ' ');

describe('buckling lengths from the critical buckling analysis', () => {
  let s: TestServer;
  let f: RevisionFixture;
  let before: StackDetail;
  beforeAll(async () => {
    s = await startTestServer();
    f = await revisionFixture(s);
    before = (await s.api('GET', `/stacks/${f.stackIds[0]}`, { token: f.lead.token })).body as StackDetail;
  });
  afterAll(async () => {
    await s?.close();
  });

  it('analyses with tabulated factors until the lead chooses otherwise', () => {
    expect(before.results.errors).toEqual([]);
    expect(before.results.criticalBuckling).toBeUndefined();
  });

  it('an engineer cannot change the option; the stack is left as it was', async () => {
    const r = await s.api('PATCH', `/buildings/${f.buildingId}`, {
      token: f.engineer.token,
      body: { options: { bucklingLengths: 'critical' } },
    });
    expect(r.status).toBe(403);
    const after = (await s.api('GET', `/stacks/${f.stackIds[0]}`, { token: f.lead.token })).body as StackDetail;
    expect(after.version).toBe(before.version);
  });

  it('a lead chooses it: every stack is analysed again with αcr per axis and lengths from the analysis', async () => {
    const r = await s.api('PATCH', `/buildings/${f.buildingId}`, {
      token: f.lead.token,
      body: { options: { bucklingLengths: 'critical' } },
    });
    expect(r.status).toBe(200);
    expect((r.body as Building).options.bucklingLengths).toBe('critical');
    for (const id of f.stackIds) {
      const stack = (await s.api('GET', `/stacks/${id}`, { token: f.viewer.token })).body as StackDetail;
      expect(stack.results.errors).toEqual([]);
      expect(stack.results.criticalBuckling?.y.alphaCr).toBeGreaterThan(0);
      expect(stack.results.criticalBuckling?.z.shape?.displacements.length).toBeGreaterThan(2);
      expect(
        stack.results.lifts.flatMap((l) => l.pieces).every((p) => p.tableKY !== undefined && p.tableKZ !== undefined),
      ).toBe(true);
    }
  });

  it('the package prints the buckled shapes, αcr in the working and the tabulated factor beside the analysed one', async () => {
    const frozen = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
      token: f.lead.token,
      body: { note: 'Critical buckling', purpose: 'preliminary' },
    });
    expect(frozen.status).toBe(201);
    const res = await fetch(`${s.url}/api/revisions/${(frozen.body as RevisionDetail).id}/calc.pdf`, {
      headers: { Authorization: `Bearer ${f.viewer.token}` },
    });
    expect(res.status).toBe(200);
    const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
    const text = squash((await parser.getText()).text);
    await parser.destroy();
    expect(text).toContain('Buckled shapes from the critical buckling analysis of the stack');
    expect(text).toContain('αcr,y');
    expect(text).toContain('tabulated ky');
    expect(text).toContain('Ncr = αcr·NEd');
  });
});

describe('results worked out on the worker thread before the options are stored', () => {
  const inputs = {
    options: {
      combination: '6.10ab',
      annex: 'UK',
      imposedReduction: true,
      selfWeight: true,
      bucklingLengths: 'critical',
    } as const,
    levels: new Map([['1', 3.6]]),
    sections: new Map(),
    model: EMPTY_MODEL,
  };
  const results = { errors: [], warnings: [], lifts: [], governingLiftId: null, takeDown: [] };
  const pre = { inputsKey: inputsKey(inputs), byStack: new Map([[7, { version: 3, results }]]) };
  const row = (version: number) =>
    ({ id: 7, building_id: 1, name: 'S', doc: '{}', version, results: '{}' }) as unknown as StackRow;

  it('are used for a stack whose version and inputs are unchanged, whatever the order of the options', () => {
    const reordered = {
      ...inputs,
      options: {
        bucklingLengths: 'critical',
        selfWeight: true,
        imposedReduction: true,
        annex: 'UK',
        combination: '6.10ab',
      } as const,
    };
    expect(precomputedFor(pre, reordered, row(3))).toBe(results);
  });

  it('are not used for a stack edited meanwhile, nor after a level moved', () => {
    expect(precomputedFor(pre, inputs, row(4))).toBeUndefined();
    expect(precomputedFor(pre, { ...inputs, levels: new Map([['1', 3.7]]) }, row(3))).toBeUndefined();
  });
});
