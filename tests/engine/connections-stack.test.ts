// Splice and base checks inside a stack's analysis: additive to the member checks, "not given" until detailed.
import { describe, expect, it } from 'vitest';
import { robustnessSummary } from '../../shared/engine/connections/robustnessSummary.ts';
import { analyseBuilding } from '../../shared/engine/stack/analyseBuilding.ts';
import { sizeStack } from '../../shared/engine/sizing/sizeStack.ts';
import { analyseStack } from '../../shared/engine/stack/analyseStack.ts';
import { sizingRequestSchema } from '../../shared/schema/sizing.ts';
import type { SpliceDetail, StackDocument } from '../../shared/schema/stack.ts';
import { stackDocumentSchema } from '../../shared/schema/stack.ts';
import { buildStack, withNode } from './stack-builder.ts';

// Two lifts of UKC 254x254x89 (below) and 254x254x73 (above) S355, floors at +4 (120/80 A) and +8 (100/60 A),
// splice at +5, roof cap at +12 with 60/20 H (invented).
const doc = buildStack({
  lifts: [
    { top: 5, section: 'UKC 254x254x89' },
    { top: 12, section: 'UKC 254x254x73' },
  ],
  floors: [
    { elevation: 4, Gk: 120, Qk: 80 },
    { elevation: 8, Gk: 100, Qk: 60 },
  ],
  cap: { Gk: 60, Qk: 20, category: 'H' },
});
const DETAIL: SpliceDetail = {
  plate: { width: 250, thickness: 12, grade: 'S275' },
  bolts: { number: 4, diameter: 20, class: '8.8' },
};
const detailed = (d: StackDocument, detail: SpliceDetail): StackDocument =>
  withNode(d, 'p1', (n) => (n.kind === 'splice' ? { ...n, data: { ...n.data, detail } } : n));
const withBase = (d: StackDocument): StackDocument =>
  withNode(d, 's', (n) =>
    n.kind === 'support'
      ? { ...n, data: { ...n.data, basePlate: { b: 400, l: 400, t: 25, grade: 'S275', grout: 40 } } }
      : n,
  );

describe('connections in the stack analysis', () => {
  it('keeps old documents valid and shows the new checks as not given', () => {
    expect(stackDocumentSchema.safeParse(doc).success).toBe(true);
    const result = analyseStack(doc);
    expect(result.errors).toEqual([]);
    expect(result.splices).toHaveLength(1);
    expect(result.splices?.[0]).toMatchObject({
      status: 'not-given',
      NtRd: null,
      tieForce: null,
      meetsTie: null,
      sameSerialSize: true,
    });
    expect(result.base).toMatchObject({ status: 'not-given', tension: false });
  });

  it('leaves the member checks unchanged when a detail and a class are given', () => {
    const plain = analyseStack(doc, { consequenceClass: '2b', concreteClass: 'C30/37' });
    const full = analyseStack(withBase(detailed(doc, DETAIL)), { consequenceClass: '2b', concreteClass: 'C30/37' });
    expect(full.lifts).toEqual(analyseStack(doc).lifts);
    expect(full.takeDown).toEqual(plain.takeDown);
  });

  it('takes the splice force just above the splice and the base force at the bottom of the column', () => {
    const result = analyseStack(withBase(doc), { concreteClass: 'C30/37' });
    expect(result.splices?.[0].NEd).toBeCloseTo(result.lifts[1].pieces[0].NEd, 9);
    expect(result.base?.NEd).toBeCloseTo(result.lifts[0].pieces[0].NEd, 9);
    expect(result.base?.status).toBe('passes');
  });

  it('asks class 2b splices for the A.6 tie force and flags a detail too weak for it', () => {
    // Tie force: largest storey reaction Gk + ψ1·Qk (EN 1991-1-7 A.6, EN 1990 eq. 6.11b, ψ1 = 0.5 for A):
    // +4: 120 + 0.5 × 80 = 160 kN; +8: 100 + 30 = 130 kN; roof: 60 + 0 = 60 kN → T = 160 kN
    const strong = analyseStack(detailed(doc, DETAIL), { consequenceClass: '2b' }).splices?.[0];
    expect(strong?.tieForce).toBeCloseTo(160, 9);
    expect(strong?.tension).toBeCloseTo(160, 9);
    // Packs (260.3 − 254.1)/2 = 3.1 mm < d/3, so βp = 1: bolts 2 × 4 × 94.08 = 752.6 kN (EN 1993-1-8 Table 3.4);
    // plates 2 × min(250 × 12 × 275, 0.9 × (250 − 44) × 12 × 410 / 1.25) = 2 × 729.7 = 1459.4 kN
    expect(strong?.NtRd).toBeCloseTo(752.64, 6);
    expect(strong).toMatchObject({ status: 'passes', meetsTie: true });
    // One M12 8.8 a flange: 2 × 0.6 × 800 × 84.3 / 1.25 = 64.7 kN < 160 kN
    const weak = analyseStack(detailed(doc, { ...DETAIL, bolts: { number: 1, diameter: 12, class: '8.8' } }), {
      consequenceClass: '3',
    }).splices?.[0];
    expect(weak?.NtRd).toBeCloseTo((2 * 0.6 * 800 * 84.3) / 1.25 / 1e3, 6);
    expect(weak).toMatchObject({ status: 'fails', meetsTie: false });
    expect(weak?.notes.some((n) => n.includes('systematic risk assessment'))).toBe(true);
  });

  it('asks no tie in classes 1 and 2a, and calls an undetailed 2b splice unmet', () => {
    expect(analyseStack(detailed(doc, DETAIL), { consequenceClass: '2a' }).splices?.[0]).toMatchObject({
      tieForce: null,
      meetsTie: null,
      tension: 0,
    });
    expect(analyseStack(doc, { consequenceClass: '2b' }).splices?.[0]).toMatchObject({
      status: 'not-given',
      meetsTie: false,
    });
  });
});

describe('robustness summary', () => {
  it('lists the splices that meet the tie force and those that do not', () => {
    const stacks = [
      { id: 1, name: 'A1', doc: detailed(doc, DETAIL) },
      { id: 2, name: 'A2', doc },
    ];
    const building = analyseBuilding(stacks, undefined, { consequenceClass: '2b' });
    const summary = robustnessSummary(building, '2b');
    expect(summary.meeting.map((r) => r.stackName)).toEqual(['A1']);
    expect(summary.notMeeting.map((r) => r.stackName)).toEqual(['A2']);
    expect(robustnessSummary(building, '2a')).toMatchObject({ tiesRequired: false, meeting: [], notMeeting: [] });
    expect(robustnessSummary(building, undefined).message).toContain('not given');
  });
});

describe('splices after sizing', () => {
  it('flags a detailed splice that the proposed sections leave failing, and keeps the proposal itself', () => {
    // One M12 8.8 bolt a flange in class 2b: 64.7 kN against a 160 kN tie, whatever sections sizing proposes
    const weak = detailed(doc, { ...DETAIL, bolts: { number: 1, diameter: 12, class: '8.8' } });
    const request = sizingRequestSchema.parse({ series: 'UKC', grade: 'S355' });
    const plain = sizeStack(doc, request, { consequenceClass: '2b' });
    const sized = sizeStack(weak, request, { consequenceClass: '2b' });
    expect(sized.lifts).toEqual(plain.lifts);
    expect(sized.lifts.some((l) => l.status === 'proposed')).toBe(true);
    expect(sized.spliceFlags?.[0]?.message).toMatch(/^Splice at \+5\.000 fails in tension with the proposed sections/);
    expect(plain.spliceFlags).toBeUndefined();
  });
});
