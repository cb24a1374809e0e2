import { describe, expect, it } from 'vitest';
import { NO_FACE_REACTIONS_NOTE } from '../../shared/engine/simple/applyNominalMoments.ts';
import { analyseStack } from '../../shared/engine/stack/analyseStack.ts';
import { stackFromTemplate } from '../../shared/ops/stackFromTemplate.ts';
import type { PieceCheck, StackResult } from '../../shared/schema/results.ts';
import {
  restraintDataSchema,
  stackDocumentSchema,
  type RestraintFaces,
  type StackDocument,
} from '../../shared/schema/stack.ts';
import { DEMO_STACKS } from '../../seeds/demo.ts';
import { buildStack, withNode } from './stack-builder.ts';

// Two storeys of 4.5 m, UKC 254x254x73 S355 throughout, floor at +4.5 with 150/60 kN, roof cap 100/40 kN
// (invented). The combined-check formulas themselves are checked by hand in simple-combined.test.ts.
const base = buildStack({
  lifts: [{ top: 9, section: 'UKC 254x254x73' }],
  floors: [{ elevation: 4.5, Gk: 150, Qk: 60 }],
  cap: { Gk: 100, Qk: 40, category: 'H' },
});
const withFaces = (doc: StackDocument, faces: RestraintFaces): StackDocument =>
  withNode(doc, 'r1', (n) => (n.kind === 'restraint' ? { ...n, data: { ...n.data, faces } } : n));
const EDGE_FACES: RestraintFaces = { yPlus: { Gk: 60, Qk: 40 }, zPlus: { Gk: 30, Qk: 20 }, zMinus: { Gk: 20, Qk: 15 } };

/** The fields of the axial check, which nominal moments must never change. */
function axialFields(result: StackResult) {
  return {
    takeDown: result.takeDown,
    pieces: result.lifts.flatMap((l) =>
      l.pieces.map((p: PieceCheck) => ({
        NEd: p.NEd,
        NEdY: p.NEdY,
        NEdZ: p.NEdZ,
        LcrY: p.LcrY,
        LcrZ: p.LcrZ,
        NbRdY: p.check.NbRdY,
        NbRdZ: p.check.NbRdZ,
        axial: p.axialUtilisation ?? p.utilisation,
      })),
    ),
  };
}

describe('restraint faces in the document', () => {
  it('keep documents without faces valid, and accept Gk/Qk pairs on any face', () => {
    expect(stackDocumentSchema.safeParse(base).success).toBe(true);
    expect(stackDocumentSchema.safeParse(withFaces(base, EDGE_FACES)).success).toBe(true);
  });

  it('refuse a negative face reaction and an unknown face', () => {
    const data = { elevation: 4, axes: 'both', fixity: 'pinned', Gk: 10, Qk: 5, category: 'A' };
    expect(restraintDataSchema.safeParse({ ...data, faces: { yPlus: { Gk: -1, Qk: 0 } } }).success).toBe(false);
    expect(restraintDataSchema.safeParse({ ...data, faces: { north: { Gk: 1, Qk: 0 } } }).success).toBe(false);
  });
});

