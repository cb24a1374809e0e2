// Copy and paste of part of a stack: the copied nodes with the edges between them, pasted under fresh
// ids beside the originals. Pure; the result is a list of ops for one edit.
import type { Op } from '@shared/schema/ops.ts';
import type { NodeKind, StackDocument, StackEdge, StackNode } from '@shared/schema/stack.ts';
import type { XY } from '@/utils/layoutByElevation.ts';

export interface Clip {
  nodes: StackNode[];
  edges: StackEdge[];
}

/** Offset of a pasted copy from the original, in graph pixels. */
export const PASTE_OFFSET: XY = { x: 40, y: 40 };

/** A fresh id such as "lift-k3f9x2", not used in the document. */
export function newId(prefix: NodeKind | 'edge', taken: Set<string>): string {
  for (;;) {
    const id = `${prefix}-${Math.random().toString(36).slice(2, 8)}`;
    if (!taken.has(id)) {
      taken.add(id);
      return id;
    }
  }
}

export function copySelection(doc: StackDocument, ids: readonly string[]): Clip {
  const wanted = new Set(ids);
  return structuredClone({
    nodes: doc.nodes.filter((n) => wanted.has(n.id)),
    edges: doc.edges.filter((e) => wanted.has(e.source) && wanted.has(e.target)),
  });
}

/** Ops that add a copy of the clip to `doc`; `drawnAt` gives where a node without a stored position is drawn. */
export function pasteOps(
  doc: StackDocument,
  clip: Clip,
  drawnAt: (id: string) => XY | undefined,
): { ops: Op[]; newIds: string[] } {
  const taken = new Set([...doc.nodes.map((n) => n.id), ...doc.edges.map((e) => e.id)]);
  const renamed = new Map<string, string>();
  const ops: Op[] = [];
  for (const node of clip.nodes) {
    const id = newId(node.kind, taken);
    renamed.set(node.id, id);
    const at = node.position ?? drawnAt(node.id) ?? { x: 0, y: 0 };
    const copy = {
      ...structuredClone(node),
      id,
      position: { x: at.x + PASTE_OFFSET.x, y: at.y + PASTE_OFFSET.y },
    } as StackNode;
    ops.push({ op: 'addNode', node: copy });
  }
  for (const edge of clip.edges) {
    const source = renamed.get(edge.source);
    const target = renamed.get(edge.target);
    if (source && target) ops.push({ op: 'addEdge', edge: { id: newId('edge', taken), source, target } });
  }
  return { ops, newIds: [...renamed.values()] };
}
