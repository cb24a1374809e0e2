import { describe, expect, it } from 'vitest';
import { validateStack } from '../../shared/engine/stack/validateStack.ts';
import type { StackDocument, StackEdge, StackNode } from '../../shared/schema/stack.ts';
import { buildStack, withNode } from './stack-builder.ts';

// Invented two-lift stack: support +0.000, lift L1 to a splice at +6.000, lift L2 to the cap at +12.000,
// floors at +4.000 and +8.000. Node ids: s, l1, p1, l2, c, r1, r2; edges e1…
const valid = (): StackDocument =>
  buildStack({
    lifts: [{ top: 6 }, { top: 12 }],
    floors: [
      { elevation: 4, Gk: 100, Qk: 50 },
      { elevation: 8, Gk: 100, Qk: 50 },
    ],
  });

const addNodes = (doc: StackDocument, ...nodes: StackNode[]): StackDocument => ({
  nodes: [...doc.nodes, ...nodes],
  edges: doc.edges,
});
const addEdges = (doc: StackDocument, ...edges: StackEdge[]): StackDocument => ({
  nodes: doc.nodes,
  edges: [...doc.edges, ...edges],
});
const dropEdge = (doc: StackDocument, source: string, target: string): StackDocument => ({
  nodes: doc.nodes,
  edges: doc.edges.filter((e) => !(e.source === source && e.target === target)),
});
const errorsOf = (doc: StackDocument) => validateStack(doc).errors;

