// What a node component is given to draw: the node's own data plus what the page knows about it
// (problems, result, who else has it selected). Lives only on screen; never stored.
import type { NodeKind, NodeOf } from '@shared/schema/stack.ts';
import type { Span } from '@/utils/stackChain.ts';

export interface NodeProblem {
  severity: 'error' | 'warning';
  message: string;
}

export interface Colleague {
  name: string;
  colour: string;
}

export interface NodeView<K extends NodeKind = NodeKind> {
  kind: K;
  value: NodeOf<K>['data'];
  title: string;
  problems: NodeProblem[];
  /** Lifts: the worst utilisation of the lift, once analysed. */
  utilisation: number | null;
  /** Lifts: this is the governing lift of the stack. */
  governing: boolean;
  /** Lifts: bottom and top elevations (m) when the lift is joined both ways. */
  span: Span | null;
  others: Colleague[];
  readOnly: boolean;
  /** Drawn in the compressed (whole tall stack) drawing: one line, no details. */
  compact?: boolean;
  /** Restraints and the cap of a stack on the grid, on a level with a floor load: where their loads come from. */
  loadsFrom?: 'floor' | 'hand';
}

/** The part of a node's view that its frame draws, whatever its kind. */
export type NodeFrame = Pick<NodeView, 'kind' | 'title' | 'problems' | 'governing' | 'others' | 'compact'>;

/** A building level drawn across the graph (not a node of the stack). */
export interface LevelView {
  name: string;
  elevation: number;
  /** False where the levels are too close to name every one. */
  labelled: boolean;
  /** In the compressed drawing the line stops at the loads column, so Fit keeps the names in view. */
  compact: boolean;
}
/** Where level lines start: left of every column of the drawing, so their names sit at the side. */
export const LEVEL_LINE_X = -420;

/** Handle ids, so a connection reads the same whichever way the user drew it. */
export const HANDLE = { up: 'up', below: 'below', side: 'side', load: 'load' } as const;

/** Distinct, readable colours for colleagues' selections (common practice, no source). */
const PRESENCE_COLOURS = ['#7b4fa0', '#b5651d', '#1f7a8c', '#a23b72', '#4f6d7a', '#6a8d24'];

export function colleagueColour(userId: number): string {
  return PRESENCE_COLOURS[Math.abs(userId) % PRESENCE_COLOURS.length];
}

export function initials(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  return (parts.length > 1 ? parts[0][0] + parts[parts.length - 1][0] : (parts[0] ?? '?').slice(0, 2)).toUpperCase();
}
