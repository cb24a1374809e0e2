// Applying edit operations to a stack document (docs/contracts.md §Edits). Pure: the server applies committed edits
// with it and the client applies its own edits optimistically with the same code.
import type { Op } from '../schema/ops.ts';
import {
  nodeDataSchemas,
  stackNodeSchema,
  type StackDocument,
  type StackEdge,
  type StackNode,
} from '../schema/stack.ts';

/** An op that cannot be applied: which one, on which id, and why in plain words. */
export class OpError extends Error {
  constructor(
    readonly opIndex: number,
    readonly id: string,
    message: string,
  ) {
    super(`Edit ${opIndex + 1} (${id}): ${message}`);
    this.name = 'OpError';
  }
}

/** Applies the ops in order and returns a new document; the input is not changed. Throws OpError. */
export function applyOps(doc: StackDocument, ops: readonly Op[]): StackDocument {
  const nodes = new Map<string, StackNode>(doc.nodes.map((n) => [n.id, n]));
  const edges = new Map<string, StackEdge>(doc.edges.map((e) => [e.id, e]));
  ops.forEach((op, i) => applyOne(nodes, edges, op, i));
  return { nodes: [...nodes.values()], edges: [...edges.values()] };
}

function applyOne(nodes: Map<string, StackNode>, edges: Map<string, StackEdge>, op: Op, i: number): void {
  const taken = (id: string) => nodes.has(id) || edges.has(id);
  const node = (id: string) => {
    const n = nodes.get(id);
    if (!n) throw new OpError(i, id, 'there is no node with this id');
    return n;
  };
  switch (op.op) {
    case 'addNode':
      if (taken(op.node.id)) throw new OpError(i, op.node.id, 'this id is already used');
      nodes.set(op.node.id, op.node);
      return;
    case 'updateNode': {
      const n = node(op.id);
      const parsed = nodeDataSchemas[n.kind].safeParse({ ...n.data, ...op.data });
      if (!parsed.success) {
        const issue = parsed.error.issues[0];
        throw new OpError(i, op.id, `${issue.path.map(String).join('.') || 'data'} ${issue.message}`);
      }
      nodes.set(op.id, stackNodeSchema.parse({ ...n, data: parsed.data }));
      return;
    }
    case 'moveNode': {
      const moved = stackNodeSchema.safeParse({ ...node(op.id), position: op.position });
      if (!moved.success) throw new OpError(i, op.id, `position ${moved.error.issues[0].message}`);
      nodes.set(op.id, moved.data);
      return;
    }
    case 'removeNode':
      node(op.id);
      nodes.delete(op.id);
      for (const [id, e] of edges) if (e.source === op.id || e.target === op.id) edges.delete(id);
      return;
    case 'addEdge':
      if (taken(op.edge.id)) throw new OpError(i, op.edge.id, 'this id is already used');
      if (!nodes.has(op.edge.source)) throw new OpError(i, op.edge.id, `its source ${op.edge.source} does not exist`);
      if (!nodes.has(op.edge.target)) throw new OpError(i, op.edge.id, `its target ${op.edge.target} does not exist`);
      if (op.edge.source === op.edge.target) throw new OpError(i, op.edge.id, 'an edge cannot join a node to itself');
      edges.set(op.edge.id, op.edge);
      return;
    case 'removeEdge':
      if (!edges.delete(op.id)) throw new OpError(i, op.id, 'there is no edge with this id');
      return;
  }
}

/**
 * Node and edge ids the ops touch, read against the document they apply to. Two edits conflict when
 * these sets overlap. removeNode touches the node and its edges; addEdge touches the edge and both
 * of its ends, so an edge is never attached to a node someone else has just removed.
 */
export function touchedIds(doc: StackDocument, ops: readonly Op[]): Set<string> {
  const touched = new Set<string>();
  let edges = doc.edges;
  for (const op of ops) {
    switch (op.op) {
      case 'addNode':
        touched.add(op.node.id);
        break;
      case 'updateNode':
      case 'moveNode':
      case 'removeEdge':
        touched.add(op.id);
        break;
      case 'removeNode':
        touched.add(op.id);
        for (const e of edges) if (e.source === op.id || e.target === op.id) touched.add(e.id);
        break;
      case 'addEdge':
        touched.add(op.edge.id).add(op.edge.source).add(op.edge.target);
        edges = [...edges, op.edge];
        break;
    }
  }
  return touched;
}
