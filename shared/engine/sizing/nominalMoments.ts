// Sizing where beams bring their reactions to the column faces. The analysis then adds nominal
// moments of simple construction, shared between the column lengths above and below each floor by
// their stiffness, so a lift's check depends on the lifts below it as well as on its own depth: the
// top-down search alone is no longer exact. The combined check only ever adds to the axial one, so
// the axial proposal is a lower bound; from there every lift that fails, analysed whole with
// analyseStack, is raised to the next candidate until every lift passes or one runs out of sections.
// Raising every failing lift at once can overshoot (a stiffer lift draws more of the shared moment and
// relieves its neighbours), so a second pass then lightens the column while it still passes: one lift a
// section lighter, or one lift lighter with a neighbour a section or two heavier. The result passes,
// keeps the rules and no such move makes it lighter; it is not proven to be the lightest of all.
// A lift the nominal moments reach never takes a class 4 section: the combined check does not cover
// class 4 (CLASS_4_REFUSAL), so such a section cannot be shown to pass and the search steps over it.
import type { AnalysisOptions } from '../../schema/results.ts';
import type { SizingRequest } from '../../schema/sizing.ts';
import type { StackDocument } from '../../schema/stack.ts';
import { hasFaceReactions } from '../simple/applyNominalMoments.ts';
import { analyseStack } from '../stack/analyseStack.ts';
import type { AnalysisContext } from '../stack/context.ts';
import type { GradedCandidate } from './sizingCandidates.ts';
import type { LiftPick } from './sizeLifts.ts';

/** The analysis adds nominal moments: the option is on and some restraint or the cap has a face reaction. */
export function hasNominalMoments(doc: StackDocument, options: AnalysisOptions): boolean {
  return hasFaceReactions(doc, options);
}

/** The document with every picked lift in its picked section and grade; other lifts as they are. */
function withPicks(
  doc: StackDocument,
  liftIds: readonly string[],
  picks: readonly LiftPick[],
  request: SizingRequest,
): StackDocument {
  const chosen = new Map<string, string>();
  picks.forEach((p, i) => {
    if (p.kind === 'section') chosen.set(liftIds[i], p.candidate.designation);
  });
  return {
    edges: doc.edges,
    nodes: doc.nodes.map((n) =>
      n.kind === 'lift' && chosen.has(n.id)
        ? { ...n, data: { ...n.data, section: chosen.get(n.id)!, grade: request.grade } }
        : n,
    ),
  };
}

const massOf = (p: LiftPick): number => (p.kind === 'section' ? p.candidate.massPerMetre : 0);

