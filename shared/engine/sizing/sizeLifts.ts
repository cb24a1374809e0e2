// The search. A lift's load depends only on the lifts above it (docs/analysis-rules.md §Take-down), and lighter lifts
// above never raise it, so the lifts are sized from the top down, each taking the lightest candidate that
// passes under the lifts already chosen above it. With "no upward increase" a lift may not be lighter
// than the lift above it, which only raises its lower bound: the rule is met on the way down and
// needs no second pass. (The force in each section is also never taken less than in the sections
// above it, as in the analysis; that too only grows with heavier lifts above.)
//
// Why the result is the lightest possible, lift by lift: take any assignment A that passes and keeps
// the rules. At the top lift the search takes the lightest passing candidate, so it is no heavier than
// A's. Going down, every lift above is no heavier than in A, so the load is no larger, so A's section
// passes here too (utilisation never falls as NEd rises) and is no lighter than the lift above; the
// search's pick is therefore no heavier than A's. The engine tests check this by brute force.
import type { Grade } from '../../schema/stack.ts';
import { isEngineError } from '../errors.ts';
import { liftForceFloor, liftUtilisation, NOTHING_ABOVE, passDown } from './liftUtilisation.ts';
import type { GradedCandidate } from './sizingCandidates.ts';
import type { SizingModel } from './sizingModel.ts';

export type LiftPick =
  { kind: 'section'; candidate: GradedCandidate; utilisation: number } | { kind: 'none' } | { kind: 'blocked' };

export interface SizingRules {
  grade: Grade;
  target: number;
  noUpwardIncrease: boolean;
}

/** One pick per lift, bottom first like model.lifts. */
export function sizeLifts(model: SizingModel, candidates: readonly GradedCandidate[], rules: SizingRules): LiftPick[] {
  return sizeLiftsAcross([model], candidates, rules);
}

/**
 * The same search for one design standing at several positions (a typical column, docs/typical-columns.md):
 * the models differ only in their loads. Each lift takes the lightest candidate that passes at every
 * position, each position with its own lifts above. The argument above holds position by position, so
 * the pick is again no heavier than that of any assignment passing everywhere. The utilisation kept is
 * the largest over the positions.
 */
export function sizeLiftsAcross(
  models: readonly SizingModel[],
  candidates: readonly GradedCandidate[],
  rules: SizingRules,
): LiftPick[] {
  const first = models[0]!;
  const picks: LiftPick[] = first.lifts.map(() => ({ kind: 'blocked' }));
  const above = models.map(() => NOTHING_ABOVE);
  let lightest = 0;
  for (let i = first.lifts.length - 1; i >= 0; i--) {
    let pick: LiftPick = { kind: 'none' };
    // kN → N for the comparison with Aeff·fy
    const floor = Math.max(...models.map((m, p) => liftForceFloor(m, i, above[p]!))) * 1000;
    for (const candidate of candidates) {
      if (rules.noUpwardIncrease && candidate.massPerMetre < lightest) continue;
      if (floor > rules.target * candidate.squash) continue;
      const trial = { section: candidate.designation, grade: rules.grade, massPerMetre: candidate.massPerMetre };
      let worst = 0;
      for (const [p, m] of models.entries()) {
        worst = Math.max(worst, liftUtilisation(m, i, trial, above[p]!, rules.target));
        if (worst > rules.target) break;
      }
      if (worst <= rules.target) {
        pick = { kind: 'section', candidate, utilisation: worst };
        break;
      }
    }
    picks[i] = pick;
    // Below a lift with no passing section the load is unknown: those lifts stay blocked.
    if (pick.kind !== 'section') break;
    const mass = pick.candidate.massPerMetre;
    models.forEach((m, p) => (above[p] = passDown(m, i, mass, above[p]!)));
    lightest = mass;
  }
  return picks;
}

export interface CurrentCheck {
  utilisation: number | null;
  /** Why the current section cannot be checked. */
  message?: string;
}

/** Utilisation of every lift as it is now, bottom first. */
export function currentUtilisations(model: SizingModel): CurrentCheck[] {
  const result: CurrentCheck[] = new Array(model.lifts.length);
  let above = NOTHING_ABOVE;
  for (let i = model.lifts.length - 1; i >= 0; i--) {
    const lift = model.lifts[i];
    try {
      result[i] = {
        utilisation: liftUtilisation(
          model,
          i,
          { section: lift.data.section, grade: lift.data.grade, massPerMetre: lift.massPerMetre },
          above,
        ),
      };
    } catch (error) {
      // As in the analysis: a section the rules cannot check is reported on its lift.
      if (!isEngineError(error)) throw error;
      result[i] = { utilisation: null, message: error.message };
    }
    above = passDown(model, i, lift.massPerMetre, above);
  }
  return result;
}
