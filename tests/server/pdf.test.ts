import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RevisionDetail } from '../../shared/schema/revisions.ts';
import { SAFETY_NOTE } from '../../shared/safety.ts';
import { startTestServer, type TestServer } from './helpers.ts';
import { revisionFixture, type RevisionFixture } from './revisionsFixture.ts';

const squash = (t: string) => t.replace(/\s+/g, ' ');

describe('the calculation package (PDF)', () => {
  let s: TestServer;
  let f: RevisionFixture;
  let rev: RevisionDetail;
  let pdf: Buffer;
  let pages: string[];
  beforeAll(async () => {
    s = await startTestServer();
    f = await revisionFixture(s);
    rev = (
      await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
        token: f.lead.token,
        body: { note: 'Package test', purpose: 'construction' },
      })
    ).body as RevisionDetail;
    const res = await fetch(`${s.url}/api/revisions/${rev.id}/calc.pdf`, {
      headers: { Authorization: `Bearer ${f.viewer.token}` },
    });
    pdf = Buffer.from(await res.arrayBuffer());
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    try {
      pages = (await parser.getText()).pages.map((p) => squash(p.text));
    } finally {
      await parser.destroy();
    }
  });
  afterAll(async () => {
    await s?.close();
  });

  it('parses as a PDF with a cover, a summary and pages for every stack', () => {
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pages.length).toBeGreaterThan(4);
    expect(pages[0]).toContain('C01');
    expect(pages[0]).toContain('For construction');
    expect(pages[0]).toContain(rev.hash);
    expect(pages[0]).toContain(f.lead.user.name);
  });

  it('names every stack in the summary and gives each its own section', () => {
    const all = pages.join('\n');
    for (const name of ['A/1', 'B/2']) {
      expect(pages[1]).toContain(name);
      expect(all).toContain(`Stack ${name}`);
    }
    // Each stack's heading line names its governing lift as engineers do (L1, L2, …), not by graph node id.
    for (const stack of rev.stacks)
      expect(all).toContain(`governing lift ${stack.governingLiftLabel} (${stack.governingSection})`);
  });

  it('carries the clause and equation references of the member working and the take-down', () => {
    const all = pages.join('\n');
    // EN 1993-1-1 eq. 6.47 (Nb,Rd), 6.49 (χ), 6.50 (λ̄), Table 6.2 (curves), Table 5.2 (class); EN 1990 6.10a/b.
    for (const ref of [
      'EN 1993-1-1 eq. 6.47',
      'EN 1993-1-1 eq. 6.49',
      'EN 1993-1-1 eq. 6.50',
      'EN 1993-1-1 Table 6.2',
      'EN 1993-1-1 Table 5.2',
      'EN 1990 eq. 6.10',
    ]) {
      expect(all).toContain(ref);
    }
    expect(all).toContain('Load take-down');
    expect(all).toMatch(/χz/);
  });

  it('prints the safety note (the one the screens show) with the page number on every page', () => {
    pages.forEach((text, i) => {
      expect(text).toContain(squash(SAFETY_NOTE));
      expect(text).toContain(`Page ${i + 1} of ${pages.length}`);
    });
  });
});
