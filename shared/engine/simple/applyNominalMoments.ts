// Adds the simple-construction combined check to the pieces of an analysed stack when beam reactions are
// given on the column faces (at floors or at the cap). Without face reactions (or with the option off)
// the results are untouched.
import type { AnalysisOptions, CombinedCheck, Issue, LiftResult, PieceCheck } from '../../schema/results.ts';
import type { Grade, SectionDims, StackDocument } from '../../schema/stack.ts';
import { checkCompression } from '../checkCompression.ts';
import { isEngineError } from '../errors.ts';
import { sectionData } from '../sectionData.ts';
import type { Expression } from '../stack/combination.ts';
import type { StackModel } from '../stack/inspectStack.ts';
import { checkSimpleColumn } from './checkSimpleColumn.ts';
import { expressionsOf, forcesOfExpression, type PieceForces } from './combinationForces.ts';
import { faceWarnings } from './faceWarnings.ts';
import { floorMoments, hasReactions, storeyLevels, type FloorMoment, type MomentFloor } from './floorMoments.ts';
import { combinationStep, momentSteps } from './momentSteps.ts';
import { pieceMoments } from './pieceMoments.ts';

/** Said on the stack when the building asks for nominal moments but nothing gives one: else the check is silently absent. */
export const NO_FACE_REACTIONS_NOTE: Issue = {
  message:
    'Nominal moments are on for this building, but no beam reactions are given on the column faces of this stack (restraints or cap): the combined check is not made and these results are axial only',
};

export interface NominalMomentsOutcome {
  errors: Issue[];
  warnings: Issue[];
}

/** Every restraint and the cap, with the loads entering there (their own and attached load nodes). */
export function momentFloors(doc: StackDocument, model: StackModel): (MomentFloor & { Gk: number; Qk: number })[] {
  const byId = new Map(doc.nodes.map((n) => [n.id, n]));
  const top = model.lifts[model.lifts.length - 1].top;
  const floors = model.entries.map((entry) => {
    const node = byId.get(entry.nodeId);
    const data = node?.kind === 'restraint' || node?.kind === 'cap' ? node.data : undefined;
    const Qk = Object.values(entry.Qk).reduce((s: number, q) => s + (q ?? 0), 0);
    const cap = node?.kind === 'cap';
    return {
      nodeId: entry.nodeId,
      elevation: cap ? top : entry.elevation,
      category: data?.category ?? 'A',
      faces: data?.faces,
      loaded: entry.Gk > 0 || Qk > 0,
      cap,
      Gk: entry.Gk,
      Qk,
    };
  });
  return floors.sort((a, b) => a.elevation - b.elevation);
}

/** The option is on and some restraint or the cap has a face reaction. */
export function hasFaceReactions(doc: StackDocument, options: Pick<AnalysisOptions, 'nominalMoments'>): boolean {
  if (options.nominalMoments === false) return false;
  return doc.nodes.some((n) => (n.kind === 'restraint' || n.kind === 'cap') && hasReactions(n.data.faces));
}

interface Trial {
  expression: Expression;
  moments: FloorMoment[];
  forces: PieceForces[];
}

/**
 * Mutates `lifts`: each piece under nominal moments gains `combined`, the worst of the combinations (eq.
 * 6.10, or each of eq. 6.10a and 6.10b), each taking NEd and the beam reactions from itself; its
 * utilisation becomes the larger of the axial and the combined checks ('combined' governs only when
 * strictly larger), and so does its lift's.
 */
