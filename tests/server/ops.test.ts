import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseStack } from '../../shared/engine/index.ts';
import { applyOps, OpError, touchedIds } from '../../shared/ops/applyOps.ts';
import { SPLICE_ABOVE_FLOOR_M, stackFromTemplate } from '../../shared/ops/stackFromTemplate.ts';
import { stackTemplateSchema } from '../../shared/schema/api.ts';
import { stackDocumentSchema, type StackDocument } from '../../shared/schema/stack.ts';
import { diffDocs } from '../../server/services/docDiff.ts';

const template = stackTemplateSchema.parse({
  storeys: 5,
  storeyHeight: 3.5,
  spliceEvery: 2,
  sections: ['UKC 254x254x89', 'UKC 203x203x46'],
  Gk: 100,
  Qk: 50,
});
const base = stackFromTemplate(template);

const canonical = (d: StackDocument) => ({
  nodes: [...d.nodes].sort((a, b) => a.id.localeCompare(b.id)),
  edges: [...d.edges].sort((a, b) => a.id.localeCompare(b.id)),
});

describe('applyOps', () => {
  it('adds, updates, moves and removes nodes and edges without changing its input', () => {
    const frozen = JSON.stringify(base);
    const out = applyOps(base, [
      { op: 'addNode', node: { id: 'extra', kind: 'load', data: { label: 'Plant', Gk: 20, Qk: 0, category: 'H' } } },
      { op: 'addEdge', edge: { id: 'e-extra', source: 'extra', target: 'cap' } },
      { op: 'updateNode', id: 'restraint-1', data: { Gk: 140 } },
      { op: 'moveNode', id: 'lift-1', position: { x: 5, y: 6 } },
      { op: 'removeEdge', id: 'e-restraint-2-lift-1' },
    ]);
    expect(JSON.stringify(base)).toBe(frozen);
    expect(out.nodes.find((n) => n.id === 'restraint-1')).toMatchObject({ data: { Gk: 140, Qk: 50 } });
    expect(out.nodes.find((n) => n.id === 'lift-1')?.position).toEqual({ x: 5, y: 6 });
    expect(out.edges.some((e) => e.id === 'e-extra')).toBe(true);
    expect(out.edges.some((e) => e.id === 'e-restraint-2-lift-1')).toBe(false);
  });

  it('removeNode also drops every edge of the node', () => {
    const out = applyOps(base, [{ op: 'removeNode', id: 'lift-1' }]);
    expect(out.edges.filter((e) => e.source === 'lift-1' || e.target === 'lift-1')).toEqual([]);
  });

  it.each([
    ['an unknown node', { op: 'updateNode', id: 'nope', data: {} }, 'nope'],
    ['a duplicate node id', { op: 'addNode', node: { id: 'cap', kind: 'splice', data: { elevation: 1 } } }, 'cap'],
    ['an edge to a missing node', { op: 'addEdge', edge: { id: 'e-new', source: 'ghost', target: 'cap' } }, 'e-new'],
    ['a merge that breaks the kind schema', { op: 'updateNode', id: 'lift-1', data: { grade: 'S999' } }, 'lift-1'],
    ['an unknown key merged into data', { op: 'updateNode', id: 'support', data: { colour: 'red' } }, 'support'],
    ['removing an unknown edge', { op: 'removeEdge', id: 'e-none' }, 'e-none'],
  ] as const)('throws OpError with the op index and id for %s', (_label, op, id) => {
    try {
      applyOps(base, [{ op: 'moveNode', id: 'cap', position: { x: 0, y: 0 } }, op]);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(OpError);
      expect((e as OpError).opIndex).toBe(1);
      expect((e as OpError).id).toBe(id);
    }
  });
});

describe('touchedIds', () => {
  it('counts a removed node and its edges, and an added edge with both ends', () => {
    expect([...touchedIds(base, [{ op: 'removeNode', id: 'restraint-1' }])].sort()).toEqual([
      'e-restraint-1-lift-1',
      'restraint-1',
    ]);
    expect(
      [...touchedIds(base, [{ op: 'addEdge', edge: { id: 'e9', source: 'restraint-1', target: 'lift-2' } }])].sort(),
    ).toEqual(['e9', 'lift-2', 'restraint-1']);
  });
});