describe('analyseStack with nominal moments', () => {
  it('leaves every demo stack without faces exactly as the axial analysis had it', () => {
    for (const { template } of DEMO_STACKS) {
      const doc = stackFromTemplate(template);
      const on = analyseStack(doc);
      expect(on.errors).toEqual([]);
      // The same figures, with a note that the combined check is not made (no face reactions)
      const off = analyseStack(doc, { nominalMoments: false });
      expect(on.warnings).toEqual([...off.warnings, NO_FACE_REACTIONS_NOTE]);
      expect({ ...on, warnings: off.warnings }).toEqual(off);
      for (const lift of on.lifts) {
        expect(lift.governing).not.toBe('combined');
        for (const p of lift.pieces) expect(p.combined).toBeUndefined();
      }
    }
  });

  it('does not change the axial results when faces are added', () => {
    const plain = analyseStack(base);
    const faced = analyseStack(withFaces(base, EDGE_FACES));
    expect(axialFields(faced)).toEqual(axialFields(plain));
  });

  it('checks both storeys beside the loaded floor with half the floor moment each', () => {
    const result = analyseStack(withFaces(base, EDGE_FACES));
    const pieces = result.lifts[0].pieces;
    expect(pieces).toHaveLength(2);
    for (const p of pieces) {
      // 134.925 kN × 227.05 mm / 2 and 42.4875 kN × 104.3 mm / 2 (worked in simple-combined.test.ts)
      expect(p.combined?.MyEd).toBeCloseTo(15.317e6, -4);
      expect(p.combined?.MzEd).toBeCloseTo(2.2157e6, -3);
      expect(p.combined?.axialTerm).toBeCloseTo(
        Math.max((p.NEdY * 1000) / p.check.NbRdY, (p.NEdZ * 1000) / p.check.NbRdZ),
        12,
      );
      expect(p.utilisation).toBeCloseTo(
        Math.max(p.axialUtilisation ?? p.utilisation, p.combined?.utilisation ?? 0),
        12,
      );
    }
  });

  it('lets the combined check govern the lift when it is the larger, with its working', () => {
    const result = analyseStack(withFaces(base, EDGE_FACES));
    const lift = result.lifts[0];
    expect(lift.governing).toBe('combined');
    const worst = lift.pieces.reduce((a, b) => (b.utilisation > a.utilisation ? b : a));
    expect(lift.utilisation).toBe(worst.utilisation);
    expect(worst.axialUtilisation).toBeLessThan(worst.utilisation);
    expect(worst.combined?.steps.some((s) => s.symbol === 'Mb,Rd')).toBe(true);
    expect(worst.combined?.steps.some((s) => s.symbol === 'Ry,net')).toBe(true);
    expect(worst.check.steps.length).toBeGreaterThan(0);
  });

  it('does not carry a floor’s moment past the next floor', () => {
    const three = buildStack({
      lifts: [{ top: 12, section: 'UKC 254x254x73' }],
      floors: [
        { elevation: 4, Gk: 150, Qk: 60 },
        { elevation: 8, Gk: 150, Qk: 60 },
      ],
    });
    const doc = withFaces(three, { yPlus: { Gk: 60, Qk: 40 } });
    const pieces = analyseStack(doc).lifts[0].pieces;
    expect(pieces.map((p) => p.combined !== undefined)).toEqual([true, true, false]);
  });

  it('says on the stack when the option is on but no face reactions give a moment, and not when it is off', () => {
    expect(analyseStack(base).warnings).toContainEqual(NO_FACE_REACTIONS_NOTE);
    expect(analyseStack(base, { nominalMoments: false }).warnings).not.toContainEqual(NO_FACE_REACTIONS_NOTE);
    expect(analyseStack(withFaces(base, EDGE_FACES)).warnings).not.toContainEqual(NO_FACE_REACTIONS_NOTE);
  });

  it('can be switched off per building', () => {
    const result = analyseStack(withFaces(base, EDGE_FACES), { nominalMoments: false });
    expect(result.lifts[0].pieces.every((p) => p.combined === undefined)).toBe(true);
    expect(result.lifts[0].governing).not.toBe('combined');
  });

  it('warns when the faces add up to more than the floor brings in', () => {
    const result = analyseStack(withFaces(base, { yPlus: { Gk: 100, Qk: 40 }, yMinus: { Gk: 100, Qk: 0 } }));
    expect(result.errors).toEqual([]);
    expect(result.warnings.some((w) => w.nodeId === 'r1' && w.message.includes('face reactions'))).toBe(true);
  });

  it('reports a class 4 lift under nominal moments as an error instead of passing it', () => {
    const slender = buildStack({
      lifts: [{ top: 9, section: { shape: 'I', make: 'welded', h: 800, b: 300, tw: 8, tf: 20, r: 0 } }],
      floors: [{ elevation: 4.5, Gk: 150, Qk: 60 }],
    });
    const result = analyseStack(withFaces(slender, { yPlus: { Gk: 60, Qk: 40 } }));
    expect(result.errors.some((e) => e.nodeId === 'l1' && e.message.includes('class 4'))).toBe(true);
  });
});
