// Property tests of the stack analysis over generated valid stacks (fast-check). Demo data, invented.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseStack } from '../../shared/engine/stack/index.ts';
import type { AnalysisOptions } from '../../shared/schema/results.ts';
import type { Category, Fixity, StackDocument, StackEdge, StackNode } from '../../shared/schema/stack.ts';

const SECTIONS = [
  'UKC 152x152x23',
  'UKC 203x203x46',
  'UKC 254x254x73',
  'UKC 305x305x118',
  'HE 300 B',
  'SHS 200x200x10',
];
const fixity = fc.constantFrom<Fixity>('pinned', 'partial', 'fixed');
const category = fc.constantFrom<Category>('A', 'B', 'C', 'D', 'E', 'H');
// Biased toward empty and light loads, the cases where αn and the combinations behave least simply.
const loads = {
  Gk: fc.oneof(fc.constant(0), fc.integer({ min: 0, max: 400 })),
  Qk: fc.oneof(fc.constant(0), fc.integer({ min: 1, max: 10 }), fc.integer({ min: 0, max: 200 })),
  category: fc.oneof(fc.constant<Category>('A'), category),
};

const storey = fc.record({
  heightMm: fc.integer({ min: 2500, max: 5000 }),
  splice: fc.boolean(),
  section: fc.constantFrom(...SECTIONS),
  axes: fc.constantFrom('both' as const, 'y' as const, 'z' as const),
  fixity,
  ...loads,
  extra: fc.option(fc.record(loads), { nil: undefined }),
});

const options: fc.Arbitrary<AnalysisOptions> = fc.record({
  combination: fc.constantFrom('6.10' as const, '6.10ab' as const),
  annex: fc.constantFrom('UK' as const, 'EN' as const),
  imposedReduction: fc.boolean(),
  selfWeight: fc.boolean(),
});

/** A valid stack: storeys bottom up, a restraint at the top of each storey but the last, the cap on top. */
const stackDoc: fc.Arbitrary<StackDocument> = fc
  .record({
    base: fixity,
    cap: fc.record({ fixity, ...loads }),
    storeys: fc.array(storey, { minLength: 1, maxLength: 14 }),
  })
  .map(({ base, cap, storeys }) => {
    const nodes: StackNode[] = [{ id: 'base', kind: 'support', data: { elevation: 0, fixity: base } }];
    const edges: StackEdge[] = [];
    const link = (source: string, target: string): void => void edges.push({ id: `e${edges.length}`, source, target });
    let mm = 0;
    let below = 'base';
    let lift = '';
    storeys.forEach((s, i) => {
      if (!lift) {
        lift = `lift${i}`;
        nodes.push({ id: lift, kind: 'lift', data: { section: s.section, grade: 'S355' } });
        link(below, lift);
      }
      mm += s.heightMm;
      const elevation = mm / 1000;
      if (i === storeys.length - 1) {
        nodes.push({ id: 'cap', kind: 'cap', data: { elevation, ...cap } });
        link(lift, 'cap');
        return;
      }
      nodes.push({
        id: `floor${i}`,
        kind: 'restraint',
        data: { elevation, axes: s.axes, fixity: s.fixity, Gk: s.Gk, Qk: s.Qk, category: s.category },
      });
      link(`floor${i}`, lift);
      if (s.extra) {
        nodes.push({ id: `extra${i}`, kind: 'load', data: { label: `Extra ${i}`, ...s.extra } });
        link(`extra${i}`, `floor${i}`);
      }
      if (s.splice) {
        nodes.push({ id: `splice${i}`, kind: 'splice', data: { elevation } });
        link(lift, `splice${i}`);
        below = `splice${i}`;
        lift = '';
      }
    });
    return { nodes, edges };
  });

function analysed(doc: StackDocument, opts: AnalysisOptions) {
  const result = analyseStack(doc, opts);
  expect(result.errors).toEqual([]);
  return result;
}

describe('analyseStack properties', () => {
  it('design axial force never decreases going down the stack', () => {
    fc.assert(
      fc.property(stackDoc, options, (doc, opts) => {
        const result = analysed(doc, opts);
        const pieces = result.lifts.flatMap((l) => l.pieces).sort((a, b) => b.from - a.from);
        for (let i = 1; i < pieces.length; i++) expect(pieces[i].NEd).toBeGreaterThanOrEqual(pieces[i - 1].NEd);
        for (let i = 1; i < result.takeDown.length; i++)
          expect(result.takeDown[i].NEd).toBeGreaterThanOrEqual(result.takeDown[i - 1].NEd);
      }),
      { numRuns: 150 },
    );
  });

  it('raising a load that is present never lowers any utilisation', () => {
    // Raising an imposed load from zero is left out on purpose: it adds a loaded storey, and EN 1991-1-1
    // 6.3.1.2(11) then lowers αn on the whole leading load below it.
    const raised = stackDoc.chain((doc) => {
      const loaded = doc.nodes.filter((n) => n.kind === 'restraint' || n.kind === 'cap' || n.kind === 'load');
      return fc.record({
        doc: fc.constant(doc),
        node: fc.constantFrom(...loaded),
        field: fc.constantFrom('Gk' as const, 'Qk' as const),
        delta: fc.integer({ min: 1, max: 500 }),
        opts: options,
      });
    });
    fc.assert(
      fc.property(raised, ({ doc, node, field, delta, opts }) => {
        if (!('Gk' in node.data)) return;
        if (field === 'Qk' && node.data.Qk === 0) return;
        const changed = { ...node, data: { ...node.data, [field]: node.data[field] + delta } } as StackNode;
        const before = analysed(doc, opts).lifts.flatMap((l) => l.pieces);
        const after = analysed(
          { nodes: doc.nodes.map((n) => (n.id === node.id ? changed : n)), edges: doc.edges },
          opts,
        ).lifts.flatMap((l) => l.pieces);
        expect(after.length).toBe(before.length);
        after.forEach((p, i) => expect(p.utilisation).toBeGreaterThanOrEqual(before[i].utilisation * (1 - 1e-12)));
      }),
      { numRuns: 150 },
    );
  });

  it('gives the same result whatever the order of nodes and edges in the document', () => {
    const shuffled = stackDoc.chain((doc) =>
      fc.record({
        doc: fc.constant(doc),
        nodes: fc.shuffledSubarray(doc.nodes, { minLength: doc.nodes.length, maxLength: doc.nodes.length }),
        edges: fc.shuffledSubarray(doc.edges, { minLength: doc.edges.length, maxLength: doc.edges.length }),
        opts: options,
      }),
    );
    fc.assert(
      fc.property(shuffled, ({ doc, nodes, edges, opts }) => {
        expect(analyseStack({ nodes, edges }, opts)).toEqual(analyseStack(doc, opts));
      }),
      { numRuns: 100 },
    );
  });
});
