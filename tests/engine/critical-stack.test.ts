// analyseStack with buckling lengths from the elastic critical buckling analysis of the whole stack.
import { describe, expect, it } from 'vitest';
import { E_STEEL, sectionProperties } from '../../shared/engine/index.ts';
import { analyseStack } from '../../shared/engine/stack/index.ts';
import type { StackResult } from '../../shared/schema/results.ts';
import { buildStack, UKC_254_73 } from './stack-builder.ts';

const CRITICAL = { bucklingLengths: 'critical', selfWeight: false } as const;
const props = sectionProperties(UKC_254_73);
/** EI in kN·m² (E in N/mm², I in mm⁴). */
const EIy = E_STEEL * props.Iy * 1e-9;
const EIz = E_STEEL * props.Iz * 1e-9;

function solved(result: StackResult): StackResult & { criticalBuckling: NonNullable<StackResult['criticalBuckling']> } {
  expect(result.errors).toEqual([]);
  if (!result.criticalBuckling) throw new Error('no critical buckling result');
  return result as StackResult & { criticalBuckling: NonNullable<StackResult['criticalBuckling']> };
}

describe('analyseStack with bucklingLengths: critical', () => {
  const single = buildStack({ lifts: [{ top: 4 }], cap: { fixity: 'pinned', Gk: 500, Qk: 0 } });

  it('gives the Euler load factor of a pinned–pinned lift, and Lcr = L about both axes (within 0.5 %)', () => {
    const result = solved(analyseStack(single, CRITICAL));
    const piece = result.lifts[0].pieces[0];
    // EN 1990 eq. 6.10a/b with Qk = 0: NEd = 1.35·Gk (Table A1.2(B))
    expect(piece.NEd).toBeCloseTo(1.35 * 500, 9);
    // Euler, Ncr = π²EI/L² (Timoshenko & Gere, Theory of Elastic Stability, ch. 2; from memory)
    expect(Math.abs(result.criticalBuckling.y.alphaCr / ((Math.PI ** 2 * EIy) / 16 / piece.NEd) - 1)).toBeLessThan(
      0.005,
    );
    expect(Math.abs(result.criticalBuckling.z.alphaCr / ((Math.PI ** 2 * EIz) / 16 / piece.NEd) - 1)).toBeLessThan(
      0.005,
    );
    expect(Math.abs(piece.LcrY / 4 - 1)).toBeLessThan(0.005);
    expect(Math.abs(piece.kZ - 1)).toBeLessThan(0.005);
    expect(piece.tableKY).toBe(1);
    expect(piece.tableKZ).toBe(1);
  });

  it('checks with Ncr = αcr·NEd: the member check’s Ncr is the analysis’ critical force', () => {
    const result = solved(analyseStack(single, CRITICAL));
    const piece = result.lifts[0].pieces[0];
    // check in N: αcr × NEd (kN) × 1000
    expect(piece.check.NcrY / (result.criticalBuckling.y.alphaCr * piece.NEdY * 1000)).toBeCloseTo(1, 10);
    expect(piece.check.NcrZ / (result.criticalBuckling.z.alphaCr * piece.NEdZ * 1000)).toBeCloseTo(1, 10);
  });

  it('a class 4 section: λ̄ = √(Aeff·fy/Ncr) with Ncr = αcr·NEd (EN 1993-1-1 eq. 6.51)', () => {
    // SHS 300x300x6.3 hot-finished, S355: wall c/t = (300 − 3·6.3)/6.3 = 44.6 > 42ε = 34.2 (Table 5.2), class 4
    const thin = { shape: 'RHS', make: 'hot-finished', h: 300, b: 300, t: 6.3 } as const;
    const result = solved(analyseStack(buildStack({ lifts: [{ top: 6, section: thin }], cap: { Gk: 600 } }), CRITICAL));
    const { check, NEdY } = result.lifts[0].pieces[0];
    expect(check.sectionClass).toBe(4);
    const Ncr = result.criticalBuckling.y.alphaCr * NEdY * 1000;
    expect(check.lambdaBarY).toBeCloseTo(Math.sqrt((check.Aeff * check.fy) / Ncr), 10);
  });

  it('writes the analysis and its αcr into the working of the checked piece', () => {
    const steps = solved(analyseStack(single, CRITICAL)).lifts[0].pieces[0].check.steps;
    const at = steps.findIndex((s) => s.symbol === 'αcr,z');
    expect(at).toBeGreaterThan(-1);
    expect(steps[at + 1].symbol).toBe('Lcr,z');
    expect(steps[at + 1].description).toMatch(/critical buckling analysis/);
  });

  it('takes k ≈ 0.699 with a fixed base and a pinned cap (table 0.85), without a warning', () => {
    const result = solved(
      analyseStack(buildStack({ base: { fixity: 'fixed' }, lifts: [{ top: 4 }], cap: { Gk: 500 } }), CRITICAL),
    );
    const piece = result.lifts[0].pieces[0];
    // fixed–pinned: first root of tan u = u, u = 4.4934, k = π/u (Timoshenko & Gere ch. 2; from memory)
    expect(Math.abs(piece.kY / (Math.PI / 4.4934) - 1)).toBeLessThan(0.005);
    expect(piece.tableKY).toBe(0.85);
    expect(result.warnings.some((w) => /longer buckling length/.test(w.message))).toBe(false);
  });

  it('gives k = 1.0 to each of two equal storeys with equal forces, continuous through a floor', () => {
    const doc = buildStack({ lifts: [{ top: 8 }], floors: [{ elevation: 4 }], cap: { Gk: 500 } });
    const pieces = solved(analyseStack(doc, CRITICAL)).lifts[0].pieces;
    expect(pieces).toHaveLength(2);
    for (const p of pieces) expect(Math.abs(p.kY - 1)).toBeLessThan(0.005);
  });

  it('warns where a lightly loaded storey above a heavily loaded one gets a longer length than the table', () => {
    // The floor at +4.000 brings most of the load: the storey above carries a tenth of the one below, and
    // the stack buckles at the lower storey's load, so Ncr of the upper storey, αcr·NEd, is small.
    const doc = buildStack({ lifts: [{ top: 4 }, { top: 8 }], floors: [{ elevation: 4, Gk: 900 }], cap: { Gk: 100 } });
    const result = solved(analyseStack(doc, CRITICAL));
    const upper = result.lifts[1].pieces[0];
    expect(upper.kY).toBeGreaterThan(2);
    expect(result.warnings.some((w) => w.nodeId === 'l2' && /longer buckling length about y-y/.test(w.message))).toBe(
      true,
    );
    expect(result.warnings.some((w) => w.nodeId === 'l1' && /longer buckling length/.test(w.message))).toBe(false);
  });

  it('keeps a buckling-length factor set by hand on a lift', () => {
    const doc = buildStack({ lifts: [{ top: 4, kY: 1.5 }], cap: { Gk: 500 } });
    const piece = solved(analyseStack(doc, CRITICAL)).lifts[0].pieces[0];
    expect(piece.kY).toBe(1.5);
    expect(piece.LcrY).toBe(6);
    expect(piece.tableKY).toBeUndefined();
    expect(piece.tableKZ).toBe(1);
  });

  it('gives the buckled shape: zero at the restraints, largest 1', () => {
    const doc = buildStack({ lifts: [{ top: 8 }], floors: [{ elevation: 4 }], cap: { Gk: 500 } });
    const { shape } = solved(analyseStack(doc, CRITICAL)).criticalBuckling.y;
    if (!shape) throw new Error('no shape');
    expect(shape.elevations[0]).toBe(0);
    expect(shape.elevations.at(-1)).toBe(8);
    expect(shape.displacements[shape.elevations.indexOf(4)]).toBe(0);
    expect(Math.max(...shape.displacements.map(Math.abs))).toBe(1);
  });

  it('keeps the tabulated length for a piece without compression above a loaded one', () => {
    // No cap load and no self-weight: the storey above +4.000 carries nothing.
    const doc = buildStack({ lifts: [{ top: 8 }], floors: [{ elevation: 4, Gk: 500 }], cap: { Gk: 0 } });
    const [lower, upper] = solved(analyseStack(doc, CRITICAL)).lifts[0].pieces;
    expect(upper.NEd).toBe(0);
    expect(upper.LcrY).toBe(4);
    expect(upper.tableKY).toBeUndefined();
    expect(upper.utilisation).toBe(0);
    // The unloaded storey above restrains the loaded one: k below 1.0 (pinned far end, 3EI/L at the joint).
    expect(lower.kY).toBeLessThan(1);
    expect(lower.tableKY).toBe(1);
  });

  it('reports a stack without compression as an error, never a throw', () => {
    const result = analyseStack(buildStack({ lifts: [{ top: 4 }], cap: { Gk: 0 } }), CRITICAL);
    expect(result.lifts).toEqual([]);
    expect(result.errors[0].message).toMatch(/no piece of the column is in compression/);
  });
});

describe('the default leaves results as they were', () => {
  const doc = buildStack({
    base: { fixity: 'fixed' },
    lifts: [{ top: 8 }, { top: 14 }],
    floors: [
      { elevation: 4, Gk: 300, Qk: 100 },
      { elevation: 8, Gk: 300, Qk: 100 },
    ],
    cap: { Gk: 100, Qk: 20 },
  });

  it('is the same with no option and with tabulated factors, and carries no critical result', () => {
    const plain = analyseStack(doc);
    expect(analyseStack(doc, { bucklingLengths: 'factors' })).toEqual(plain);
    expect(plain.criticalBuckling).toBeUndefined();
    expect(plain.lifts.flatMap((l) => l.pieces).some((p) => p.tableKY !== undefined)).toBe(false);
  });
});