describe('validateStack', () => {
  it('accepts a well-formed stack with no errors and the braced-frame warning', () => {
    const { errors, warnings } = validateStack(valid());
    expect(errors).toEqual([]);
    expect(warnings).toEqual([{ message: expect.stringContaining('braced (non-sway) frame in simple construction') }]);
  });

  it('reports an empty document as having neither support nor cap', () => {
    expect(errorsOf({ nodes: [], edges: [] })).toEqual([
      { message: 'The stack has no support' },
      { message: 'The stack has no cap' },
    ]);
  });

  it('reports a second support', () => {
    const doc = addNodes(valid(), { id: 's2', kind: 'support', data: { elevation: -1, fixity: 'fixed' } });
    expect(errorsOf(doc)).toContainEqual({ nodeId: 's2', message: 'The stack has more than one support' });
  });

  it('reports a lift with no node above it, and the cap left without a lift', () => {
    const errors = errorsOf(dropEdge(valid(), 'l2', 'c'));
    expect(errors).toContainEqual({ nodeId: 'l2', message: 'Lift L2 has no node above it' });
    expect(errors).toContainEqual({ nodeId: 'c', message: 'The cap has no lift below it' });
  });

  it('reports a restraint outside the lift it is attached to', () => {
    const doc = {
      nodes: valid().nodes,
      edges: valid().edges.map((e) => (e.source === 'r2' ? { ...e, target: 'l1' } : e)),
    };
    expect(errorsOf(doc)).toEqual([
      {
        nodeId: 'r2',
        message: 'Restraint at +8.000 is outside the lift it is attached to (lift L1 runs from +0.000 to +6.000)',
      },
    ]);
  });

  it('reports a connection to a node that does not exist', () => {
    const doc = addEdges(valid(), { id: 'e99', source: 'r1', target: 'ghost' });
    expect(errorsOf(doc)).toEqual([
      { nodeId: 'r1', edgeId: 'e99', message: 'Connection e99 points to a node ghost that does not exist' },
    ]);
  });

  it('reports a connection that points downward', () => {
    const doc = addEdges(valid(), { id: 'e99', source: 'l1', target: 's' });
    expect(errorsOf(doc)).toEqual([
      {
        nodeId: 'l1',
        edgeId: 'e99',
        message:
          'Connection e99 points from a lift down to the support; connections point upward, toward what carries the load',
      },
    ]);
  });

  it('reports a connection between kinds a stack does not allow', () => {
    const doc = addEdges(valid(), { id: 'e99', source: 's', target: 'c' });
    expect(errorsOf(doc)).toEqual([
      {
        nodeId: 's',
        edgeId: 'e99',
        message: 'Connection e99 joins the support to the cap, which a stack does not allow',
      },
    ]);
  });

  it('reports a chain that loops back on itself', () => {
    // s → l1 → p1 → l2 → p2 → l1, and nothing reaches the cap
    const looped = addEdges(
      addNodes(dropEdge(valid(), 'l2', 'c'), { id: 'p2', kind: 'splice', data: { elevation: 10 } }),
      { id: 'e90', source: 'l2', target: 'p2' },
      { id: 'e91', source: 'p2', target: 'l1' },
    );
    const errors = errorsOf(looped);
    expect(errors).toContainEqual({ nodeId: 'l1', message: 'The chain loops back on itself at Lift L1' });
    expect(errors).toContainEqual({ nodeId: 'c', message: 'The cap has no lift below it' });
  });

  it('reports a lift whose top is not above its bottom', () => {
    const doc = withNode(valid(), 'p1', (n) => (n.kind === 'splice' ? { ...n, data: { elevation: 13 } } : n));
    expect(errorsOf(doc)).toContainEqual({
      nodeId: 'l2',
      message: 'Lift L2 runs from +13.000 to +12.000: the node above a lift must be higher than the node below it',
    });
  });

  it('reports a restraint that is not attached to a lift', () => {
    expect(errorsOf(dropEdge(valid(), 'r1', 'l1'))).toEqual([
      { nodeId: 'r1', message: 'Restraint at +4.000 is not attached to a lift' },
    ]);
  });

  it('reports a load attached to a lift instead of a restraint or the cap', () => {
    const doc = addEdges(
      addNodes(valid(), { id: 'x1', kind: 'load', data: { label: 'Plant', Gk: 5, Qk: 5, category: 'E' } }),
      { id: 'e99', source: 'x1', target: 'l2' },
    );
    expect(errorsOf(doc)).toEqual([
      { nodeId: 'x1', edgeId: 'e99', message: 'Connection e99 joins a load to a lift, which a stack does not allow' },
      { nodeId: 'x1', message: 'Load "Plant" is not attached to a restraint or the cap' },
    ]);
  });

  it('reports a free cap above a restraint that is not fixed', () => {
    const doc = withNode(valid(), 'c', (n) => (n.kind === 'cap' ? { ...n, data: { ...n.data, fixity: 'free' } } : n));
    expect(errorsOf(doc)).toEqual([
      {
        nodeId: 'c',
        message: 'The free cap needs a fixed lower end about the y-y axis, but the restraint at +8.000 is pinned',
      },
      {
        nodeId: 'c',
        message: 'The free cap needs a fixed lower end about the z-z axis, but the restraint at +8.000 is pinned',
      },
    ]);
  });

  it('reports values the schema refuses, naming the node', () => {
    const doc = withNode(valid(), 'r1', (n) => (n.kind === 'restraint' ? { ...n, data: { ...n.data, Gk: -5 } } : n));
    expect(errorsOf(doc)).toEqual([{ nodeId: 'r1', message: 'Node r1 Gk: must not be negative' }]);
  });

  it('reports two restraints at the same elevation', () => {
    const doc = addEdges(
      addNodes(valid(), {
        id: 'r3',
        kind: 'restraint',
        data: { elevation: 8, axes: 'z', fixity: 'pinned', Gk: 0, Qk: 0, category: 'A' },
      }),
      { id: 'e99', source: 'r3', target: 'l2' },
    );
    expect(errorsOf(doc)).toEqual([
      { nodeId: 'r3', message: 'Restraint at +8.000 is at the same elevation as restraint r2' },
    ]);
  });

  it('reports a restraint at the support', () => {
    const doc = withNode(valid(), 'r1', (n) =>
      n.kind === 'restraint' ? { ...n, data: { ...n.data, elevation: 0 } } : n,
    );
    expect(errorsOf(doc)).toEqual([
      { nodeId: 'r1', message: 'Restraint at +0.000 is at the support, which already restrains the column there' },
    ]);
  });

  it('names a lift off the chain by its id', () => {
    const doc = addNodes(valid(), { id: 'stray', kind: 'lift', data: { section: 'UKC 203x203x46', grade: 'S275' } });
    expect(errorsOf(doc)).toEqual([
      { nodeId: 'stray', message: 'Lift stray is not connected to the chain that runs from the support to the cap' },
    ]);
  });

  it('reports two nodes with the same id', () => {
    const doc = addNodes(valid(), { id: 'p1', kind: 'splice', data: { elevation: 3 } });
    expect(errorsOf(doc)).toContainEqual({ nodeId: 'p1', message: 'Two nodes share the id p1' });
  });

  it('reports a fork: a support with two lifts above it', () => {
    const doc = addEdges(
      addNodes(valid(), { id: 'l9', kind: 'lift', data: { section: 'UKC 203x203x46', grade: 'S275' } }),
      {
        id: 'e99',
        source: 's',
        target: 'l9',
      },
    );
    const errors = errorsOf(doc);
    expect(errors).toContainEqual({ nodeId: 's', message: 'The support has more than one lift above it' });
    expect(errors).toContainEqual({
      nodeId: 'l9',
      message: 'Lift l9 is not connected to the chain that runs from the support to the cap',
    });
  });

  it('returns every problem, not only the first', () => {
    const doc = dropEdge(dropEdge(valid(), 'r1', 'l1'), 'l2', 'c');
    expect(errorsOf(doc).map((e) => e.nodeId)).toEqual(['l2', 'c', 'r1']);
  });

  it('prints negative elevations with a minus sign and three decimals', () => {
    const doc = buildStack({ base: { elevation: -3 }, lifts: [{ top: 4 }], floors: [{ elevation: -1.5 }] });
    const moved = { nodes: doc.nodes, edges: doc.edges.filter((e) => e.source !== 'r1') };
    expect(errorsOf(moved)).toEqual([{ nodeId: 'r1', message: 'Restraint at \u22121.500 is not attached to a lift' }]);
  });

  it('warns when a restraint refers to a level the building does not have', () => {
    const doc = buildStack({ lifts: [{ top: 12 }], floors: [{ elevation: 4, levelId: 'gone' }] });
    const { errors, warnings } = validateStack(doc, { levels: new Map([['lv1', 4]]) });
    expect(errors).toEqual([]);
    expect(warnings).toContainEqual({
      nodeId: 'r1',
      message: 'Restraint at +4.000 refers to a level the building no longer has; its own elevation is used',
    });
  });
});