/** With "no upward increase", raises each lift to at least the lift above it; true when one changed. */
function keepNoUpward(picks: LiftPick[], lists: readonly (readonly GradedCandidate[])[]): boolean {
  let changed = false;
  for (let i = picks.length - 2; i >= 0; i--) {
    const own = picks[i];
    if (own.kind !== 'section' || massOf(own) >= massOf(picks[i + 1])) continue;
    const raised = lists[i].find((c) => c.massPerMetre >= massOf(picks[i + 1]));
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

/** What the moment-aware search needs besides the candidates: the stack, its lifts and the rules. */
export interface CoupledStack {
  doc: StackDocument;
  /** The same design at a typical column's further positions, each with its own loads (docs/typical-columns.md). */
  others?: readonly StackDocument[];
  liftIds: readonly string[];
  /** m, bottom lift first */
  lengths: readonly number[];
  request: SizingRequest;
  options: AnalysisOptions;
  context: AnalysisContext;
  /** Per lift, bottom first: the combined check reaches it (liftsUnderMoments). */
  underMoments: readonly boolean[];
  /** The candidate is class 4 in the requested grade. */
  isClass4: (candidate: GradedCandidate) => boolean;
}

/** Each lift's candidates: without class 4 where the combined check reaches the lift. */
function candidateLists(stack: CoupledStack, candidates: readonly GradedCandidate[]): GradedCandidate[][] {
  const checkable = candidates.filter((c) => !stack.isClass4(c));
  return stack.underMoments.map((under) => (under ? checkable : [...candidates]));
}

/** The lightest of the lift's candidates at or above `pick` in the series order, or none. */
function atOrAbove(
  list: readonly GradedCandidate[],
  candidates: readonly GradedCandidate[],
  pick: Picked,
): Picked | { kind: 'none' } {
  const from = candidates.indexOf(pick.candidate);
  const candidate = list.find((c) => candidates.indexOf(c) >= from);
  return candidate ? { ...pick, candidate } : { kind: 'none' };
}

export function sizeWithMoments(
  stack: CoupledStack,
  axial: readonly LiftPick[],
  candidates: readonly GradedCandidate[],
): LiftPick[] {
  const lists = candidateLists(stack, candidates);
  // A class 4 axial pick where the moments act moves up to the next section the combined check covers.
  const start: LiftPick[] = axial.map((p, i) => (p.kind === 'section' ? atOrAbove(lists[i], candidates, p) : p));
  blockBelowNone(start);
  const raised = raiseUntilPassing(stack, start, lists);
  if (!everyLiftPicked(raised) || !everyLiftPicked(start)) return raised;
  // No lift can go below its axial pick: that is the lightest passing with the lightest lifts above.
  const lowest = start.map((p, i) => (p.kind === 'section' ? lists[i].indexOf(p.candidate) : 0));
  return lighten(stack, raised, lists, lowest);
}

/** Each lift's utilisation with the picks, the largest over every position of the design; null with errors. */
function utilisationsWith(
  { doc, others = [], liftIds, request, options, context }: CoupledStack,
  picks: readonly LiftPick[],
): number[] | null {
  let out: number[] | null = null;
  for (const at of [doc, ...others]) {
    const result = analyseStack(withPicks(at, liftIds, picks, request), options, context);
    if (result.errors.length > 0) return null;
    const own = result.lifts.map((l) => l.utilisation);
    out = out ? out.map((u, i) => Math.max(u, own[i]!)) : own;
  }
  return out;
}

function raiseUntilPassing(
  stack: CoupledStack,
  axial: readonly LiftPick[],
  lists: readonly (readonly GradedCandidate[])[],
): LiftPick[] {
  const { request } = stack;
  const picks = [...axial];
  for (;;) {
    const found = utilisationsWith(stack, picks);
    if (!found) return picks.map((p) => (p.kind === 'section' ? { kind: 'none' } : p));
    let raised = false;
    for (const [i, pick] of picks.entries()) {
      if (pick.kind !== 'section') continue;
      const utilisation = found[i]!;
      if (utilisation <= request.target) {
        picks[i] = { ...pick, utilisation };
        continue;
      }
      const next = lists[i][lists[i].indexOf(pick.candidate) + 1];
      picks[i] = next ? { kind: 'section', candidate: next, utilisation } : { kind: 'none' };
      raised = true;
    }
    blockBelowNone(picks);
    if (request.noUpwardIncrease && keepNoUpward(picks, lists)) {
      raised = true;
      blockBelowNone(picks);
    }
    if (!raised || picks.every((p) => p.kind !== 'section')) return picks;
  }
}

type Picked = Extract<LiftPick, { kind: 'section' }>;
const everyLiftPicked = (picks: readonly LiftPick[]): picks is readonly Picked[] =>
  picks.every((p) => p.kind === 'section');

/** The trial's utilisations when every lift passes the target and the rules hold, else null. */
function passing(stack: CoupledStack, trial: readonly Picked[]): number[] | null {
  const { request } = stack;
  if (
    request.noUpwardIncrease &&
    trial.some((p, i) => i > 0 && p.candidate.massPerMetre > trial[i - 1].candidate.massPerMetre)
  )
    return null;
  const utilisations = utilisationsWith(stack, trial);
  if (!utilisations) return null;
  return utilisations.every((u) => u <= request.target) ? utilisations : null;
}

/**
 * Lightens a passing proposal by moves that each lower the column's mass: one lift a section lighter
 * (never below `lowest`, its index in the lift's candidates), or that with a neighbour one or two sections
 * heavier. Takes the first move that passes, and repeats until none does. Every move lowers the mass,
 * so it ends.
 */
function lighten(
  stack: CoupledStack,
  start: readonly Picked[],
  lists: readonly (readonly GradedCandidate[])[],
  lowest: readonly number[],
): LiftPick[] {
  let picks = start;
  const mass = (trial: readonly Picked[]) =>
    trial.reduce((sum, p, i) => sum + p.candidate.massPerMetre * stack.lengths[i], 0);
  const moved = (from: readonly Picked[], i: number, steps: number): Picked | null => {
    const index = lists[i].indexOf(from[i].candidate) + steps;
    const candidate = index >= lowest[i] ? lists[i][index] : undefined;
    return candidate ? { kind: 'section', candidate, utilisation: from[i].utilisation } : null;
  };
  const movesOf = (from: readonly Picked[]): Picked[][] => {
    const moves: Picked[][] = [];
    from.forEach((_, i) => {
      const lighter = moved(from, i, -1);
      if (!lighter) return;
      moves.push(from.map((p, k) => (k === i ? lighter : p)));
      for (const j of [i - 1, i + 1]) {
        for (const steps of [1, 2]) {
          const heavier = j >= 0 && j < from.length ? moved(from, j, steps) : null;
          if (heavier) moves.push(from.map((p, k) => (k === i ? lighter : k === j ? heavier : p)));
        }
      }
    });
    return moves.filter((m) => mass(m) < mass(from) - 1e-9);
  };
  for (;;) {
    let next: Picked[] | null = null;
    for (const trial of movesOf(picks)) {
      const utilisations = passing(stack, trial);
      if (utilisations) {
        next = trial.map((p, i) => ({ ...p, utilisation: utilisations[i] }));
        break;
      }
    }
    if (!next) return [...picks];
    picks = next;
  }
}
