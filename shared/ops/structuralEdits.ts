// Structural edits as single commands: each returns the whole batch of ops for one edit, so the document
// is never sent (or analysed) in a broken state between the steps, and one undo takes the whole edit back.
// Pure: the ids of new nodes and edges come from the caller. They read elevations from the document they are
// given, which is placed on its building's levels first (placeOnLevels; the client's stack store does so), so a
// tied node's copy of its level's elevation is never what they read. See docs/stack-editing.md.
import type { Op } from '../schema/ops.ts';
import type { NodeOf, StackDocument, StackNode } from '../schema/stack.ts';
import { formatElevation } from '../wording.ts';

/** A command that does not fit the document, with the reason in plain words. */
export class StructuralEditError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'StructuralEditError';
  }
}

/** Shortest lift a split or a moved splice may leave (common practice, no source: a splice needs room). */
export const MIN_LIFT_M = 0.3;

export type NewId = (prefix: 'lift' | 'splice' | 'restraint' | 'edge') => string;

type ChainEnd = NodeOf<'support'> | NodeOf<'splice'> | NodeOf<'cap'>;
const isEnd = (n: StackNode | undefined): n is ChainEnd =>
  n?.kind === 'support' || n?.kind === 'splice' || n?.kind === 'cap';

interface LiftSpan {
  lift: NodeOf<'lift'>;
  below: ChainEnd;
  above: ChainEnd;
  /** Id of the edge lift → above. */
  upEdge: string;
}

function nodeOf(doc: StackDocument, id: string): StackNode {
  const n = doc.nodes.find((x) => x.id === id);
  if (!n) throw new StructuralEditError('That node is no longer in the stack');
  return n;
}

/** The lift with the chain ends it stands on and carries, read from its edges. */
function liftSpan(doc: StackDocument, liftId: string): LiftSpan {
  const lift = nodeOf(doc, liftId);
  if (lift.kind !== 'lift') throw new StructuralEditError('Pick a lift');
  const byId = new Map(doc.nodes.map((n) => [n.id, n]));
  const below = doc.edges.map((e) => (e.target === liftId ? byId.get(e.source) : undefined)).find(isEnd);
  const up = doc.edges.find((e) => e.source === liftId && isEnd(byId.get(e.target)));
  const above = up ? byId.get(up.target) : undefined;
  if (!below || !up || !isEnd(above))
    throw new StructuralEditError('The lift must stand on the support or a splice and carry a splice or the cap');
  return { lift, below, above, upEdge: up.id };
}

/** Restraints attached to a lift (edges restraint → lift). */
function restraintsOn(doc: StackDocument, liftId: string): { node: NodeOf<'restraint'>; edgeId: string }[] {
  const byId = new Map(doc.nodes.map((n) => [n.id, n]));
  return doc.edges.flatMap((e) => {
    const n = byId.get(e.source);
    return e.target === liftId && n?.kind === 'restraint' ? [{ node: n, edgeId: e.id }] : [];
  });
}

function checkInside(z: number, bottom: number, top: number, what: string): void {
  if (!Number.isFinite(z) || z < bottom + MIN_LIFT_M || z > top - MIN_LIFT_M) {
    throw new StructuralEditError(
      `${what} must be between ${formatElevation(bottom + MIN_LIFT_M)} and ${formatElevation(top - MIN_LIFT_M)} m (each lift at least ${MIN_LIFT_M} m long)`,
    );
  }
}

/** Moves each restraint to the lift whose span now holds it (at the splice itself it stays on the lower lift). */
function reattach(
  restraints: { node: NodeOf<'restraint'>; edgeId: string; on: string }[],
  z: number,
  lower: string,
  upper: string,
  newId: NewId,
): Op[] {
  return restraints.flatMap(({ node, edgeId, on }): Op[] => {
    const target = node.data.elevation > z ? upper : lower;
    if (target === on) return [];
    return [
      { op: 'removeEdge', id: edgeId },
      { op: 'addEdge', edge: { id: newId('edge'), source: node.id, target } },
    ];
  });
}

/**
 * Splits a lift at `elevation`: a splice there and a new upper lift with the same section and grade,
 * marked 'to-confirm' until the engineer confirms it. Restraints above the splice move to the new lift.
 */
export function splitLiftOps(
  doc: StackDocument,
  liftId: string,
  elevation: number,
  newId: NewId,
): { ops: Op[]; spliceId: string; upperId: string } {
  const { lift, below, above, upEdge } = liftSpan(doc, liftId);
  checkInside(elevation, below.data.elevation, above.data.elevation, 'The splice');
  const spliceId = newId('splice');
  const upperId = newId('lift');
  const { section, grade } = lift.data;
  const ops: Op[] = [
    { op: 'addNode', node: { id: spliceId, kind: 'splice', data: { elevation } } },
    { op: 'addNode', node: { id: upperId, kind: 'lift', data: { section, grade, sectionStatus: 'to-confirm' } } },
    { op: 'removeEdge', id: upEdge },
    { op: 'addEdge', edge: { id: newId('edge'), source: liftId, target: spliceId } },
    { op: 'addEdge', edge: { id: newId('edge'), source: spliceId, target: upperId } },
    { op: 'addEdge', edge: { id: newId('edge'), source: upperId, target: above.id } },
    ...reattach(
      restraintsOn(doc, liftId).map((r) => ({ ...r, on: liftId })),
      elevation,
      liftId,
      upperId,
      newId,
    ),
  ];
  return { ops, spliceId, upperId };
}

