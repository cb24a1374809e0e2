// Properties of the critical buckling analysis that hold for any braced column (fast-check).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lowestLoadFactor, type BeamColumn } from '../../shared/engine/critical/index.ts';

interface Span {
  L: number;
  N: number;
  EI: number;
}

function column(spans: Span[], held: (joint: number) => boolean = () => true): BeamColumn {
  const nodes = [0];
  const EI: number[] = [];
  const N: number[] = [];
  const joints = [0];
  for (const s of spans) {
    const start = nodes[nodes.length - 1];
    for (let e = 1; e <= 4; e++) {
      nodes.push(start + (s.L * e) / 4);
      EI.push(s.EI);
      N.push(s.N);
    }
    joints.push(nodes.length - 1);
  }
  const lateralFixed = nodes.map(() => false);
  joints.forEach((k, j) => (lateralFixed[k] = j === 0 || j === joints.length - 1 || held(j)));
  return { nodes, EI, N, lateralFixed, rotationFixed: nodes.map(() => false), rotationSpring: nodes.map(() => 0) };
}

const alpha = (c: BeamColumn): number => {
  const s = lowestLoadFactor(c);
  if (!('alphaCr' in s)) throw new Error('no solution');
  return s.alphaCr;
};

const spans = fc.array(
  fc.record({
    L: fc.double({ min: 2.5, max: 6, noNaN: true }),
    N: fc.double({ min: 50, max: 5000, noNaN: true }),
    EI: fc.double({ min: 2000, max: 60000, noNaN: true }),
  }),
  {
    minLength: 1,
    maxLength: 6,
  },
);

describe('critical buckling properties', () => {
  it('αcr scales inversely with the forces (linear buckling)', () => {
    fc.assert(
      fc.property(spans, fc.double({ min: 0.2, max: 5, noNaN: true }), (s, c) => {
        const scaled = alpha(column(s.map((x) => ({ ...x, N: x.N * c }))));
        expect(Math.abs((scaled * c) / alpha(column(s)) - 1)).toBeLessThan(1e-7);
      }),
      { numRuns: 40 },
    );
  });

  it('more force anywhere never raises αcr, and holding a joint never lowers it', () => {
    fc.assert(
      fc.property(spans, fc.nat(), (s, pick) => {
        const base = alpha(column(s));
        const i = pick % s.length;
        const heavier = alpha(column(s.map((x, j) => (j === i ? { ...x, N: x.N * 1.5 } : x))));
        expect(heavier).toBeLessThanOrEqual(base * (1 + 1e-9));
        if (s.length > 1) {
          const loose = alpha(column(s, (j) => j !== 1));
          expect(loose).toBeLessThanOrEqual(base * (1 + 1e-9));
        }
      }),
      { numRuns: 40 },
    );
  });

  it('a stack reversed end for end has the same αcr (pinned ends)', () => {
    fc.assert(
      fc.property(spans, (s) => {
        const a = alpha(column(s));
        expect(Math.abs(alpha(column([...s].reverse())) / a - 1)).toBeLessThan(1e-7);
      }),
      { numRuns: 40 },
    );
  });
});