export function applyNominalMoments(
  doc: StackDocument,
  model: StackModel,
  lifts: LiftResult[],
  options: AnalysisOptions,
  sections?: ReadonlyMap<string, SectionDims>,
): NominalMomentsOutcome {
  const floors = momentFloors(doc, model);
  const warnings = faceWarnings(floors);
  if (options.nominalMoments === false) return { errors: [], warnings };
  if (!floors.some((f) => hasReactions(f.faces)))
    return { errors: [], warnings: [...warnings, NO_FACE_REACTIONS_NOTE] };

  const columns = model.lifts.map((l) => {
    const { props } = sectionData(l.data.section, sections);
    return { bottom: l.bottom, top: l.top, dims: l.section.dims, Iy: props.Iy, Iz: props.Iz };
  });
  const bottom = model.lifts[0].bottom;
  const top = model.lifts[model.lifts.length - 1].top;
  const levels = storeyLevels(floors, bottom, top);
  const trials: Trial[] = expressionsOf(options).map((expression) => ({
    expression,
    moments: floorMoments(floors, columns, bottom, top, options, expression).filter((m) => m.y.M > 0 || m.z.M > 0),
    forces: forcesOfExpression(model, lifts, options, expression),
  }));
  const errors: Issue[] = [];
  for (const [i, lift] of lifts.entries()) {
    const modelLift = model.lifts[i];
    const { section, grade } = modelLift.data;
    try {
      lift.pieces.forEach((piece, k) =>
        addCombined(piece, worstCombination(piece, levels, trials, i, k, section, grade, options, sections)),
      );
    } catch (error) {
      if (!isEngineError(error)) throw error;
      errors.push({ nodeId: lift.liftId, message: `Lift ${modelLift.name}: ${error.message}` });
      continue;
    }
    governLift(lift, section, grade, options, sections);
  }
  return { errors, warnings };
}

/** The combined check of one piece under each combination; the worst, with the others named in its working. */
function worstCombination(
  piece: PieceCheck,
  levels: readonly number[],
  trials: readonly Trial[],
  lift: number,
  index: number,
  section: string | SectionDims,
  grade: Grade,
  options: AnalysisOptions,
  sections?: ReadonlyMap<string, SectionDims>,
): CombinedCheck | null {
  const checks: CombinedCheck[] = [];
  for (const trial of trials) {
    const m = pieceMoments(piece.from, piece.to, levels, trial.moments);
    if (m.My === 0 && m.Mz === 0) continue;
    const NEdY = trial.forces[lift].NEdY[index];
    const NEdZ = trial.forces[lift].NEdZ[index];
    // kN → N, kN·m → N·mm, m → mm. piece.check was run with the largest NEd of all combinations: the
    // buckling resistances it gives are never larger than those for a smaller force (6.3.1.2(4)).
    const combined = checkSimpleColumn(
      {
        section,
        grade,
        LcrY: piece.LcrY * 1000,
        LcrZ: piece.LcrZ * 1000,
        NEdY: NEdY * 1000,
        NEdZ: NEdZ * 1000,
        MyEd: m.My * 1e6,
        MzEd: m.Mz * 1e6,
        annex: options.annex,
      },
      { compression: piece.check, extraSections: sections },
    );
    combined.combination = trial.expression;
    for (const step of combined.steps)
      if (step.symbol.startsWith('NEd,')) step.description = `${step.description ?? ''}, eq. ${trial.expression}`;
    combined.steps = [...momentSteps(m, piece), ...combined.steps];
    checks.push(combined);
  }
  if (checks.length === 0) return null;
  const worst = checks.reduce((a, b) => (b.utilisation > a.utilisation ? b : a));
  worst.steps.unshift(combinationStep(worst, checks));
  return worst;
}

function addCombined(piece: PieceCheck, combined: CombinedCheck | null): void {
  if (!combined) return;
  piece.combined = combined;
  if (combined.utilisation > piece.utilisation) {
    piece.axialUtilisation = piece.utilisation;
    piece.utilisation = combined.utilisation;
    piece.governing = 'combined';
  }
}

/** The lift's worst piece after the combined check, with its member working written out (as checkLift does). */
function governLift(
  lift: LiftResult,
  section: string | SectionDims,
  grade: Grade,
  options: AnalysisOptions,
  sections?: ReadonlyMap<string, SectionDims>,
): void {
  const worst = lift.pieces.reduce((a, b) => (b.utilisation > a.utilisation ? b : a));
  if (worst.check.steps.length === 0) {
    const NEd = Math.max(worst.NEdY, worst.NEdZ) * 1000;
    worst.check = checkCompression(
      { section, grade, LcrY: worst.LcrY * 1000, LcrZ: worst.LcrZ * 1000, NEd, annex: options.annex },
      { extraSections: sections },
    );
  }
  for (const piece of lift.pieces) if (piece !== worst && piece.combined) piece.combined.steps = [];
  lift.utilisation = worst.utilisation;
  lift.governing = worst.governing;
}
