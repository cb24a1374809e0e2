// Proposes, lift by lift, the lightest section of a series that passes (docs/analysis-rules.md §Sizing). Pure;
// nothing is changed: the caller shows the preview and turns what the engineer accepts into updateNode ops.
import { DEFAULT_ANALYSIS_OPTIONS, type AnalysisOptions } from '../../schema/results.ts';
import type { LiftSizing, SizingRequest, StackSizing } from '../../schema/sizing.ts';
import type { StackDocument } from '../../schema/stack.ts';
import { allLevelElevations, type AnalysisContext } from '../stack/context.ts';
import { splicesAfterSizing } from '../connections/splicesAfterSizing.ts';
import { analyseStack } from '../stack/analyseStack.ts';
import { inspectStack } from '../stack/inspectStack.ts';
import { placeOnLevels } from '../stack/placeOnLevels.ts';
import { CLASS_4_REFUSAL } from '../simple/checkSimpleColumn.ts';
import { liftsUnderMoments } from '../simple/liftsUnderMoments.ts';
import { hasNominalMoments, sizeWithMoments, type CoupledStack } from './nominalMoments.ts';
import { checkableCandidates, sizingCandidates, type GradedCandidate } from './sizingCandidates.ts';
import { currentUtilisations, sizeLiftsAcross, type CurrentCheck, type LiftPick } from './sizeLifts.ts';
import { sizingModel, type SizingModel } from './sizingModel.ts';
import { liftMessage } from './sizingMessages.ts';

function sizedCount(picks: readonly LiftPick[]): number {
  return picks.filter((p) => p.kind === 'section').length;
}

/** kg: Σ mass per metre × length, each lift taking its pick where it has one. */
function columnMass(model: SizingModel, picks?: readonly LiftPick[]): number {
  return model.lifts.reduce((sum, lift, i) => {
    const pick = picks?.[i];
    const perMetre = pick?.kind === 'section' ? pick.candidate.massPerMetre : lift.massPerMetre;
    return sum + perMetre * (lift.top - lift.bottom);
  }, 0);
}

/**
 * With "same serial size" every lift of the stack keeps one serial size, since every lift meets the
 * next at a splice. Each serial size is sized on its own; the one that sizes the most lifts, then the
 * lightest column, wins (the first in the table on a tie).
 */
type Search = (candidates: readonly GradedCandidate[]) => LiftPick[];

function bestPicks(
  model: SizingModel,
  candidates: readonly GradedCandidate[],
  request: SizingRequest,
  search: Search,
): { picks: LiftPick[]; serial: string | null } {
  if (!request.sameSerialSize) return { picks: search(candidates), serial: null };
  const serials = [...new Set(candidates.map((c) => c.serial))];
  let best: { picks: LiftPick[]; serial: string | null } | null = null;
  for (const serial of serials) {
    const picks = search(candidates.filter((c) => c.serial === serial));
    if (
      !best ||
      sizedCount(picks) > sizedCount(best.picks) ||
      (sizedCount(picks) === sizedCount(best.picks) && columnMass(model, picks) < columnMass(model, best.picks))
    ) {
      best = { picks, serial };
    }
  }
  return best ?? { picks: model.lifts.map(() => ({ kind: 'none' })), serial: null };
}

/** The stack as it is, analysed whole: what "before" shows when nominal moments couple the lifts. */
function analysedUtilisations(
  doc: StackDocument,
  count: number,
  options: AnalysisOptions,
  context: AnalysisContext,
): CurrentCheck[] {
  const result = analyseStack(doc, options, context);
  if (result.errors.length === 0) return result.lifts.map((l) => ({ utilisation: l.utilisation }));
  const message = result.errors.map((e) => e.message).join('; ');
  return Array.from({ length: count }, () => ({ utilisation: null, message }));
}

function liftRow(model: SizingModel, i: number, pick: LiftPick, now: CurrentCheck, request: SizingRequest): LiftSizing {
  const lift = model.lifts[i];
  const before = {
    section: lift.designation,
    grade: lift.data.grade,
    massPerMetre: lift.massPerMetre,
    utilisation: now.utilisation,
  };
  const row = { liftId: lift.id, name: lift.name, bottom: lift.bottom, top: lift.top, before };
  if (pick.kind !== 'section')
    return { ...row, after: null, status: pick.kind, message: liftMessage(pick.kind, request) };
  const { candidate, utilisation } = pick;
  // The analysis resolves catalogue sections to the catalogue's own spelling, so one comparison suffices.
  const same = candidate.designation === lift.designation && request.grade === lift.data.grade;
  const after = {
    section: candidate.designation,
    grade: request.grade,
    massPerMetre: candidate.massPerMetre,
    utilisation,
  };
  return { ...row, after, status: same ? 'unchanged' : 'proposed', ...(now.message ? { message: now.message } : {}) };
}

