// The eigenvalue buckling analysis of a beam-column (shared/engine/critical) against closed-form
// results. Each characteristic equation is solved here by bisection, independently of the engine.
import { describe, expect, it } from 'vitest';
import { lowestLoadFactor, type BeamColumn } from '../../shared/engine/critical/index.ts';

const EI = 15_000; // kN·m², about a UKC 254x254x73 about y-y; any value will do
type End = 'pinned' | 'fixed' | 'free' | { spring: number };

/** A column of spans (m) with EI and compression N per span, 4 elements per span, held laterally at every span end except a free top. */
function column(spans: { L: number; N: number; EI?: number }[], bottom: End, top: End, perSpan = 4): BeamColumn {
  const nodes = [0];
  const EIs: number[] = [];
  const N: number[] = [];
  const joints = [0];
  for (const s of spans) {
    const start = nodes[nodes.length - 1];
    for (let e = 1; e <= perSpan; e++) {
      nodes.push(start + (s.L * e) / perSpan);
      EIs.push(s.EI ?? EI);
      N.push(s.N);
    }
    joints.push(nodes.length - 1);
  }
  const count = nodes.length;
  const c: BeamColumn = {
    nodes,
    EI: EIs,
    N,
    lateralFixed: new Array<boolean>(count).fill(false),
    rotationFixed: new Array<boolean>(count).fill(false),
    rotationSpring: new Array<number>(count).fill(0),
  };
  for (const j of joints) c.lateralFixed[j] = true;
  const end = (k: number, fixity: End): void => {
    if (fixity === 'fixed') c.rotationFixed[k] = true;
    else if (fixity === 'free') c.lateralFixed[k] = false;
    else if (typeof fixity === 'object') c.rotationSpring[k] = fixity.spring;
  };
  end(0, bottom);
  end(count - 1, top);
  return c;
}

function alphaCr(c: BeamColumn): number {
  const s = lowestLoadFactor(c);
  if (!('alphaCr' in s)) throw new Error(`no solution: ${JSON.stringify(s)}`);
  return s.alphaCr;
}

/** Effective length factor k of a single span of length L under N = 1: k = π√(EI/Ncr)/L. */
const kOf = (Ncr: number, L: number, stiffness = EI): number => (Math.PI * Math.sqrt(stiffness / Ncr)) / L;

/** First root of f in (a, b) by scanning in steps then bisecting. */
function firstRoot(f: (x: number) => number, a: number, b: number, steps = 4000): number {
  let x0 = a;
  let f0 = f(a);
  for (let i = 1; i <= steps; i++) {
    const x1 = a + ((b - a) * i) / steps;
    const f1 = f(x1);
    if (Math.sign(f1) !== Math.sign(f0)) {
      let lo = x0;
      let hi = x1;
      for (let k = 0; k < 200; k++) {
        const mid = (lo + hi) / 2;
        if (Math.sign(f(mid)) === Math.sign(f0)) lo = mid;
        else hi = mid;
      }
      return (lo + hi) / 2;
    }
    x0 = x1;
    f0 = f1;
  }
  throw new Error('no root');
}

/**
 * Rotational stiffness (× EI/L) of a compressed member whose far end is pinned, u = L√(N/EI):
 * S = u²/(1 − u·cot u), the stability function s(1 − c²) of the slope-deflection method (Livesley &
 * Chandler stability functions; from memory). u → 0 gives 3, the unloaded 3EI/L.
 */
const pinnedFarEnd = (u: number): number => (u * u) / (1 - u / Math.tan(u));

describe('single span against Euler (Timoshenko & Gere, Theory of Elastic Stability, ch. 2; from memory)', () => {
  const L = 4;

  it('pinned–pinned: Ncr = π²EI/L² within 0.5 %', () => {
    expect(
      Math.abs(alphaCr(column([{ L, N: 1 }], 'pinned', 'pinned')) / ((Math.PI ** 2 * EI) / L ** 2) - 1),
    ).toBeLessThan(0.005);
  });

  it('fixed–pinned: k = 0.699 (first root of tan u = u is 4.4934) within 0.5 %', () => {
    const k = kOf(alphaCr(column([{ L, N: 1 }], 'fixed', 'pinned')), L);
    expect(Math.abs(k / (Math.PI / 4.4934) - 1)).toBeLessThan(0.005);
    expect(Math.abs(kOf(alphaCr(column([{ L, N: 1 }], 'pinned', 'fixed')), L) / 0.699 - 1)).toBeLessThan(0.005);
  });

  it('fixed–fixed: k = 0.5 within 0.5 %', () => {
    expect(Math.abs(kOf(alphaCr(column([{ L, N: 1 }], 'fixed', 'fixed')), L) / 0.5 - 1)).toBeLessThan(0.005);
  });

  it('cantilever (fixed base, free top): k = 2.0 within 0.5 %', () => {
    expect(Math.abs(kOf(alphaCr(column([{ L, N: 1 }], 'fixed', 'free')), L) / 2 - 1)).toBeLessThan(0.005);
  });

  it('scales with the force: twice the force halves αcr', () => {
    const one = alphaCr(column([{ L, N: 100 }], 'pinned', 'pinned'));
    const two = alphaCr(column([{ L, N: 200 }], 'pinned', 'pinned'));
    expect(one / two).toBeCloseTo(2, 10);
  });

  it('with a rotational spring EI/L at both ends: k from the symmetric-mode equation u·cot(u/2) = −kθL/EI, about the tabulated 0.85', () => {
    // Slope-deflection, symmetric mode of a braced column with equal end springs: the near-end
    // stiffness with the far end rotating equally and oppositely is s(1 − c) = u·cot(u/2) (× EI/L);
    // the spring balances it (Livesley & Chandler stability functions; from memory).
    const R = 1;
    const u = firstRoot((x) => x / Math.tan(x / 2) + R, 0.5, 2 * Math.PI - 1e-6);
    const expected = Math.PI / u;
    const k = kOf(alphaCr(column([{ L, N: 1 }], { spring: (R * EI) / L }, { spring: (R * EI) / L })), L);
    expect(Math.abs(k / expected - 1)).toBeLessThan(0.005);
    expect(k).toBeGreaterThan(0.84);
    expect(k).toBeLessThan(0.87);
  });
});

