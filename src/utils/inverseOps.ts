// Undo is a new edit: the ops that take the document back to what it was before `ops` were applied,
// computed from that earlier document. Pure; the store sends the result through the live channel.
import type { Op } from '@shared/schema/ops.ts';
import type { StackDocument, StackEdge, StackNode } from '@shared/schema/stack.ts';
import { layoutByElevation, type XY } from '@/utils/layoutByElevation.ts';

/** Re-creates a node exactly as it was, with the edges that touched it. */
function restoreNode(node: StackNode, edges: StackEdge[]): Op[] {
  const touching = edges.filter((e) => e.source === node.id || e.target === node.id);
  return [
    { op: 'addNode', node: structuredClone(node) },
    ...touching.map((edge): Op => ({ op: 'addEdge', edge: { ...edge } })),
  ];
}

function inverseOf(op: Op, before: StackDocument, drawnAt: (id: string) => XY | undefined): Op[] {
  switch (op.op) {
    case 'addNode':
      return [{ op: 'removeNode', id: op.node.id }];
    case 'addEdge':
      return [{ op: 'removeEdge', id: op.edge.id }];
    case 'removeEdge': {
      const edge = before.edges.find((e) => e.id === op.id);
      return edge ? [{ op: 'addEdge', edge: { ...edge } }] : [];
    }
    case 'removeNode': {
      const node = before.nodes.find((n) => n.id === op.id);
      return node ? restoreNode(node, before.edges) : [];
    }
    case 'moveNode': {
      const node = before.nodes.find((n) => n.id === op.id);
      const position = node?.position ?? drawnAt(op.id);
      return position ? [{ op: 'moveNode', id: op.id, position: { ...position } }] : [];
    }
    case 'updateNode': {
      const node = before.nodes.find((n) => n.id === op.id);
      if (!node) return [];
      const old = node.data as Record<string, unknown>;
      const keys = Object.keys(op.data);
      // A shallow merge cannot delete a key, so a key that was absent is undone by re-creating the node.
      if (keys.some((k) => !(k in old))) return [{ op: 'removeNode', id: node.id }, ...restoreNode(node, before.edges)];
      return [{ op: 'updateNode', id: op.id, data: Object.fromEntries(keys.map((k) => [k, structuredClone(old[k])])) }];
    }
  }
}

/**
 * Ops that undo `ops` applied to `before`. Each op is inverted against the document as it stood just
 * before that op, so a batch that touches one node twice is undone correctly; they run in reverse.
 */
export function inverseOps(
  before: StackDocument,
  ops: Op[],
  apply: (doc: StackDocument, ops: Op[]) => StackDocument,
  drawnAt: (id: string) => XY | undefined = () => undefined,
): Op[] {
  const inverses: Op[][] = [];
  let doc = before;
  for (const op of ops) {
    inverses.push(inverseOf(op, doc, drawnAt));
    doc = apply(doc, [op]);
  }
  return inverses.reverse().flat();
}

/** Ops that give a node new data with some keys removed, which a shallow-merge update cannot do. */
export function replaceNodeOps(doc: StackDocument, id: string, data: StackNode['data']): Op[] {
  const node = doc.nodes.find((n) => n.id === id);
  if (!node) return [];
  return [{ op: 'removeNode', id }, ...restoreNode({ ...node, data } as StackNode, doc.edges)];
}

/** Where the graph draws each node of `doc` that has no stored position (laid out once, on first ask). */
export function drawnWhereLaidOut(doc: StackDocument): (id: string) => XY | undefined {
  let layout: Map<string, XY> | null = null;
  return (id) => (layout ??= layoutByElevation(doc)).get(id);
}
