import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CATALOGUE } from '../../shared/catalogue/index.ts';
import { checkCompression } from '../../shared/engine/checkCompression.ts';
import { isEngineError } from '../../shared/engine/errors.ts';
import type { Grade } from '../../shared/schema/stack.ts';

// Properties that follow from EN 1993-1-1 6.2.4 and 6.3.1 whatever the numbers: χ ≤ 1, a longer
// member is never stronger, utilisation is NEd over the smallest resistance. Common practice, no source.
const GRADES: readonly Grade[] = ['S235', 'S275', 'S355', 'S420', 'S460'];
const designation = fc.constantFrom(...CATALOGUE.map((e) => e.designation));
const grade = fc.constantFrom(...GRADES);
const length = fc.double({ min: 300, max: 20_000, noNaN: true });
const force = fc.double({ min: 0, max: 2e7, noNaN: true });

/** Runs a check, or returns null where the engine refuses the section by design (class 4 CHS). */
function tryCheck(...args: Parameters<typeof checkCompression>) {
  try {
    return checkCompression(...args);
  } catch (error) {
    if (isEngineError(error) && error.code === 'unsupported') return null;
    throw error;
  }
}

describe('checkCompression invariants over the catalogue', () => {
  it('buckling resistance never exceeds the cross-section resistance and utilisation is NEd over the smallest', () => {
    fc.assert(
      fc.property(designation, grade, length, length, force, (section, g, LcrY, LcrZ, NEd) => {
        const r = tryCheck({ section, grade: g, LcrY, LcrZ, NEd });
        if (!r) return;
        expect(r.chiY).toBeLessThanOrEqual(1);
        expect(r.chiZ).toBeLessThanOrEqual(1);
        expect(r.NbRdY).toBeLessThanOrEqual(r.NcRd * (1 + 1e-12));
        expect(r.NbRdZ).toBeLessThanOrEqual(r.NcRd * (1 + 1e-12));
        expect(r.utilisation).toBeCloseTo(NEd / Math.min(r.NcRd, r.NbRdY, r.NbRdZ), 9);
        expect(r.Aeff).toBeLessThanOrEqual(r.A);
      }),
      { numRuns: 400 },
    );
  });

  it('a longer member is never stronger about either axis', () => {
    fc.assert(
      fc.property(
        designation,
        grade,
        length,
        fc.double({ min: 1, max: 3, noNaN: true }),
        force,
        (section, g, L, factor, NEd) => {
          const short = tryCheck({ section, grade: g, LcrY: L, LcrZ: L, NEd });
          const long = tryCheck({ section, grade: g, LcrY: L * factor, LcrZ: L * factor, NEd });
          if (!short || !long) return;
          expect(long.NbRdY).toBeLessThanOrEqual(short.NbRdY * (1 + 1e-12));
          expect(long.NbRdZ).toBeLessThanOrEqual(short.NbRdZ * (1 + 1e-12));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('a catalogue designation and its own dimensions give the same numbers', () => {
    fc.assert(
      fc.property(fc.constantFrom(...CATALOGUE), grade, length, force, (entry, g, L, NEd) => {
        const byName = tryCheck({ section: entry.designation, grade: g, LcrY: L, LcrZ: L, NEd }, { steps: false });
        const byDims = tryCheck({ section: entry.dims, grade: g, LcrY: L, LcrZ: L, NEd }, { steps: false });
        expect(byDims).toEqual(byName);
      }),
      { numRuns: 200 },
    );
  });
});
