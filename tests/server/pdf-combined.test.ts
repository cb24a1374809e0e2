// The calculation package of a building whose stack has beam reactions on the column faces: the nominal
// moments of simple construction and the combined check are printed with their working (invented data).
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { StackDetail } from '../../shared/schema/api.ts';
import type { LiftResult, PieceCheck } from '../../shared/schema/results.ts';
import type { RevisionDetail } from '../../shared/schema/revisions.ts';
import type { RestraintFaces } from '../../shared/schema/stack.ts';
import { startTestServer, type TestServer } from './helpers.ts';
import { revisionFixture, type RevisionFixture } from './revisionsFixture.ts';

const squash = (t: string) => t.replace(/\s+/g, ' ');
const FACES: RestraintFaces = { yPlus: { Gk: 60, Qk: 30 }, zPlus: { Gk: 20, Qk: 10 } };

async function packagePages(s: TestServer, revisionId: number, token: string): Promise<string[]> {
  const res = await fetch(`${s.url}/api/revisions/${revisionId}/calc.pdf`, {
    headers: { Authorization: `Bearer ${token}` },
  });
  expect(res.status).toBe(200);
  const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
  try {
    return (await parser.getText()).pages.map((p) => squash(p.text));
  } finally {
    await parser.destroy();
  }
}

