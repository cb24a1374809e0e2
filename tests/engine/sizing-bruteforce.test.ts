// Sizing is the lightest possible: every assignment of seven UKC sections to the three lifts of a
// small stack (7³ = 343) is analysed with analyseStack, and the proposal is compared with the best of
// those that pass and keep the rules. The stack is chosen so that each rule changes the answer.
import { describe, expect, it } from 'vitest';
import { analyseStack, sizeStack, sizingCandidates } from '../../shared/engine/index.ts';
import { serialSize } from '../../shared/engine/sizing/serialSize.ts';
import { request, tallTopStack, withSections } from './sizing-helpers.ts';

const ALLOWED = [
  'UKC 152x152x23',
  'UKC 152x152x30',
  'UKC 152x152x37',
  'UKC 152x152x44',
  'UKC 203x203x46',
  'UKC 203x203x52',
  'UKC 254x254x73',
];
const MASS = new Map(sizingCandidates('UKC', ALLOWED).map((c) => [c.designation, c.massPerMetre]));
const LENGTHS = [3, 3, 7];

interface Assignment {
  sections: string[];
  worst: number;
}

function everyAssignment(): Assignment[] {
  const doc = tallTopStack();
  const all: Assignment[] = [];
  for (const a of ALLOWED)
    for (const b of ALLOWED)
      for (const c of ALLOWED) {
        const sections = [a, b, c];
        const result = analyseStack(withSections(doc, sections));
        expect(result.errors).toEqual([]);
        all.push({ sections, worst: Math.max(...result.lifts.map((l) => l.utilisation)) });
      }
  return all;
}

const ALL = everyAssignment();
const masses = (sections: readonly string[]) => sections.map((s) => MASS.get(s)!);
const total = (sections: readonly string[]) => masses(sections).reduce((sum, m, i) => sum + m * LENGTHS[i], 0);
const noUpward = (sections: readonly string[]) => masses(sections).every((m, i, all) => i === 0 || m <= all[i - 1]);
const oneSerial = (sections: readonly string[]) => new Set(sections.map(serialSize)).size === 1;

const RULES = [
  { noUpwardIncrease: false, sameSerialSize: false },
  { noUpwardIncrease: true, sameSerialSize: false },
  { noUpwardIncrease: false, sameSerialSize: true },
  { noUpwardIncrease: true, sameSerialSize: true },
];

describe.each(RULES.flatMap((r) => [1, 0.95, 0.9, 0.8, 0.7].map((target) => ({ ...r, target }))))(
  'sizing by brute force with %o',
  (rules) => {
    const keeps = (sections: readonly string[]) =>
      (!rules.noUpwardIncrease || noUpward(sections)) && (!rules.sameSerialSize || oneSerial(sections));
    const feasible = ALL.filter((a) => a.worst <= rules.target && keeps(a.sections));
    const sizing = sizeStack(tallTopStack(), request({ ...rules, allowed: ALLOWED }));
    const proposed = sizing.lifts.map((l) => l.after?.section ?? '');

    it('finds a proposal exactly when some assignment passes and keeps the rules', () => {
      expect(sizing.complete).toBe(feasible.length > 0);
    });

    it.runIf(feasible.length > 0)('proposes an assignment that passes and keeps the rules', () => {
      expect(feasible.map((a) => a.sections.join())).toContain(proposed.join());
    });

    it.runIf(feasible.length > 0)('proposes the lightest column of all those assignments', () => {
      const lightest = Math.min(...feasible.map((a) => total(a.sections)));
      expect(total(proposed)).toBeCloseTo(lightest, 9);
      expect(sizing.massAfter).toBeCloseTo(lightest, 9);
    });

    it.runIf(feasible.length > 0 && !rules.sameSerialSize)(
      'gives every lift the lightest section any passing assignment gives it',
      () => {
        masses(proposed).forEach((m, i) => expect(m).toBe(Math.min(...feasible.map((a) => masses(a.sections)[i]))));
      },
    );
  },
);

describe('the brute-force stack', () => {
  it('is one where each rule changes the lightest column', () => {
    const best = (keep: (s: readonly string[]) => boolean) =>
      Math.min(...ALL.filter((a) => a.worst <= 1 && keep(a.sections)).map((a) => total(a.sections)));
    const free = best(() => true);
    expect(best(noUpward)).toBeGreaterThan(free);
    expect(best(oneSerial)).toBeGreaterThan(free);
  });

  it('has no passing assignment at a target of 0.4, and sizing then reports no section passes', () => {
    expect(ALL.filter((a) => a.worst <= 0.4)).toEqual([]);
    const sizing = sizeStack(tallTopStack(), request({ target: 0.4, allowed: ALLOWED }));
    expect(sizing.complete).toBe(false);
    expect(sizing.lifts.some((l) => l.status === 'none')).toBe(true);
    for (const row of sizing.lifts) if (row.after) expect(row.after.utilisation).toBeLessThanOrEqual(0.4);
  });
});
