// The document's nodes and edges as a graph, keeping only connections a stack allows
// (docs/contracts.md §Stack document).
import type { Issue } from '../../schema/results.ts';
import type { NodeKind, StackDocument, StackEdge, StackNode } from '../../schema/stack.ts';

export interface StackGraph {
  nodes: ReadonlyMap<string, StackNode>;
  /** Valid connections only: source → targets and target → sources, each list sorted by id. */
  out: ReadonlyMap<string, string[]>;
  in: ReadonlyMap<string, string[]>;
}

/** Connections a stack allows, all pointing upward or toward what carries the load. */
const ALLOWED: ReadonlySet<string> = new Set([
  'support>lift',
  'lift>splice',
  'lift>cap',
  'splice>lift',
  'restraint>lift',
  'load>restraint',
  'load>cap',
]);

const KIND_WORD: Record<NodeKind, string> = {
  support: 'the support',
  lift: 'a lift',
  splice: 'a splice',
  restraint: 'a restraint',
  cap: 'the cap',
  load: 'a load',
};

function push(map: Map<string, string[]>, key: string, value: string): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

/** What is wrong with one connection, or null when the stack allows it. */
function edgeProblem(edge: StackEdge, source: StackNode | undefined, target: StackNode | undefined): string | null {
  if (!source) return `Connection ${edge.id} starts from a node ${edge.source} that does not exist`;
  if (!target) return `Connection ${edge.id} points to a node ${edge.target} that does not exist`;
  if (edge.source === edge.target) return `Connection ${edge.id} joins ${KIND_WORD[source.kind]} to itself`;
  if (ALLOWED.has(`${source.kind}>${target.kind}`)) return null;
  if (ALLOWED.has(`${target.kind}>${source.kind}`)) {
    return `Connection ${edge.id} points from ${KIND_WORD[source.kind]} down to ${KIND_WORD[target.kind]}; connections point upward, toward what carries the load`;
  }
  return `Connection ${edge.id} joins ${KIND_WORD[source.kind]} to ${KIND_WORD[target.kind]}, which a stack does not allow`;
}

function edgeIssues(doc: StackDocument, nodes: ReadonlyMap<string, StackNode>, issues: Issue[]): StackEdge[] {
  const kept: StackEdge[] = [];
  const edgeIds = new Set<string>();
  const pairs = new Map<string, string>();
  for (const edge of doc.edges) {
    const source = nodes.get(edge.source);
    const target = nodes.get(edge.target);
    const nodeId = source ? edge.source : target ? edge.target : undefined;
    if (edgeIds.has(edge.id))
      issues.push({ nodeId, edgeId: edge.id, message: `Two connections share the id ${edge.id}` });
    edgeIds.add(edge.id);
    const problem = edgeProblem(edge, source, target);
    if (!problem && !source) continue;
    const pair = `${edge.source}>${edge.target}`;
    const first = pairs.get(pair);
    const message = problem ?? (first !== undefined ? `Connection ${edge.id} repeats connection ${first}` : null);
    if (message) {
      issues.push({ nodeId, edgeId: edge.id, message });
      continue;
    }
    pairs.set(pair, edge.id);
    kept.push(edge);
  }
  return kept;
}

export function buildStackGraph(doc: StackDocument): { graph: StackGraph; issues: Issue[] } {
  const issues: Issue[] = [];
  const nodes = new Map<string, StackNode>();
  for (const node of doc.nodes) {
    if (nodes.has(node.id)) issues.push({ nodeId: node.id, message: `Two nodes share the id ${node.id}` });
    else nodes.set(node.id, node);
  }
  const out = new Map<string, string[]>();
  const into = new Map<string, string[]>();
  for (const edge of edgeIssues(doc, nodes, issues)) {
    push(out, edge.source, edge.target);
    push(into, edge.target, edge.source);
  }
  for (const list of out.values()) list.sort();
  for (const list of into.values()) list.sort();
  return { graph: { nodes, out, in: into }, issues };
}

/** Neighbours of a node of the given kinds, following valid connections in one direction. */
export function neighbours(
  graph: StackGraph,
  id: string,
  direction: 'out' | 'in',
  kinds: readonly NodeKind[],
): StackNode[] {
  const ids = (direction === 'out' ? graph.out : graph.in).get(id) ?? [];
  const found: StackNode[] = [];
  for (const other of ids) {
    const node = graph.nodes.get(other);
    if (node && kinds.includes(node.kind)) found.push(node);
  }
  return found;
}
