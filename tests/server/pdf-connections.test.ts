// The calculation package and the building options with the splice, base and tie checks: the consequence class on the
// cover with the robustness line, and each splice and base with its working; a stack without details reads "not given".
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { StackDetail } from '../../shared/schema/api.ts';
import type { RobustnessSummary } from '../../shared/engine/connections/robustnessSummary.ts';
import type { RevisionDetail } from '../../shared/schema/revisions.ts';
import { startTestServer, type TestServer } from './helpers.ts';
import { revisionFixture, type RevisionFixture } from './revisionsFixture.ts';

const squash = (t: string) => t.replace(/\s+/g, ' ');

describe('the calculation package with splices and bases', () => {
  let s: TestServer;
  let f: RevisionFixture;
  let detailed: StackDetail;
  let pages: string[];
  beforeAll(async () => {
    s = await startTestServer();
    f = await revisionFixture(s);
    const patch = await s.api('PATCH', `/buildings/${f.buildingId}`, {
      token: f.lead.token,
      body: { options: { consequenceClass: '2b', concreteClass: 'C30/37' } },
    });
    if (patch.status !== 200) throw new Error(`options: ${patch.status} ${JSON.stringify(patch.body)}`);
    const stackId = f.stackIds[0];
    const stack = (await s.api('GET', `/stacks/${stackId}`, { token: f.lead.token })).body as StackDetail;
    const nodes = stack.doc.nodes.map((n) => {
      if (n.kind === 'splice')
        return {
          ...n,
          data: {
            ...n.data,
            detail: {
              plate: { width: 200, thickness: 12, grade: 'S275' as const },
              bolts: { number: 4, diameter: 20 as const, class: '8.8' as const },
            },
          },
        };
      if (n.kind === 'support')
        return { ...n, data: { ...n.data, basePlate: { b: 450, l: 450, t: 30, grade: 'S275' as const, grout: 30 } } };
      return n;
    });
    const put = await s.api('PUT', `/stacks/${stackId}`, {
      token: f.lead.token,
      body: { doc: { ...stack.doc, nodes }, baseVersion: stack.version },
    });
    if (put.status !== 200) throw new Error(`edit: ${put.status} ${JSON.stringify(put.body)}`);
    detailed = put.body as StackDetail;
    const r = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
      token: f.lead.token,
      body: { note: 'Splices', purpose: 'preliminary' },
    });
    if (r.status !== 201) throw new Error(`freeze: ${r.status} ${JSON.stringify(r.body)}`);
    const res = await fetch(`${s.url}/api/revisions/${(r.body as RevisionDetail).id}/calc.pdf`, {
      headers: { Authorization: `Bearer ${f.viewer.token}` },
    });
    expect(res.status).toBe(200);
    const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
    try {
      pages = (await parser.getText()).pages.map((p) => squash(p.text));
    } finally {
      await parser.destroy();
    }
  });
  afterAll(async () => {
    await s?.close();
  });

  it('stores the building classes and checks the detailed stack with them', () => {
    expect(detailed.results.splices?.length).toBeGreaterThan(0);
    for (const splice of detailed.results.splices ?? []) expect(splice.tieForce).not.toBeNull();
    expect(detailed.results.base?.status).not.toBe('not-given');
  });

  it('gives the robustness summary of the building to any member, listing the splices that meet the tie force and those that do not', async () => {
    const r = await s.api('GET', `/buildings/${f.buildingId}/robustness`, { token: f.viewer.token });
    expect(r.status).toBe(200);
    const summary = r.body as RobustnessSummary;
    expect(summary).toMatchObject({ consequenceClass: '2b', tiesRequired: true });
    const spliceCount = (detailed.results.splices ?? []).length;
    const detailedRows = [...summary.meeting, ...summary.notMeeting].filter((row) => row.stackId === detailed.id);
    expect(detailedRows).toHaveLength(spliceCount);
    // Stacks without a detail cannot show that they carry the tie
    expect(summary.notMeeting.filter((row) => row.stackId !== detailed.id).every((row) => row.NtRd === null)).toBe(
      true,
    );
    const bad = await s.api('GET', '/buildings/abc/robustness', { token: f.viewer.token });
    expect(bad.status).toBeGreaterThanOrEqual(400);
    expect(bad.status).toBeLessThan(500);
  });

  it('prints the consequence class and the robustness line on the cover', () => {
    expect(pages[0]).toContain('Consequence class 2b (EN 1991-1-7 Annex A)');
    expect(pages[0]).toContain('Foundation concrete C30/37');
    expect(pages[0]).toMatch(/Robustness Consequence class 2b: \d+ splice\(s\) meet the vertical tie force/);
  });

  it('prints each splice and base with its working and clauses, and "not given" for a stack without details', () => {
    const all = pages.join(' ');
    expect(all).toContain('Splices and base');
    expect(all).toContain('EN 1991-1-7 A.6(2)');
    expect(all).toContain('EN 1993-1-8 eq. 6.5');
    expect(all).toContain('EN 1992-1-1 eq. 3.15');
    expect(all).toContain('not given');
    const status = detailed.results.splices?.[0]?.status === 'passes' ? 'passes, meets the tie' : 'FAILS, tie not met';
    expect(all).toContain(status);
  });
});