describe('diffDocs (a whole-document write as ops)', () => {
  it('gives no ops for an unchanged document', () => {
    expect(diffDocs(base, structuredClone(base))).toEqual([]);
  });

  it('replaces a node whose kind changed or whose data lost a key, and re-adds its surviving edges', () => {
    const after = structuredClone(base);
    const i = after.nodes.findIndex((n) => n.id === 'splice-1');
    after.nodes[i] = {
      id: 'splice-1',
      kind: 'restraint',
      data: { elevation: 7.5, axes: 'both', fixity: 'pinned', Gk: 0, Qk: 0, category: 'A' },
    };
    const ops = diffDocs(base, after);
    expect(canonical(applyOps(base, ops))).toEqual(canonical(after));
  });

  it('turns any edited template document back into itself: applyOps(before, diffDocs(before, after)) equals after', () => {
    const docs = fc.record({
      storeys: fc.integer({ min: 1, max: 8 }),
      spliceEvery: fc.integer({ min: 1, max: 3 }),
      dropEvery: fc.integer({ min: 2, max: 5 }),
      gk: fc.integer({ min: 0, max: 500 }),
      dropPositions: fc.boolean(),
    });
    fc.assert(
      fc.property(docs, (p) => {
        const before = stackFromTemplate(
          stackTemplateSchema.parse({ ...template, storeys: p.storeys, spliceEvery: p.spliceEvery }),
        );
        const after: StackDocument = {
          nodes: before.nodes
            .filter((_, i) => i % p.dropEvery !== 1)
            .map((n) => (n.kind === 'restraint' ? { ...n, data: { ...n.data, Gk: p.gk } } : n))
            .map((n) => (p.dropPositions ? ({ id: n.id, kind: n.kind, data: n.data } as typeof n) : n)),
          edges: before.edges.filter((_, i) => i % p.dropEvery !== 0),
        };
        after.nodes.push({ id: 'added', kind: 'splice', data: { elevation: 1 } });
        after.edges.push({ id: 'e-added', source: 'added', target: before.nodes[0].id });
        const cleaned = {
          nodes: after.nodes,
          edges: after.edges.filter(
            (e) => after.nodes.some((n) => n.id === e.source) && after.nodes.some((n) => n.id === e.target),
          ),
        };
        expect(canonical(applyOps(before, diffDocs(before, cleaned)))).toEqual(canonical(cleaned));
      }),
      { numRuns: 200 },
    );
  });
});

describe('stackFromTemplate', () => {
  it('builds support, lifts of spliceEvery storeys, splices above the floors, a restraint per floor and a pinned roof cap', () => {
    expect(stackDocumentSchema.safeParse(base).success).toBe(true);
    const kinds = (k: string) => base.nodes.filter((n) => n.kind === k);
    // 5 storeys, splice every 2: lifts over storeys 1–2, 3–4, 5; floors at levels 1–4; roof is the cap.
    expect(kinds('lift')).toHaveLength(3);
    expect(kinds('splice').map((n) => n.kind === 'splice' && n.data.elevation)).toEqual([
      7 + SPLICE_ABOVE_FLOOR_M,
      14 + SPLICE_ABOVE_FLOOR_M,
    ]);
    expect(kinds('restraint').map((n) => n.kind === 'restraint' && n.data.elevation)).toEqual([3.5, 7, 10.5, 14]);
    expect(kinds('cap')).toEqual([
      expect.objectContaining({ data: { elevation: 17.5, fixity: 'pinned', Gk: 100, Qk: 50, category: 'H' } }),
    ]);
    expect(kinds('lift').map((n) => n.kind === 'lift' && n.data.section)).toEqual([
      'UKC 254x254x89',
      'UKC 203x203x46',
      'UKC 203x203x46',
    ]);
  });

  it('links restraints to the building level at the same elevation', () => {
    const doc = stackFromTemplate(template, [{ id: '42', name: 'Level 2', elevation: 7 }]);
    const linked = doc.nodes.filter((n) => n.kind === 'restraint' && n.data.levelId === '42');
    expect(linked.map((n) => n.id)).toEqual(['restraint-2']);
  });

  it('gives a document the engine analyses without errors, with the base force from EN 1990 eq. 6.10a/b', () => {
    const doc = stackFromTemplate(template);
    const result = analyseStack(doc, { selfWeight: false, imposedReduction: false, annex: 'UK' });
    expect(result.errors).toEqual([]);
    // Hand calculation (EN 1990 Table A1.2(B), UK NA: ξ = 0.925, ψ0 = 0.7 for A–D and for H roofs):
    // ΣGk = 5 × 100 = 500 kN; ΣQk(B) = 4 × 50 = 200 kN; Qk(H) = 50 kN.
    // 6.10a = 1.35×500 + 1.5×0.7×(200 + 50) = 675 + 262.5 = 937.5 kN
    // 6.10b, B leading = 0.925×1.35×500 + 1.5×200 + 1.5×0.7×50 = 624.375 + 300 + 52.5 = 976.875 kN
    const bottom = result.lifts[0].pieces[0];
    expect(bottom.NEd).toBeCloseTo(976.875, 3);
  });
});
