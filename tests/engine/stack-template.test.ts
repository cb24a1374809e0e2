// Stacks from a template whose floors are given as elevations (a building's own, irregular levels).
// Elevations and loads are invented; the expected figures are arithmetic on them, and the buckling length
// between pinned restraints is the storey (Lcr = k·L with k = 1.0: common practice, after BS 5950-1 Table 22).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseStack, validateStack } from '../../shared/engine/index.ts';
import {
  SPLICE_ABOVE_FLOOR_M,
  spliceElevation,
  stackFromTemplate,
  templateFloors,
} from '../../shared/ops/stackFromTemplate.ts';
import { stackTemplateSchema, type Level } from '../../shared/schema/api.ts';
import { stackDocumentSchema, type StackDocument } from '../../shared/schema/stack.ts';

const SECTIONS = ['UKC 254x254x89', 'UKC 203x203x46'];
// A 4.5 m ground storey, two 3.5 m office storeys and a 4 m plant storey under the roof.
const IRREGULAR = [0, 4.5, 8, 11.5, 15.5];
const irregular = stackTemplateSchema.parse({
  elevations: IRREGULAR,
  spliceEvery: 2,
  sections: SECTIONS,
  Gk: 100,
  Qk: 50,
});

const elevationsOf = (doc: StackDocument, kind: string) =>
  doc.nodes.flatMap((n) => (n.kind === kind && 'elevation' in n.data ? [n.data.elevation] : []));
const AXIAL_ONLY = { selfWeight: false, imposedReduction: false, annex: 'UK' } as const;

describe('stackFromTemplate with explicit elevations', () => {
  it('puts the support, a restraint on every floor between, splices above the splice floors and the cap at the given elevations', () => {
    const doc = stackFromTemplate(irregular);
    expect(stackDocumentSchema.safeParse(doc).success).toBe(true);
    expect(elevationsOf(doc, 'support')).toEqual([0]);
    expect(elevationsOf(doc, 'restraint')).toEqual([4.5, 8, 11.5]);
    expect(elevationsOf(doc, 'splice')).toEqual([8 + SPLICE_ABOVE_FLOOR_M]);
    expect(elevationsOf(doc, 'cap')).toEqual([15.5]);
    expect(doc.nodes.filter((n) => n.kind === 'lift').map((n) => n.kind === 'lift' && n.data.section)).toEqual(
      SECTIONS,
    );
    expect(validateStack(doc).errors).toEqual([]);
  });

  it('checks each storey over its own height: the bottom piece buckles over the 4.5 m ground storey, the top one over the 4 m plant storey', () => {
    const result = analyseStack(stackFromTemplate(irregular), AXIAL_ONLY);
    expect(result.errors).toEqual([]);
    const pieces = result.lifts.flatMap((l) => l.pieces);
    expect(pieces[0].LcrZ).toBeCloseTo(4.5, 6);
    expect(pieces[pieces.length - 1].LcrZ).toBeCloseTo(4, 6);
  });

  it('carries the same loads as a regular template of as many storeys: the heights change buckling lengths, not the take-down', () => {
    const regular = stackTemplateSchema.parse({
      storeys: 4,
      storeyHeight: 3.6,
      spliceEvery: 2,
      sections: SECTIONS,
      Gk: 100,
      Qk: 50,
    });
    const atElevations = analyseStack(stackFromTemplate(irregular), AXIAL_ONLY);
    const atRegular = analyseStack(stackFromTemplate(regular), AXIAL_ONLY);
    // EN 1990 eq. 6.10b with the UK NA (ξ = 0.925, ψ0 = 0.7): ΣGk = 4 × 100 = 400 kN, ΣQk(B) = 3 × 50 = 150 kN,
    // Qk(H) = 50 kN: 0.925 × 1.35 × 400 + 1.5 × 150 + 1.5 × 0.7 × 50 = 499.5 + 225 + 52.5 = 777 kN.
    expect(atElevations.lifts[0].pieces[0].NEd).toBeCloseTo(777, 3);
    expect(atElevations.lifts[0].pieces[0].NEd).toBeCloseTo(atRegular.lifts[0].pieces[0].NEd, 6);
  });

  it('builds a regular template exactly as it did: the same document as the same floors given as elevations', () => {
    const regular = stackTemplateSchema.parse({
      storeys: 5,
      storeyHeight: 3.5,
      baseElevation: -1.2,
      spliceEvery: 2,
      sections: SECTIONS,
      Gk: 100,
      Qk: 50,
    });
    const floors = templateFloors(regular);
    expect(floors).toEqual([-1.2, 2.3, 5.8, 9.3, 12.8, 16.3]);
    const same = stackTemplateSchema.parse({ elevations: floors, spliceEvery: 2, sections: SECTIONS, Gk: 100, Qk: 50 });
    expect(stackFromTemplate(same)).toEqual(stackFromTemplate(regular));
  });

  it('ties every restraint to the level at its elevation, and none to a level elsewhere', () => {
    const levels: Level[] = [
      { id: '11', name: 'Ground', elevation: 0 },
      { id: '12', name: 'Level 1', elevation: 4.5 },
      { id: '13', name: 'Level 2', elevation: 8 },
      { id: '14', name: 'Level 3', elevation: 11.5 },
      { id: '15', name: 'Plant', elevation: 15.5 },
      { id: '16', name: 'Mezzanine', elevation: 2.2 },
    ];
    const doc = stackFromTemplate(irregular, levels);
    const tied = doc.nodes.flatMap((n) => (n.kind === 'restraint' ? [[n.data.elevation, n.data.levelId]] : []));
    expect(tied).toEqual([
      [4.5, '12'],
      [8, '13'],
      [11.5, '14'],
    ]);
    // The support and the cap sit on the levels at the base and the top, when the building has them.
    const ends = doc.nodes.flatMap((n) => (n.kind === 'support' || n.kind === 'cap' ? [[n.kind, n.data.levelId]] : []));
    expect(ends).toEqual([
      ['support', '11'],
      ['cap', '15'],
    ]);
  });
});

