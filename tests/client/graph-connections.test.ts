// Connection rules of the graph (docs/contracts.md §Stack document) and placing nodes by elevation.
import { describe, expect, it } from 'vitest';
import type { StackDocument } from '@shared/schema/stack.ts';
import { applyOps } from '@shared/ops/applyOps.ts';
import { connectionRefusal } from '@/components/graph/connectionRules.ts';
import { PX_PER_METRE, layoutByElevation } from '@/utils/layoutByElevation.ts';
import { inverseOps } from '@/utils/inverseOps.ts';
import { copySelection, pasteOps } from '@/utils/clipboardOps.ts';

// Invented stack: pinned base at ±0, lift L1 to a splice at +8, lift L2 to the cap at +12.
const doc: StackDocument = {
  nodes: [
    { id: 'sup', kind: 'support', data: { elevation: 0, fixity: 'pinned' } },
    { id: 'l1', kind: 'lift', data: { section: 'UKC 254x254x73', grade: 'S355' } },
    { id: 'sp', kind: 'splice', data: { elevation: 8 } },
    { id: 'l2', kind: 'lift', data: { section: 'UKC 203x203x46', grade: 'S355' } },
    { id: 'cap', kind: 'cap', data: { elevation: 12, fixity: 'pinned', Gk: 50, Qk: 10, category: 'H' } },
    {
      id: 'r4',
      kind: 'restraint',
      data: { elevation: 4, axes: 'both', fixity: 'pinned', Gk: 100, Qk: 40, category: 'B' },
    },
    {
      id: 'r10',
      kind: 'restraint',
      data: { elevation: 10, axes: 'both', fixity: 'pinned', Gk: 100, Qk: 40, category: 'B' },
    },
    { id: 'ld', kind: 'load', data: { label: 'Façade', Gk: 12, Qk: 0, category: 'A' } },
    { id: 'l3', kind: 'lift', data: { section: 'UKC 152x152x23', grade: 'S275' } },
  ],
  edges: [
    { id: 'e1', source: 'sup', target: 'l1' },
    { id: 'e2', source: 'l1', target: 'sp' },
    { id: 'e3', source: 'sp', target: 'l2' },
    { id: 'e4', source: 'l2', target: 'cap' },
    { id: 'e5', source: 'r4', target: 'l1' },
  ],
};

describe('connection rules', () => {
  it('allow the connections of the stack document', () => {
    expect(connectionRefusal(doc, 'r10', 'l2')).toBeNull();
    expect(connectionRefusal(doc, 'ld', 'r10')).toBeNull();
    expect(connectionRefusal(doc, 'ld', 'cap')).toBeNull();
  });

  it('refuse a kind pair the document does not allow, saying what the node connects to', () => {
    expect(connectionRefusal(doc, 'cap', 'l2')).toMatch(/nothing connects from it/);
    expect(connectionRefusal(doc, 'r10', 'cap')).toMatch(/only to the lift it braces/);
    expect(connectionRefusal(doc, 'sup', 'sp')).toMatch(/only to the lift directly above/);
    expect(connectionRefusal(doc, 'ld', 'l1')).toMatch(/restraint or cap/);
  });

  it('refuse a second node above or below, a repeated edge and a self-loop', () => {
    expect(connectionRefusal(doc, 'sup', 'l3')).toMatch(/already has a node above it/);
    expect(connectionRefusal(doc, 'l3', 'sp')).toMatch(/already has a lift below it/);
    expect(connectionRefusal(doc, 'r4', 'l1')).toMatch(/already connected/);
    expect(connectionRefusal(doc, 'l1', 'l1')).toMatch(/itself/);
  });

  it('refuse a restraint outside the lift it would brace, naming the elevations', () => {
    expect(connectionRefusal(doc, 'r10', 'l1')).toBe('Restraint at +10.000 is outside this lift (+0.000 to +8.000).');
  });
});

describe('placing by elevation', () => {
  it('puts y at minus elevation times the scale, lifts at mid-span and restraints to the side', () => {
    const at = layoutByElevation(doc);
    expect(at.get('sp')).toEqual({ x: 0, y: -8 * PX_PER_METRE });
    expect(at.get('l1')?.y).toBe(-4 * PX_PER_METRE);
    expect(at.get('r4')?.y).toBe(-4 * PX_PER_METRE);
    expect(at.get('r4')?.x).toBeGreaterThan(0);
    expect(at.get('cap')?.y).toBeLessThan(at.get('sup')?.y ?? 0);
  });
});

describe('undo and paste ops', () => {
  it('undo of a removed node restores it with its edges', () => {
    const ops = [{ op: 'removeNode' as const, id: 'l1' }];
    const after = applyOps(doc, ops);
    expect(after.edges.some((e) => e.target === 'l1')).toBe(false);
    const restored = applyOps(after, inverseOps(doc, ops, applyOps));
    expect(restored.nodes.find((n) => n.id === 'l1')).toEqual(doc.nodes.find((n) => n.id === 'l1'));
    expect(restored.edges.map((e) => e.id).sort()).toEqual(doc.edges.map((e) => e.id).sort());
  });

  it('undo of a change to a key the node did not have re-creates the node without it', () => {
    const ops = [{ op: 'updateNode' as const, id: 'l2', data: { kZ: 1.2, note: 'long splice' } }];
    const back = applyOps(applyOps(doc, ops), inverseOps(doc, ops, applyOps));
    expect(back.nodes.find((n) => n.id === 'l2')?.data).toEqual({ section: 'UKC 203x203x46', grade: 'S355' });
  });

  it('paste adds copies under new ids with the edges between the copied nodes only', () => {
    const { ops, newIds } = pasteOps(doc, copySelection(doc, ['r4', 'l1', 'sp']), () => ({ x: 0, y: 0 }));
    const after = applyOps(doc, ops);
    expect(newIds).toHaveLength(3);
    expect(after.nodes).toHaveLength(doc.nodes.length + 3);
    // r4→l1 and l1→sp are inside the copy; sup→l1 is not
    expect(after.edges).toHaveLength(doc.edges.length + 2);
    expect(newIds.some((id) => doc.nodes.some((n) => n.id === id))).toBe(false);
  });
});