/** The lifts on either side of a splice. */
function spliceLifts(
  doc: StackDocument,
  spliceId: string,
): { splice: NodeOf<'splice'>; lower: LiftSpan; upper: LiftSpan } {
  const splice = nodeOf(doc, spliceId);
  if (splice.kind !== 'splice') throw new StructuralEditError('Pick a splice');
  const lowerId = doc.edges.find((e) => e.target === spliceId && nodeOf(doc, e.source).kind === 'lift')?.source;
  const upperId = doc.edges.find((e) => e.source === spliceId && nodeOf(doc, e.target).kind === 'lift')?.target;
  if (!lowerId || !upperId) throw new StructuralEditError('The splice must have a lift below it and a lift above it');
  return { splice, lower: liftSpan(doc, lowerId), upper: liftSpan(doc, upperId) };
}

/** Joins the two lifts at a splice into the lower one (its section and grade), removing the splice. */
export function joinLiftsOps(doc: StackDocument, spliceId: string, newId: NewId): { ops: Op[]; liftId: string } {
  const { lower, upper } = spliceLifts(doc, spliceId);
  const moved = restraintsOn(doc, upper.lift.id);
  const ops: Op[] = [
    { op: 'removeNode', id: spliceId },
    { op: 'removeNode', id: upper.lift.id },
    { op: 'addEdge', edge: { id: newId('edge'), source: lower.lift.id, target: upper.above.id } },
    ...moved.map(({ node }): Op => ({
      op: 'addEdge',
      edge: { id: newId('edge'), source: node.id, target: lower.lift.id },
    })),
  ];
  return { ops, liftId: lower.lift.id };
}

/** Moves a splice to `elevation` within its two lifts; restraints follow to the lift that now holds them. */
export function moveSpliceOps(doc: StackDocument, spliceId: string, elevation: number, newId: NewId): Op[] {
  const { lower, upper } = spliceLifts(doc, spliceId);
  checkInside(elevation, lower.below.data.elevation, upper.above.data.elevation, 'The splice');
  const restraints = [
    ...restraintsOn(doc, lower.lift.id).map((r) => ({ ...r, on: lower.lift.id })),
    ...restraintsOn(doc, upper.lift.id).map((r) => ({ ...r, on: upper.lift.id })),
  ];
  return [
    { op: 'updateNode', id: spliceId, data: { elevation } },
    ...reattach(restraints, elevation, lower.lift.id, upper.lift.id, newId),
  ];
}

export interface LevelRef {
  id: string;
  name: string;
  elevation: number;
}

/** The lifts of the document with their spans, for finding the one that holds an elevation. */
function liftSpans(doc: StackDocument): LiftSpan[] {
  return doc.nodes.flatMap((n) => {
    if (n.kind !== 'lift') return [];
    try {
      return [liftSpan(doc, n.id)];
    } catch (e) {
      if (e instanceof StructuralEditError) return [];
      throw e;
    }
  });
}

/** A floor restraint (both axes, pinned, no load yet) on the level, attached to the lift that spans it. */
export function addFloorRestraintOps(
  doc: StackDocument,
  level: LevelRef,
  newId: NewId,
): { ops: Op[]; restraintId: string } {
  const taken = doc.nodes.find(
    (n) =>
      n.kind === 'restraint' && (n.data.levelId === level.id || Math.abs(n.data.elevation - level.elevation) < 1e-6),
  );
  if (taken) throw new StructuralEditError(`There is already a restraint at ${level.name}`);
  const spans = liftSpans(doc);
  const holder = spans.find(
    (s) => level.elevation > s.below.data.elevation && level.elevation <= s.above.data.elevation,
  );
  if (!holder) throw new StructuralEditError(`No lift spans ${level.name} (${formatElevation(level.elevation)} m)`);
  const restraintId = newId('restraint');
  const ops: Op[] = [
    {
      op: 'addNode',
      node: {
        id: restraintId,
        kind: 'restraint',
        data: {
          elevation: level.elevation,
          levelId: level.id,
          axes: 'both',
          fixity: 'pinned',
          Gk: 0,
          Qk: 0,
          category: 'B',
        },
      },
    },
    { op: 'addEdge', edge: { id: newId('edge'), source: restraintId, target: holder.lift.id } },
  ];
  return { ops, restraintId };
}

/** The lift that spans an elevation (for the split command started from an elevation rather than a lift). */
export function liftAt(doc: StackDocument, elevation: number): string | null {
  return (
    liftSpans(doc).find((s) => elevation > s.below.data.elevation && elevation < s.above.data.elevation)?.lift.id ??
    null
  );
}

/**
 * Moves a restraint that is not tied to a level to `elevation`, re-attaching it to the lift that spans the
 * new elevation. One tied to a level follows the level and is refused here.
 */
export function moveRestraintOps(doc: StackDocument, restraintId: string, elevation: number, newId: NewId): Op[] {
  const node = nodeOf(doc, restraintId);
  if (node.kind !== 'restraint') throw new StructuralEditError('Pick a restraint');
  if (node.data.levelId)
    throw new StructuralEditError(
      'This restraint sits on a level and moves with it: move the level, or untie the restraint first',
    );
  const holder = liftSpans(doc).find((s) => elevation > s.below.data.elevation && elevation <= s.above.data.elevation);
  if (!holder) throw new StructuralEditError(`No lift spans ${formatElevation(elevation)} m`);
  const edge = doc.edges.find((e) => e.source === restraintId && nodeOf(doc, e.target).kind === 'lift');
  const ops: Op[] = [{ op: 'updateNode', id: restraintId, data: { elevation } }];
  if (edge?.target !== holder.lift.id) {
    if (edge) ops.push({ op: 'removeEdge', id: edge.id });
    ops.push({ op: 'addEdge', edge: { id: newId('edge'), source: restraintId, target: holder.lift.id } });
  }
  return ops;
}
