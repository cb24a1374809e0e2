// A whole-document write (REST PUT) recorded as ops, so catch-up and live rooms see ordinary edits.
// Order: removeEdge, removeNode, addNode, updateNode, moveNode, addEdge. A node whose kind changed,
// whose data lost a key or whose position was cleared is removed and added again (updateNode only
// merges); its edges that still exist are then added again.
import type { Op } from '../../shared/schema/ops.ts';
import type { StackDocument, StackEdge, StackNode } from '../../shared/schema/stack.ts';

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
const sameEdge = (a: StackEdge, b: StackEdge) => a.source === b.source && a.target === b.target;

function needsReplace(before: StackNode, after: StackNode): boolean {
  if (before.kind !== after.kind) return true;
  if (before.position && !after.position) return true;
  const afterKeys = new Set(Object.keys(after.data));
  return Object.keys(before.data).some((k) => !afterKeys.has(k));
}

export function diffDocs(before: StackDocument, after: StackDocument): Op[] {
  const oldNodes = new Map(before.nodes.map((n) => [n.id, n]));
  const newNodes = new Map(after.nodes.map((n) => [n.id, n]));
  const newEdges = new Map(after.edges.map((e) => [e.id, e]));
  const removeEdges: Op[] = [];
  const removeNodes: Op[] = [];
  const addNodes: Op[] = [];
  const updates: Op[] = [];
  const moves: Op[] = [];

  const removedNodeIds = new Set<string>();
  for (const [id, old] of oldNodes) {
    const next = newNodes.get(id);
    if (!next || needsReplace(old, next)) {
      removedNodeIds.add(id);
      removeNodes.push({ op: 'removeNode', id });
      if (next) addNodes.push({ op: 'addNode', node: next });
      continue;
    }
    if (!same(old.data, next.data)) updates.push({ op: 'updateNode', id, data: { ...next.data } });
    if (next.position && !same(old.position, next.position))
      moves.push({ op: 'moveNode', id, position: next.position });
  }
  for (const [id, node] of newNodes) if (!oldNodes.has(id)) addNodes.push({ op: 'addNode', node });

  const keptEdgeIds = new Set<string>();
  for (const e of before.edges) {
    const next = newEdges.get(e.id);
    const dropped = removedNodeIds.has(e.source) || removedNodeIds.has(e.target);
    if (next && sameEdge(e, next) && !dropped) keptEdgeIds.add(e.id);
    else if (!dropped) removeEdges.push({ op: 'removeEdge', id: e.id });
  }
  const addEdges: Op[] = after.edges.filter((e) => !keptEdgeIds.has(e.id)).map((edge) => ({ op: 'addEdge', edge }));
  return [...removeEdges, ...removeNodes, ...addNodes, ...updates, ...moves, ...addEdges];
}
