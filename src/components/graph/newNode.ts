// What the palette adds: a node of the chosen kind with plain starting values, joined to the selected
// node when the document allows that connection, so building a stack upward takes one click per part.
import type { Op } from '@shared/schema/ops.ts';
import type { NodeKind, StackDocument, StackNode } from '@shared/schema/stack.ts';
import { newId } from '@/utils/clipboardOps.ts';
import { ownElevation } from '@/utils/stackChain.ts';
import { applyOps } from '@shared/ops/applyOps.ts';
import { connectionRefusal } from './connectionRules.ts';

/** A typical storey height for a new level above the top of the stack (common practice, no source). */
export const DEFAULT_STOREY_M = 4;
/** A placeholder section for a new lift, marked not chosen; the engineer picks the real one in the properties pane. */
export const DEFAULT_SECTION = 'UKC 203x203x46';

function highest(doc: StackDocument): number | null {
  const zs = doc.nodes.map(ownElevation).filter((z): z is number => z !== null);
  return zs.length ? Math.max(...zs) : null;
}

function startingData(kind: NodeKind, doc: StackDocument, near: StackNode | undefined): StackNode['data'] {
  const nearZ = near ? ownElevation(near) : null;
  const above = (nearZ ?? highest(doc) ?? -DEFAULT_STOREY_M) + DEFAULT_STOREY_M;
  switch (kind) {
    case 'support':
      return { elevation: 0, fixity: 'pinned' };
    case 'lift':
      // A placeholder the analysis refuses until the engineer picks the section (never a neighbour's, silently).
      return { section: DEFAULT_SECTION, grade: 'S355', sectionStatus: 'not-chosen' };
    case 'splice':
      return { elevation: above };
    case 'restraint':
      return { elevation: nearZ ?? above, axes: 'both', fixity: 'pinned', Gk: 0, Qk: 0, category: 'B' };
    case 'cap':
      return { elevation: above, fixity: 'pinned', Gk: 0, Qk: 0, category: 'H' };
    case 'load':
      return { label: 'Extra load', Gk: 0, Qk: 0, category: 'B' };
  }
}

/** Ops adding a node of `kind`, joined to `selectedId` when that connection is allowed either way. */
export function addNodeOps(doc: StackDocument, kind: NodeKind, selectedId: string | null): { ops: Op[]; id: string } {
  const taken = new Set([...doc.nodes.map((n) => n.id), ...doc.edges.map((e) => e.id)]);
  const near = doc.nodes.find((n) => n.id === selectedId);
  const id = newId(kind, taken);
  const node = { id, kind, data: startingData(kind, doc, near) } as StackNode;
  const ops: Op[] = [{ op: 'addNode', node }];
  if (near) {
    const withNode = applyOps(doc, ops);
    const pair =
      connectionRefusal(withNode, near.id, id) === null
        ? [near.id, id]
        : connectionRefusal(withNode, id, near.id) === null
          ? [id, near.id]
          : null;
    if (pair) ops.push({ op: 'addEdge', edge: { id: newId('edge', taken), source: pair[0], target: pair[1] } });
  }
  return { ops, id };
}