async function freeze(
  s: TestServer,
  f: RevisionFixture,
  purpose: 'preliminary' | 'construction',
): Promise<RevisionDetail> {
  const r = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
    token: f.lead.token,
    body: { note: 'Nominal moments', purpose },
  });
  if (r.status !== 201) throw new Error(`freeze: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body as RevisionDetail;
}

const worstPiece = (lift: LiftResult): PieceCheck =>
  lift.pieces.reduce((a, b) => (b.utilisation > a.utilisation ? b : a));

/** The first number printed with `unit` after `label`, for comparing a printed value within its rounding. */
function printed(text: string, label: RegExp, unit: string): number {
  const m = new RegExp(`${label.source}.*?(?<![\\d.])(-?\\d+(?:\\.\\d+)?) ${unit}`).exec(text);
  if (!m) throw new Error(`not printed: ${label.source} … ${unit}`);
  return Number(m[1]);
}

describe('the calculation package with nominal moments (simple construction)', () => {
  let s: TestServer;
  let f: RevisionFixture;
  let faced: StackDetail;
  let withMoments: string[];
  let withoutMoments: string[];
  beforeAll(async () => {
    s = await startTestServer();
    f = await revisionFixture(s);
    // B/2 gets face reactions on every floor restraint; A/1 stays axial only.
    const stackId = f.stackIds[0];
    const stack = (await s.api('GET', `/stacks/${stackId}`, { token: f.lead.token })).body as StackDetail;
    const doc = {
      ...stack.doc,
      nodes: stack.doc.nodes.map((n) => (n.kind === 'restraint' ? { ...n, data: { ...n.data, faces: FACES } } : n)),
    };
    const put = await s.api('PUT', `/stacks/${stackId}`, {
      token: f.lead.token,
      body: { doc, baseVersion: stack.version },
    });
    if (put.status !== 200) throw new Error(`edit: ${put.status} ${JSON.stringify(put.body)}`);
    faced = put.body as StackDetail;
    withMoments = await packagePages(s, (await freeze(s, f, 'construction')).id, f.viewer.token);

    const patch = await s.api('PATCH', `/buildings/${f.buildingId}`, {
      token: f.lead.token,
      body: { options: { nominalMoments: false } },
    });
    if (patch.status !== 200) throw new Error(`options: ${patch.status} ${JSON.stringify(patch.body)}`);
    withoutMoments = await packagePages(s, (await freeze(s, f, 'preliminary')).id, f.viewer.token);
  });
  afterAll(async () => {
    await s?.close();
  });

  it('the analysis it freezes has the combined check governing a lift, so the package below has something to print', () => {
    expect(faced.results.errors).toEqual([]);
    expect(faced.results.lifts.some((l) => l.governing === 'combined')).toBe(true);
  });

  it('prints the combined-check wording and every reference the combined steps of each governing piece cite', () => {
    const all = withMoments.join(' ');
    expect(all).toContain('combined axial and nominal moments (simple construction)');
    const worked = faced.results.lifts.map(worstPiece).filter((p) => p.combined && p.combined.steps.length > 0);
    expect(worked.length).toBe(faced.results.lifts.length);
    for (const p of worked) {
      expect(all).toContain(
        `Combined check with nominal moments, eq. ${p.combined?.combination}, utilisation ${p.combined?.utilisation.toFixed(3)}`,
      );
      for (const step of p.combined?.steps ?? []) expect(all).toContain(squash(step.clause));
    }
    // EN 1993-1-1 eq. 6.55 (Mb,Rd), eq. 6.13 (Mz,Rd of a class 1–2 section), EN 1990 eq. 6.10b (the floor's net reaction).
    for (const ref of ['EN 1993-1-1 eq. 6.55', 'EN 1993-1-1 eq. 6.13', 'EN 1990 eq. 6.10b']) expect(all).toContain(ref);
  });

  it('prints no "undefined" or "NaN" on any page', () => {
    for (const pages of [withMoments, withoutMoments]) {
      for (const text of pages) {
        expect(text).not.toMatch(/undefined|NaN/);
      }
    }
  });

  it('gives the governing lift its axial and its combined utilisation side by side in the summary', () => {
    const gov = faced.results.lifts.find((l) => l.liftId === faced.results.governingLiftId);
    if (!gov) throw new Error('no governing lift');
    const axial = Math.max(...gov.pieces.map((p) => p.axialUtilisation ?? p.utilisation));
    const combined = Math.max(...gov.pieces.map((p) => p.combined?.utilisation ?? 0));
    expect(gov.utilisation).toBe(combined);
    const row = `B/2 2 [\\d.]+ ${gov.label} ${gov.section} ${gov.grade} N\\+M ${axial.toFixed(3)} ${combined.toFixed(3)} ${gov.utilisation.toFixed(3)} passes`;
    expect(withMoments[1]).toMatch(new RegExp(row));
    // A/1 has no face reactions: no combined figure.
    expect(withMoments[1]).toMatch(/A\/1 .* – \d\.\d{3} passes/);
  });

  it('prints the nominal moment of the lowest floor as a hand calculation gives it', () => {
    const all = withMoments.join(' ');
    // Net reaction on the y faces, worst imposed pattern (yPlus loaded, nothing on yMinus):
    // EN 1990 eq. 6.10b with ξ = 0.925 (UK NA to EN 1990 Table NA.A1.2(B)): 0.925·1.35·60 + 1.5·30 = 119.925 kN;
    // eq. 6.10a with ψ0 = 0.7 for category B (EN 1990 Table A1.1): 1.35·60 + 0.7·1.5·30 = 112.5 kN. The check
    // takes NEd and the reaction from one combination, so the working prints the reaction of the one that governs.
    const first = faced.results.lifts
      .map(worstPiece)
      .find((p) =>
        p.combined?.steps.some((s) => s.symbol === 'Ry,net' && s.description?.startsWith('floor at 3.600 m')),
      );
    const R = first?.combined?.combination === '6.10a' ? 1.35 * 60 + 0.7 * 1.5 * 30 : 0.925 * 1.35 * 60 + 1.5 * 30;
    expect(printed(all, /Ry,net floor at 3\.600 m/, 'kN')).toBeCloseTo(R, 1);
    // Reaction 100 mm from the flange face (common practice for simple construction, from memory);
    // UKC 254x254x73: h = 254.1 mm (BS 4-1; SCI P363 (steel building design: design data), from memory).
    const e = 254.1 / 2 + 100;
    expect(printed(all, /ey h\/2 \+ 100/, 'mm')).toBeCloseTo(e, 0);
    expect(printed(all, /My,floor floor at 3\.600 m/, 'kN·m')).toBeCloseTo((R * e) / 1000, 1);
  });

  it('says on the cover and on each stack page whether nominal moments were included', () => {
    expect(withMoments[0]).toContain('Nominal moments included (simple construction)');
    expect(withMoments[0]).toContain('applied in 1 of 2 stacks');
    const stackPages = withMoments.filter((t) => /2\.\d+ Stack /.test(t));
    expect(stackPages.length).toBe(2);
    expect(stackPages.find((t) => t.includes('Stack B/2'))).toContain(
      'Nominal moments: included, from the beam reactions on the column faces',
    );
    expect(stackPages.find((t) => t.includes('Stack A/1'))).toContain(
      'no beam reactions are given on the column faces of this stack',
    );
  });

  it('with nominal moments switched off, says so and prints no combined check', () => {
    const all = withoutMoments.join(' ');
    expect(withoutMoments[0]).toContain('Nominal moments not included: axial checks only');
    expect(all).toContain('Nominal moments: not included in this revision');
    expect(all).not.toContain('Combined check with nominal moments');
    expect(all).not.toContain('combined axial and nominal moments');
  });
});
