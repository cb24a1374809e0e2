// Sizing where beams bring their reactions to the column faces. The analysis then adds nominal
// moments of simple construction, shared between the column lengths above and below each floor by
// their stiffness, so a lift's check depends on the lifts below it as well as on its own depth: the
// top-down search alone is no longer exact. The combined check only ever adds to the axial one, so
// the axial proposal is a lower bound; from there every lift that fails, analysed whole with
// analyseStack, is raised to the next candidate until every lift passes or one runs out of sections.
// The result passes and keeps the rules; unlike the axial case it is not proven to be the lightest.
import type { AnalysisOptions } from '../../schema/results.ts';
import type { SizingRequest } from '../../schema/sizing.ts';
import type { StackDocument } from '../../schema/stack.ts';
import { analyseStack } from '../stack/analyseStack.ts';
import type { AnalysisContext } from '../stack/context.ts';
import type { GradedCandidate } from './sizingCandidates.ts';
import type { LiftPick } from './sizeLifts.ts';

/** The analysis adds nominal moments: the option is on and some restraint has a face reaction. */
export function hasNominalMoments(doc: StackDocument, options: AnalysisOptions): boolean {
  if (options.nominalMoments === false) return false;
  return doc.nodes.some((n) => n.kind === 'restraint' && !!n.data.faces && Object.values(n.data.faces).some((f) => !!f && (f.Gk > 0 || f.Qk > 0)));
}

/** The document with every picked lift in its picked section and grade; other lifts as they are. */
function withPicks(doc: StackDocument, liftIds: readonly string[], picks: readonly LiftPick[], request: SizingRequest): StackDocument {
  const chosen = new Map<string, string>();
  picks.forEach((p, i) => {
    if (p.kind === 'section') chosen.set(liftIds[i], p.candidate.designation);
  });
  return { edges: doc.edges, nodes: doc.nodes.map((n) => (n.kind === 'lift' && chosen.has(n.id) ? { ...n, data: { ...n.data, section: chosen.get(n.id)!, grade: request.grade } } : n)) };
}

const massOf = (p: LiftPick): number => (p.kind === 'section' ? p.candidate.massPerMetre : 0);

/** With "no upward increase", raises each lift to at least the lift above it; true when one changed. */
function keepNoUpward(picks: LiftPick[], candidates: readonly GradedCandidate[]): boolean {
  let changed = false;
  for (let i = picks.length - 2; i >= 0; i--) {
    const own = picks[i];
    if (own.kind !== 'section' || massOf(own) >= massOf(picks[i + 1])) continue;
    const raised = candidates.find((c) => c.massPerMetre >= massOf(picks[i + 1]));
    picks[i] = raised ? { kind: 'section', candidate: raised, utilisation: own.utilisation } : { kind: 'none' };
    changed = true;
  }
  return changed;
}

/** A lift that ran out of sections leaves the load on every lift below it unknown. */
function blockBelowNone(picks: LiftPick[]): void {
  let none = -1;
  picks.forEach((p, i) => {
    if (p.kind === 'none') none = i;
  });
  for (let i = 0; i < none; i++) picks[i] = { kind: 'blocked' };
}

export function raiseUntilPassing(
  doc: StackDocument,
  liftIds: readonly string[],
  axial: readonly LiftPick[],
  candidates: readonly GradedCandidate[],
  request: SizingRequest,
  options: AnalysisOptions,
  context: AnalysisContext,
): LiftPick[] {
  const picks = [...axial];
  for (;;) {
    const result = analyseStack(withPicks(doc, liftIds, picks, request), options, context);
    if (result.errors.length > 0) return picks.map((p) => (p.kind === 'section' ? { kind: 'none' } : p));
    let raised = false;
    for (const [i, pick] of picks.entries()) {
      if (pick.kind !== 'section') continue;
      const utilisation = result.lifts[i].utilisation;
      if (utilisation <= request.target) {
        picks[i] = { ...pick, utilisation };
        continue;
      }
      const next = candidates[candidates.indexOf(pick.candidate) + 1];
      picks[i] = next ? { kind: 'section', candidate: next, utilisation } : { kind: 'none' };
      raised = true;
    }
    blockBelowNone(picks);
    if (request.noUpwardIncrease && keepNoUpward(picks, candidates)) {
      raised = true;
      blockBelowNone(picks);
    }
    if (!raised || picks.every((p) => p.kind !== 'section')) return picks;
  }
}
