// Sizing (docs/analysis-rules.md §Sizing): the proposal passes, is the lightest, keeps each rule and says when
// nothing passes. The yardstick is analyseStack, checked elsewhere against EN 1990 / EN 1991-1-1 / EN 1993-1-1.
import { describe, expect, it } from 'vitest';
import { analyseStack, EngineError, sizeStack, sizingCandidates } from '../../shared/engine/index.ts';
import { accepted, officeStack, request, tallTopStack, withSections } from './sizing-helpers.ts';
import { buildStack } from './stack-builder.ts';

const utilisations = (doc: Parameters<typeof analyseStack>[0]) => analyseStack(doc).lifts.map((l) => l.utilisation);

describe('sizeStack', () => {
  it('proposes a section for every lift whose utilisation, analysed afresh, is the one shown and at or below the target', () => {
    for (const target of [1, 0.9, 0.75]) {
      const doc = officeStack();
      const sizing = sizeStack(doc, request({ target }));
      expect(sizing.complete).toBe(true);
      const after = utilisations(accepted(doc, sizing));
      sizing.lifts.forEach((row, i) => {
        expect(row.after).not.toBeNull();
        expect(row.after!.utilisation).toBeCloseTo(after[i], 9);
        expect(after[i]).toBeLessThanOrEqual(target);
      });
    }
  });

  it('shows the utilisation before as the analysis gives it for the stack as it is', () => {
    const doc = officeStack();
    const before = utilisations(doc);
    sizeStack(doc, request()).lifts.forEach((row, i) => expect(row.before.utilisation).toBeCloseTo(before[i], 9));
  });

  it.each([1, 0.95, 0.9, 0.85, 0.8, 0.7])(
    'is minimal at a target of %s: no lighter section of the series passes in any lift, the others as proposed',
    (target) => {
      const doc = officeStack();
      const sizing = sizeStack(doc, request({ noUpwardIncrease: false, target }));
      const proposed = sizing.lifts.map((l) => l.after!.section);
      const series = sizingCandidates('UKC');
      let tried = 0;
      proposed.forEach((section, i) => {
        const mass = series.find((c) => c.designation === section)!.massPerMetre;
        for (const lighter of series.filter((c) => c.massPerMetre < mass)) {
          const trial = [...proposed];
          trial[i] = lighter.designation;
          expect(utilisations(withSections(doc, trial))[i]).toBeGreaterThan(target);
          tried++;
        }
      });
      expect(tried).toBeGreaterThan(4);
    },
  );

  it('with no upward increase never proposes a lift heavier than the lift below it, and without it may', () => {
    const doc = tallTopStack();
    const mass = (noUpwardIncrease: boolean) =>
      sizeStack(doc, request({ noUpwardIncrease })).lifts.map((l) => l.after!.massPerMetre);
    const free = mass(false);
    expect(free[2]).toBeGreaterThan(free[1]);
    const ruled = mass(true);
    for (let i = 1; i < ruled.length; i++) expect(ruled[i]).toBeLessThanOrEqual(ruled[i - 1]);
  });

  it('with the same serial size keeps one serial size in every lift and reports it', () => {
    const doc = tallTopStack();
    const free = sizeStack(doc, request({ noUpwardIncrease: false }));
    expect(new Set(free.lifts.map((l) => l.after!.section.replace(/x\d+$/, ''))).size).toBeGreaterThan(1);
    const kept = sizeStack(doc, request({ noUpwardIncrease: false, sameSerialSize: true }));
    expect(kept.serialSize).toMatch(/^UKC \d+x\d+$/);
    for (const row of kept.lifts) expect(row.after!.section.startsWith(`${kept.serialSize}x`)).toBe(true);
  });

  it('proposes only sections from the allowed list and refuses a name that is not in the series', () => {
    const allowed = ['UKC 203x203x60', 'UKC 254x254x107', 'UKC 305x305x158'];
    const sizing = sizeStack(officeStack(), request({ allowed }));
    for (const row of sizing.lifts) expect(allowed).toContain(row.after!.section);
    expect(() => sizeStack(officeStack(), request({ allowed: ['UKB 457x191x67'] }))).toThrow(EngineError);
  });

  it('reports "no section passes" on a lift no section can carry, never a failing section, and leaves the lifts below it unsized', () => {
    // 60 MN at the 6 m floor: more than the squash load of the heaviest UKC in the catalogue.
    const doc = buildStack({
      lifts: [{ top: 4 }, { top: 8 }, { top: 12 }],
      floors: [
        { elevation: 4, Gk: 100 },
        { elevation: 6, Gk: 60000 },
        { elevation: 8, Gk: 100 },
      ],
      cap: { Gk: 50, Qk: 10 },
    });
    const sizing = sizeStack(doc, request());
    const [l1, l2, l3] = sizing.lifts;
    expect(l3.status).toBe('proposed');
    expect(l2.status).toBe('none');
    expect(l2.after).toBeNull();
    expect(l2.message).toMatch(/^No section passes: no UKC section in S355 .* at or below 1\.00$/);
    expect(l1.status).toBe('blocked');
    expect(l1.after).toBeNull();
    expect(sizing.complete).toBe(false);
  });

  it('marks a lift unchanged when its section and grade are already the lightest that pass', () => {
    const doc = officeStack();
    const first = sizeStack(doc, request());
    const again = sizeStack(accepted(doc, first), request());
    for (const row of again.lifts) expect(row.status).toBe('unchanged');
    expect(again.massAfter).toBeCloseTo(again.massBefore!, 9);
  });

  it('totals the column mass from kg/m and lift lengths', () => {
    // UKC 203x203x46 weighs 46.1 kg/m (SCI P363 (steel building design: design data), from memory);
    // 32 m of it is about 1475 kg, within the catalogue's ±2% between nominal and computed mass.
    const doc = withSections(officeStack(), ['UKC 203x203x46', 'UKC 203x203x46', 'UKC 203x203x46', 'UKC 203x203x46']);
    const sizing = sizeStack(doc, request());
    expect(Math.abs(sizing.massBefore! - 32 * 46.1) / (32 * 46.1)).toBeLessThan(0.02);
    const after = sizing.lifts.reduce((sum, l) => sum + l.after!.massPerMetre * (l.top - l.bottom), 0);
    expect(sizing.massAfter).toBeCloseTo(after, 9);
  });

  // A higher grade never carries less in the same section (common practice, no source).
  it('sizes in the chosen grade: S460 never needs a heavier lift than S275', () => {
    const doc = officeStack();
    const mass = (grade: 'S275' | 'S460') =>
      sizeStack(doc, request({ grade, noUpwardIncrease: false })).lifts.map((l) => l.after!.massPerMetre);
    const s275 = mass('S275');
    mass('S460').forEach((m, i) => expect(m).toBeLessThanOrEqual(s275[i]));
  });

  it('with HE and one serial size may mix A, B and M of one nominal size', () => {
    const sizing = sizeStack(tallTopStack(), request({ series: 'HE', sameSerialSize: true }));
    expect(sizing.serialSize).toMatch(/^HE \d+$/);
    for (const row of sizing.lifts) expect(row.after!.section).toMatch(new RegExp(`^${sizing.serialSize} [ABM]$`));
  });

  it('does not size a stack with errors and says why', () => {
    const doc = officeStack();
    const broken = { ...doc, edges: doc.edges.filter((e) => e.target !== 'c') };
    const sizing = sizeStack(broken, request());
    expect(sizing.errors.length).toBeGreaterThan(0);
    expect(sizing.lifts).toEqual([]);
    expect(sizing.massBefore).toBeNull();
  });
});
