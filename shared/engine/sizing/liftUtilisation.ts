// Utilisation of one lift with a given section, the lifts above it fixed: the same rule as the
// analysis (docs/analysis-rules.md §Pieces) with the working left out, so that sizing can try many sections quickly.
import type { Grade, SectionDims } from '../../schema/stack.ts';
import { checkCompression } from '../checkCompression.ts';
import { designAxialForce } from '../stack/combination.ts';
import { selfWeightPerMetre } from '../stack/takeDown.ts';
import type { SizingModel } from './sizingModel.ts';

export interface LiftTrial {
  section: string | SectionDims;
  grade: Grade;
  /** kg/m */
  massPerMetre: number;
}

/** What the lifts above pass down: their self-weight and the largest design force in them (kN). */
export interface LoadFromAbove {
  weight: number;
  envelope: number;
}

export const NOTHING_ABOVE: LoadFromAbove = { weight: 0, envelope: 0 };

/** Self-weight of a lift, kN: permanent load on everything below it (docs/analysis-rules.md §Take-down). */
export function liftWeight(model: SizingModel, index: number, massPerMetre: number): number {
  const lift = model.lifts[index];
  return model.options.selfWeight ? selfWeightPerMetre(massPerMetre) * (lift.top - lift.bottom) : 0;
}

/**
 * NEd at the bottom of each piece, kN, as the analysis takes it down: never less than the force in
 * any section above, so a step in αn (EN 1991-1-1 6.3.1.2(11)) does not lower it.
 */
export function liftForces(model: SizingModel, index: number, massPerMetre: number, above: LoadFromAbove): number[] {
  const { options } = model;
  const lift = model.lifts[index];
  const perMetre = options.selfWeight ? selfWeightPerMetre(massPerMetre) : 0;
  const forces = new Array<number>(lift.pieces.length);
  let envelope = above.envelope;
  for (let k = lift.pieces.length - 1; k >= 0; k--) {
    const p = lift.pieces[k];
    const state = p.entries;
    const sumGk = state.sumGk + perMetre * (lift.top - p.from) + above.weight;
    const NEd = designAxialForce({ sumGk, sumQk: state.sumQk, loadedLevels: state.loadedLevels }, options).NEd;
    if (NEd > envelope) envelope = NEd;
    forces[k] = envelope;
  }
  return forces;
}

/**
 * The lift's utilisation with `trial` under the lifts above. Stops at the first piece above `limit`
 * and returns its utilisation (enough to refuse a candidate).
 */
export function liftUtilisation(
  model: SizingModel,
  index: number,
  trial: LiftTrial,
  above: LoadFromAbove,
  limit = Infinity,
): number {
  const lift = model.lifts[index];
  const count = lift.pieces.length;
  const NEd = liftForces(model, index, trial.massPerMetre, above);
  // The buckling check about an axis takes the largest NEd of the lift within that axis's segment
  // (docs/analysis-rules.md §Pieces)
  const maxY = new Array<number>(count).fill(0);
  const maxZ = new Array<number>(count).fill(0);
  for (let k = 0; k < count; k++) {
    const p = lift.pieces[k];
    if (NEd[k] > maxY[p.groupY]) maxY[p.groupY] = NEd[k];
    if (NEd[k] > maxZ[p.groupZ]) maxZ[p.groupZ] = NEd[k];
  }
  let worst = 0;
  for (let k = 0; k < count; k++) {
    const p = lift.pieces[k];
    const NEdY = maxY[p.groupY];
    const NEdZ = maxZ[p.groupZ];
    // The member check works in N and mm
    const check = checkCompression(
      {
        section: trial.section,
        grade: trial.grade,
        LcrY: p.LcrY * 1000,
        LcrZ: p.LcrZ * 1000,
        NEd: Math.max(NEdY, NEdZ) * 1000,
        annex: model.options.annex,
      },
      { steps: false, extraSections: model.sections },
    );
    // docs/analysis-rules.md §Pieces: max(NEd/Nc,Rd, NEd,y/Nb,y,Rd, NEd,z/Nb,z,Rd) — EN 1993-1-1 eq. 6.9 and 6.46
    const u = Math.max((NEd[k] * 1000) / check.NcRd, (NEdY * 1000) / check.NbRdY, (NEdZ * 1000) / check.NbRdZ);
    if (u > worst) worst = u;
    if (worst > limit) return worst;
  }
  return worst;
}

/** What this lift and those above it pass on to the lift below. */
export function passDown(model: SizingModel, index: number, massPerMetre: number, above: LoadFromAbove): LoadFromAbove {
  const forces = liftForces(model, index, massPerMetre, above);
  return {
    weight: above.weight + liftWeight(model, index, massPerMetre),
    envelope: forces.length ? Math.max(above.envelope, forces[0]) : above.envelope,
  };
}

/**
 * The largest design force in the lift without its own weight, kN. No section can do better than its
 * cross-section resistance against it: NEd/Nc,Rd ≤ utilisation (EN 1993-1-1 eq. 6.9), which lets the
 * search pass over sections that are plainly too small without a member check.
 */
export function liftForceFloor(model: SizingModel, index: number, above: LoadFromAbove): number {
  const forces = liftForces(model, index, 0, above);
  return forces.length ? forces[0] : above.envelope;
}