describe('continuous columns', () => {
  it('two equal spans with equal forces, pinned at the ends and held at the middle: k = 1.0 for each span (within 0.5 %)', () => {
    // Each span buckles as a pinned–pinned column; the middle joint rotates freely (antisymmetric mode).
    const k = kOf(
      alphaCr(
        column(
          [
            { L: 4, N: 1 },
            { L: 4, N: 1 },
          ],
          'pinned',
          'pinned',
        ),
      ),
      4,
    );
    expect(Math.abs(k - 1)).toBeLessThan(0.005);
  });

  it('two unequal spans with a step in force: αcr from the slope-deflection characteristic equation', () => {
    // Lower span 4.0 m with 1.5 N, upper span 3.0 m with N; pinned ends, held at the joint. Joint
    // equilibrium (slope-deflection, far ends pinned): S(u1)·EI/L1 + S(u2)·EI/L2 = 0.
    const L1 = 4;
    const L2 = 3;
    const f = (N: number): number =>
      pinnedFarEnd(L1 * Math.sqrt((1.5 * N) / EI)) / L1 + pinnedFarEnd(L2 * Math.sqrt(N / EI)) / L2;
    const eulerLower = (Math.PI ** 2 * EI) / L1 ** 2 / 1.5;
    const N = firstRoot(f, 1, 3 * eulerLower);
    // Hand check of the bracket: the lower span alone (pinned–pinned) would buckle at N = eulerLower;
    // the shorter, lighter upper span restrains it, so N lies above it.
    expect(N).toBeGreaterThan(eulerLower);
    const found = alphaCr(
      column(
        [
          { L: L1, N: 1.5 },
          { L: L2, N: 1 },
        ],
        'pinned',
        'pinned',
      ),
    );
    expect(Math.abs(found / N - 1)).toBeLessThan(0.005);
  });

  it('two equal spans with a step in section (EI and 2EI): αcr from the same equation', () => {
    const L = 4;
    const f = (N: number): number =>
      (2 * EI * pinnedFarEnd(L * Math.sqrt(N / (2 * EI)))) / L + (EI * pinnedFarEnd(L * Math.sqrt(N / EI))) / L;
    const N = firstRoot(f, 1, (4 * Math.PI ** 2 * EI) / L ** 2);
    const found = alphaCr(
      column(
        [
          { L, N: 1, EI: 2 * EI },
          { L, N: 1 },
        ],
        'pinned',
        'pinned',
      ),
    );
    expect(Math.abs(found / N - 1)).toBeLessThan(0.005);
    // The weaker span alone would buckle at π²EI/L²; the stiffer one restrains it.
    expect(found).toBeGreaterThan((Math.PI ** 2 * EI) / L ** 2);
  });
});

describe('what the analysis cannot solve', () => {
  it('reports a mechanism for a pinned base under a free top', () => {
    expect(lowestLoadFactor(column([{ L: 4, N: 1 }], 'pinned', 'free'))).toMatchObject({ failure: 'mechanism' });
  });

  it('reports no compression for a column in tension or unloaded', () => {
    expect(lowestLoadFactor(column([{ L: 4, N: -10 }], 'pinned', 'pinned'))).toEqual({ failure: 'no-compression' });
    expect(lowestLoadFactor(column([{ L: 4, N: 0 }], 'pinned', 'pinned'))).toEqual({ failure: 'no-compression' });
  });

  it('ignores a span in tension when another is compressed (tension only stiffens)', () => {
    const alone = alphaCr(
      column(
        [
          { L: 4, N: 1 },
          { L: 4, N: 0 },
        ],
        'pinned',
        'pinned',
      ),
    );
    const pulled = alphaCr(
      column(
        [
          { L: 4, N: 1 },
          { L: 4, N: -1 },
        ],
        'pinned',
        'pinned',
      ),
    );
    expect(pulled).toBeGreaterThan(alone);
  });
});
