// Sizing when beams bring their reactions to the column faces (nominal moments of simple construction).
// The lifts are then coupled through the moment sharing, so the yardstick is the whole-stack analysis.
import { describe, expect, it } from 'vitest';
import { analyseStack, sizeStack } from '../../shared/engine/index.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { accepted, officeStack, request } from './sizing-helpers.ts';

/** The office stack with edge-beam reactions on one flange and both web faces at every floor (invented). */
function facedStack(): StackDocument {
  const doc = officeStack();
  const faces = { yPlus: { Gk: 80, Qk: 40 }, zPlus: { Gk: 20, Qk: 10 }, zMinus: { Gk: 20, Qk: 10 } };
  return { edges: doc.edges, nodes: doc.nodes.map((n) => (n.kind === 'restraint' ? { ...n, data: { ...n.data, faces } } : n)) };
}

describe('sizing with nominal moments', () => {
  it.each([
    { noUpwardIncrease: false, sameSerialSize: false },
    { noUpwardIncrease: true, sameSerialSize: false },
    { noUpwardIncrease: true, sameSerialSize: true },
  ])('proposes sections that pass the whole-stack analysis, moments included, with %o', (rules) => {
    const doc = facedStack();
    const sizing = sizeStack(doc, request({ ...rules, target: 0.9 }));
    expect(sizing.complete).toBe(true);
    const result = analyseStack(accepted(doc, sizing));
    expect(result.lifts.some((l) => l.pieces.some((p) => p.combined))).toBe(true);
    sizing.lifts.forEach((row, i) => {
      expect(row.after!.utilisation).toBeCloseTo(result.lifts[i].utilisation, 9);
      expect(result.lifts[i].utilisation).toBeLessThanOrEqual(0.9);
    });
  });

  it('needs heavier lifts than the axial load alone, and shows "before" as the analysis gives it', () => {
    const doc = facedStack();
    const withMoments = sizeStack(doc, request({ noUpwardIncrease: false }));
    const axialOnly = sizeStack(doc, request({ noUpwardIncrease: false }), { nominalMoments: false });
    withMoments.lifts.forEach((row, i) => expect(row.after!.massPerMetre).toBeGreaterThanOrEqual(axialOnly.lifts[i].after!.massPerMetre));
    expect(withMoments.massAfter!).toBeGreaterThan(axialOnly.massAfter!);
    const before = analyseStack(doc).lifts.map((l) => l.utilisation);
    withMoments.lifts.forEach((row, i) => expect(row.before.utilisation).toBeCloseTo(before[i], 9));
  });
});
