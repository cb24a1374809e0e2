// Adds the simple-construction combined check to the pieces of an analysed stack when beam reactions are
// given on the column faces. Without face reactions (or with the option off) the results are untouched.
import type { AnalysisOptions, CalcStep, Issue, LiftResult, PieceCheck } from '../../schema/results.ts';
import type { Grade, RestraintFaces, SectionDims, StackDocument } from '../../schema/stack.ts';
import { checkCompression } from '../checkCompression.ts';
import { isEngineError } from '../errors.ts';
import { sectionData } from '../sectionData.ts';
import type { StackModel } from '../stack/inspectStack.ts';
import { checkSimpleColumn } from './checkSimpleColumn.ts';
import { faceWarnings } from './faceWarnings.ts';
import { floorMoments, type FloorMoment, type MomentFloor } from './floorMoments.ts';
import { pieceMoments, type PieceMoments } from './pieceMoments.ts';

export interface NominalMomentsOutcome {
  errors: Issue[];
  warnings: Issue[];
}

function momentFloors(doc: StackDocument, model: StackModel): MomentFloor[] {
  const byId = new Map(doc.nodes.map((n) => [n.id, n]));
  return model.restraints.map((r) => {
    const node = byId.get(r.id);
    const data = node?.kind === 'restraint' ? node.data : undefined;
    return { nodeId: r.id, elevation: r.elevation, category: data?.category ?? 'A', faces: data?.faces };
  });
}

function hasReactions(faces: RestraintFaces | undefined): boolean {
  if (!faces) return false;
  return [faces.yPlus, faces.yMinus, faces.zPlus, faces.zMinus].some((f) => f && (f.Gk > 0 || f.Qk > 0));
}

function axisSteps(axis: 'y' | 'z', floor: FloorMoment | null, side: 'above' | 'below'): CalcStep[] {
  if (!floor) return [];
  const m = floor[axis];
  if (m.M === 0) return [];
  const where = `floor at ${floor.elevation.toFixed(3)} m`;
  const rule = m.share.rule === 'equal' ? 'shared equally (EI/L ratio ≤ 1.5)' : m.share.rule === 'stiffness' ? 'shared by EI/L' : 'one column length';
  return [
    { symbol: `R${axis},net`, value: m.reaction.value * 1000, unit: 'N', clause: m.reaction.expression, description: `${where}: worst imposed-load pattern across the ${axis} faces` },
    { symbol: `e${axis}`, value: m.e, unit: 'mm', clause: 'simple construction, reaction 100 mm from the face', description: axis === 'y' ? 'h/2 + 100' : 'tw/2 + 100 (hollow: b/2 + 100)' },
    { symbol: `M${axis},floor`, value: m.M * 1e6, unit: 'N·mm', clause: 'simple construction', description: where },
    { symbol: `M${axis},${side}`, value: m.share[side] * 1e6, unit: 'N·mm', clause: 'simple construction', description: `${rule}; not carried to the next floor` },
  ];
}

function momentSteps(m: PieceMoments): CalcStep[] {
  return [...axisSteps('y', m.floorBelow, 'above'), ...axisSteps('y', m.floorAbove, 'below'), ...axisSteps('z', m.floorBelow, 'above'), ...axisSteps('z', m.floorAbove, 'below')];
}

/**
 * Mutates `lifts`: each piece under nominal moments gains `combined`; its utilisation becomes the larger of
 * the axial and the combined checks ('combined' governs only when strictly larger), and so does its lift's.
 */
export function applyNominalMoments(
  doc: StackDocument,
  model: StackModel,
  lifts: LiftResult[],
  options: AnalysisOptions,
  sections?: ReadonlyMap<string, SectionDims>,
): NominalMomentsOutcome {
  const floors = momentFloors(doc, model);
  const warnings = faceWarnings(
    floors.map((f) => {
      const entry = model.entries.find((e) => e.nodeId === f.nodeId);
      const Qk = entry ? Object.values(entry.Qk).reduce((s: number, q) => s + (q ?? 0), 0) : 0;
      return { nodeId: f.nodeId, elevation: f.elevation, faces: f.faces, Gk: entry?.Gk ?? 0, Qk };
    }),
  );
  if (options.nominalMoments === false || !floors.some((f) => hasReactions(f.faces))) return { errors: [], warnings };

  const columns = model.lifts.map((l) => {
    const { props } = sectionData(l.data.section, sections);
    return { bottom: l.bottom, top: l.top, dims: l.section.dims, Iy: props.Iy, Iz: props.Iz };
  });
  const moments = floorMoments(floors, columns, model.lifts[0].bottom, model.lifts[model.lifts.length - 1].top, options).filter((m) => m.y.M > 0 || m.z.M > 0);
  const elevations = floors.map((f) => f.elevation);
  const errors: Issue[] = [];
  for (const [i, lift] of lifts.entries()) {
    const modelLift = model.lifts[i];
    try {
      for (const piece of lift.pieces) addCombined(piece, pieceMoments(piece.from, piece.to, elevations, moments), modelLift.data.section, modelLift.data.grade, options, sections);
    } catch (error) {
      if (!isEngineError(error)) throw error;
      errors.push({ nodeId: lift.liftId, message: `Lift ${modelLift.name}: ${error.message}` });
      continue;
    }
    governLift(lift, modelLift.data.section, modelLift.data.grade, options, sections);
  }
  return { errors, warnings };
}

function addCombined(piece: PieceCheck, m: PieceMoments, section: string | SectionDims, grade: Grade, options: AnalysisOptions, sections?: ReadonlyMap<string, SectionDims>): void {
  if (m.My === 0 && m.Mz === 0) return;
  // kN → N, kN·m → N·mm, m → mm
  const combined = checkSimpleColumn(
    { section, grade, LcrY: piece.LcrY * 1000, LcrZ: piece.LcrZ * 1000, NEdY: piece.NEdY * 1000, NEdZ: piece.NEdZ * 1000, MyEd: m.My * 1e6, MzEd: m.Mz * 1e6, annex: options.annex },
    { compression: piece.check, extraSections: sections },
  );
  combined.steps = [...momentSteps(m), ...combined.steps];
  piece.combined = combined;
  if (combined.utilisation > piece.utilisation) {
    piece.axialUtilisation = piece.utilisation;
    piece.utilisation = combined.utilisation;
    piece.governing = 'combined';
  }
}

/** The lift's worst piece after the combined check, with its member working written out (as checkLift does). */
function governLift(lift: LiftResult, section: string | SectionDims, grade: Grade, options: AnalysisOptions, sections?: ReadonlyMap<string, SectionDims>): void {
  const worst = lift.pieces.reduce((a, b) => (b.utilisation > a.utilisation ? b : a));
  if (worst.check.steps.length === 0) {
    const NEd = Math.max(worst.NEdY, worst.NEdZ) * 1000;
    worst.check = checkCompression({ section, grade, LcrY: worst.LcrY * 1000, LcrZ: worst.LcrZ * 1000, NEd, annex: options.annex }, { extraSections: sections });
  }
  for (const piece of lift.pieces) if (piece !== worst && piece.combined) piece.combined.steps = [];
  lift.utilisation = worst.utilisation;
  lift.governing = worst.governing;
}