describe('splices on short storeys', () => {
  it('sits the usual distance above the floor, or half-way up a storey shorter than twice that distance', () => {
    expect(spliceElevation(3.6, 7.2)).toBeCloseTo(3.6 + SPLICE_ABOVE_FLOOR_M, 9);
    // A 0.6 m step to a mezzanine: +0.5 m would leave 0.1 m below the next floor; half-way leaves 0.3 m each side.
    expect(spliceElevation(3.6, 4.2)).toBeCloseTo(3.9, 9);
    // Exactly twice the distance: both rules give the same point.
    expect(spliceElevation(0, 2 * SPLICE_ABOVE_FLOOR_M)).toBeCloseTo(SPLICE_ABOVE_FLOOR_M, 9);
  });

  it('never reaches or passes the next floor, whatever the storeys and splice spacing', () => {
    const storey = fc.double({ min: 0.001, max: 12, noNaN: true });
    fc.assert(
      fc.property(
        fc.double({ min: -50, max: 50, noNaN: true }),
        fc.array(storey, { minLength: 1, maxLength: 12 }),
        fc.integer({ min: 1, max: 4 }),
        (base, heights, spliceEvery) => {
          const elevations = heights.reduce(
            (acc, h) => [...acc, Math.round((acc[acc.length - 1] + h) * 1000) / 1000],
            [Math.round(base * 1000) / 1000],
          );
          const parsed = stackTemplateSchema.safeParse({ elevations, spliceEvery, sections: ['UKC 203x203x46'] });
          if (!parsed.success) return; // storeys rounded below 1 mm are refused by the schema
          const doc = stackFromTemplate(parsed.data);
          for (const n of doc.nodes) {
            if (n.kind !== 'splice') continue;
            const k = Number(n.id.slice('splice-'.length)) * spliceEvery;
            expect(n.data.elevation).toBeGreaterThan(elevations[k]);
            expect(n.data.elevation).toBeLessThan(elevations[k + 1]);
          }
          expect(validateStack(doc).errors).toEqual([]);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('stackTemplateSchema', () => {
  const sections = ['UKC 203x203x46'];
  const messages = (body: unknown) => {
    const r = stackTemplateSchema.safeParse(body);
    return r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  };

  it('keeps every regular body valid as before, with the base at 0 when left out', () => {
    const t = stackTemplateSchema.parse({ storeys: 3, storeyHeight: 3.5, sections });
    expect(templateFloors(t)).toEqual([0, 3.5, 7, 10.5]);
  });

  it('accepts elevations alone, or with a storey count that agrees with them', () => {
    expect(messages({ elevations: [0, 4.5, 8], sections })).toEqual([]);
    expect(messages({ elevations: [0, 4.5, 8], storeys: 2, sections })).toEqual([]);
  });

  it('asks for storeys and a storey height, or elevations, when given neither', () => {
    expect(messages({ sections })).toEqual([
      'storeys: is required (or give elevations instead)',
      'storeyHeight: is required (or give elevations instead)',
    ]);
    expect(messages({ storeys: 3, sections })).toEqual(['storeyHeight: is required (or give elevations instead)']);
  });

  it('refuses a storey height, a base elevation or a disagreeing storey count beside elevations', () => {
    expect(messages({ elevations: [0, 4.5, 8], storeyHeight: 3.5, sections })).toEqual([
      'storeyHeight: must be left out when elevations are given',
    ]);
    expect(messages({ elevations: [0, 4.5, 8], baseElevation: 0, sections })).toEqual([
      'baseElevation: must be left out when elevations are given (the first elevation is the base)',
    ]);
    expect(messages({ elevations: [0, 4.5, 8], storeys: 3, sections })).toEqual([
      'storeys: must be one less than the number of elevations (2), or left out',
    ]);
  });

  it('refuses elevations that do not rise by at least 1 mm, fewer than two, or out of range', () => {
    expect(messages({ elevations: [0, 4.5, 4.5, 8], sections })).toEqual([
      'elevations.2: must rise from floor to floor by at least 1 mm (4.5 m follows 4.5 m)',
    ]);
    expect(messages({ elevations: [0, 8, 4.5], sections })).toHaveLength(1);
    expect(messages({ elevations: [0, 0.0004], sections })).toHaveLength(1);
    expect(messages({ elevations: [3], sections })).toHaveLength(1);
    expect(messages({ elevations: [0, 1e308], sections })).toHaveLength(1);
    expect(messages({ elevations: Array.from({ length: 122 }, (_, i) => i * 3), sections })).toHaveLength(1);
  });
});

describe('stackFromTemplate with beam reactions on the faces', () => {
  const body = {
    storeys: 3,
    storeyHeight: 4,
    spliceEvery: 2,
    sections: ['UKC 254x254x73', 'UKC 203x203x46'],
    Gk: 150,
    Qk: 90,
  };

  it('puts the floor faces on every floor restraint and the roof faces on the cap, and nothing when none are given', () => {
    const t = stackTemplateSchema.parse({
      ...body,
      faces: { yPlus: { Gk: 40, Qk: 25 } },
      roofFaces: { zPlus: { Gk: 30, Qk: 10 } },
    });
    const doc = stackFromTemplate(t);
    expect(stackDocumentSchema.safeParse(doc).success).toBe(true);
    const restraints = doc.nodes.filter((n) => n.kind === 'restraint');
    expect(restraints).toHaveLength(2);
    for (const r of restraints) expect(r.kind === 'restraint' && r.data.faces).toEqual({ yPlus: { Gk: 40, Qk: 25 } });
    const cap = doc.nodes.find((n) => n.kind === 'cap');
    expect(cap?.kind === 'cap' && cap.data.faces).toEqual({ zPlus: { Gk: 30, Qk: 10 } });
    const plain = stackFromTemplate(stackTemplateSchema.parse(body));
    expect(plain.nodes.some((n) => (n.kind === 'restraint' || n.kind === 'cap') && 'faces' in n.data)).toBe(false);
    expect(stackFromTemplate(stackTemplateSchema.parse({ ...body, faces: { yPlus: { Gk: 0, Qk: 0 } } }))).toEqual(
      plain,
    );
  });

  it('refuses a negative face reaction in a template', () => {
    expect(stackTemplateSchema.safeParse({ ...body, roofFaces: { yPlus: { Gk: -1, Qk: 0 } } }).success).toBe(false);
  });

  it('gives a stack whose analysis checks the roof moment in the top storey', () => {
    const doc = stackFromTemplate(stackTemplateSchema.parse({ ...body, roofFaces: { yPlus: { Gk: 60, Qk: 20 } } }));
    const result = analyseStack(doc);
    expect(result.errors).toEqual([]);
    const top = result.lifts[result.lifts.length - 1];
    // Storeys end at +4, +8 and the cap at +12: only pieces from +8 up carry the roof moment
    for (const p of result.lifts.flatMap((l) => l.pieces)) expect(p.combined !== undefined).toBe(p.from >= 8 - 1e-9);
    expect(top.pieces.some((p) => p.combined)).toBe(true);
  });
});