/** Says why lighter class 4 sections of the series were passed over where the moments act. */
function withClass4Note(
  row: LiftSizing,
  underMoments: boolean,
  pick: LiftPick,
  candidates: readonly GradedCandidate[],
): LiftSizing {
  if (!underMoments) return row;
  const limit = pick.kind === 'section' ? pick.candidate.massPerMetre : Infinity;
  if (!candidates.some((c) => c.sectionClass === 4 && c.massPerMetre < limit)) return row;
  const note = `Class 4 sections were not considered: this lift carries nominal moments. ${CLASS_4_REFUSAL}`;
  return { ...row, message: row.message ? `${row.message}. ${note}` : note };
}

export function sizeStack(
  doc: StackDocument,
  request: SizingRequest,
  options: Partial<AnalysisOptions> = {},
  context: AnalysisContext = {},
): StackSizing {
  return sizeTypicalColumn([doc], request, options, context);
}

/** Each lift's largest utilisation over the positions; a position that cannot be checked says why. */
function worstOf(checks: readonly CurrentCheck[][]): CurrentCheck[] {
  return checks[0]!.map((_, i) => {
    const at = checks.map((c) => c[i]!);
    const unchecked = at.find((c) => c.utilisation === null);
    return unchecked ?? { utilisation: Math.max(...at.map((c) => c.utilisation!)) };
  });
}

/**
 * Sizes one design for every position it stands at (a typical column, docs/typical-columns.md): `docs` is the
 * document with each position's loads on it, its own place first. Each lift gets the lightest section that
 * passes at every position; the utilisations shown are the largest over the positions.
 */
export function sizeTypicalColumn(
  docs: readonly StackDocument[],
  request: SizingRequest,
  options: Partial<AnalysisOptions> = {},
  context: AnalysisContext = {},
): StackSizing {
  const settings: AnalysisOptions = { ...DEFAULT_ANALYSIS_OPTIONS, ...options };
  // A tied node stands at its level's elevation, whatever copy the document carries (docs/stack-editing.md).
  const placed = docs.map((d) => placeOnLevels(d, context.levels));
  const doc = placed[0]!;
  const inspected = placed.map((d) => inspectStack(d, context));
  const failed = inspected.find((i) => !i.model);
  if (failed || !inspected[0]!.model)
    return {
      errors: (failed ?? inspected[0]!).errors,
      lifts: [],
      serialSize: null,
      complete: false,
      massBefore: null,
      massAfter: null,
    };
  const levels = allLevelElevations(context.levels);
  const models = inspected.map((i) => sizingModel(i.model!, settings, levels, context.sections));
  const model = models[0]!;
  const candidates = checkableCandidates(
    sizingCandidates(request.series, request.allowed),
    request.grade,
    settings.annex,
  );
  const moments = docs.some((d) => hasNominalMoments(d, settings));
  const underMoments = moments
    ? inspected
        .map((i, p) => liftsUnderMoments(docs[p]!, i.model!, settings, context.sections))
        .reduce((a, b) => a.map((under, k) => under || b[k]!))
    : model.lifts.map(() => false);
  const coupled: CoupledStack = {
    doc,
    others: docs.slice(1),
    liftIds: model.lifts.map((l) => l.id),
    lengths: model.lifts.map((l) => l.top - l.bottom),
    request,
    options: settings,
    context,
    underMoments,
    isClass4: (c) => c.sectionClass === 4,
  };
  const search: Search = moments
    ? (group) => sizeWithMoments(coupled, sizeLiftsAcross(models, group, request), group)
    : (group) => sizeLiftsAcross(models, group, request);
  const { picks, serial } = bestPicks(model, candidates, request, search);
  const now = worstOf(
    moments
      ? docs.map((d) => analysedUtilisations(d, model.lifts.length, settings, context))
      : models.map((m) => currentUtilisations(m)),
  );
  const lifts = model.lifts.map((_, i) =>
    withClass4Note(liftRow(model, i, picks[i], now[i], request), underMoments[i], picks[i], candidates),
  );
  const spliceFlags = splicesAfterSizing(doc, lifts, settings, context);
  return {
    ...(spliceFlags.length ? { spliceFlags } : {}),
    errors: [],
    lifts,
    serialSize: serial,
    complete: sizedCount(picks) === picks.length,
    massBefore: columnMass(model),
    massAfter: columnMass(model, picks),
  };
}
