// The vertical chain support → lift → (splice → lift)… → cap, walked upward from the support (docs/contracts.md
// §Stack document).
import type { Issue } from '../../schema/results.ts';
import type { NodeOf, StackNode } from '../../schema/stack.ts';
import { SAME_ELEVATION_M } from './context.ts';
import { formatElevation } from './formatElevation.ts';
import { neighbours, type StackGraph } from './stackGraph.ts';

type ChainEnd = NodeOf<'support'> | NodeOf<'splice'> | NodeOf<'cap'>;

export interface ChainLift {
  node: NodeOf<'lift'>;
  /** L1, L2, … from the bottom. */
  name: string;
  below: ChainEnd;
  above: ChainEnd | null;
}

export interface StackChain {
  support: NodeOf<'support'> | null;
  cap: NodeOf<'cap'> | null;
  lifts: ChainLift[];
  /** The walk went from the support to the cap without a fork, gap or loop. */
  complete: boolean;
}

function chainNodeName(node: StackNode, liftNames: ReadonlyMap<string, string>): string {
  switch (node.kind) {
    case 'support':
      return 'The support';
    case 'cap':
      return 'The cap';
    case 'splice':
      return `Splice at ${formatElevation(node.data.elevation)}`;
    case 'lift':
      return `Lift ${liftNames.get(node.id) ?? node.id}`;
    default:
      return 'A node';
  }
}

function singleOfKind<K extends 'support' | 'cap'>(graph: StackGraph, kind: K, issues: Issue[]): NodeOf<K> | null {
  const found = [...graph.nodes.values()].filter((n): n is NodeOf<K> => n.kind === kind);
  if (found.length === 0) issues.push({ message: `The stack has no ${kind}` });
  for (const extra of found.slice(1))
    issues.push({ nodeId: (extra as StackNode).id, message: `The stack has more than one ${kind}` });
  return found[0] ?? null;
}

function walk(
  graph: StackGraph,
  support: NodeOf<'support'>,
  issues: Issue[],
): { lifts: ChainLift[]; reachedCap: boolean; visited: Set<string> } {
  const lifts: ChainLift[] = [];
  const names = new Map<string, string>();
  const visited = new Set<string>([support.id]);
  let current: ChainEnd = support;
  for (;;) {
    const upLifts = neighbours(graph, current.id, 'out', ['lift']) as NodeOf<'lift'>[];
    if (upLifts.length === 0) {
      issues.push({ nodeId: current.id, message: `${chainNodeName(current, names)} has no lift above it` });
      return { lifts, reachedCap: false, visited };
    }
    if (upLifts.length > 1)
      issues.push({ nodeId: current.id, message: `${chainNodeName(current, names)} has more than one lift above it` });
    const lift = upLifts[0];
    if (visited.has(lift.id)) {
      issues.push({ nodeId: lift.id, message: `The chain loops back on itself at ${chainNodeName(lift, names)}` });
      return { lifts, reachedCap: false, visited };
    }
    visited.add(lift.id);
    names.set(lift.id, `L${lifts.length + 1}`);
    const liftName = `Lift ${names.get(lift.id)}`;
    if (neighbours(graph, lift.id, 'in', ['support', 'splice']).length > 1) {
      issues.push({ nodeId: lift.id, message: `${liftName} has more than one node below it` });
    }
    const ups = neighbours(graph, lift.id, 'out', ['splice', 'cap']) as (NodeOf<'splice'> | NodeOf<'cap'>)[];
    const entry: ChainLift = { node: lift, name: names.get(lift.id) ?? lift.id, below: current, above: ups[0] ?? null };
    lifts.push(entry);
    if (ups.length === 0) {
      issues.push({ nodeId: lift.id, message: `${liftName} has no node above it` });
      return { lifts, reachedCap: false, visited };
    }
    if (ups.length > 1) issues.push({ nodeId: lift.id, message: `${liftName} has more than one node above it` });
    const next = ups[0];
    if (visited.has(next.id)) {
      issues.push({ nodeId: next.id, message: `The chain loops back on itself at ${chainNodeName(next, names)}` });
      return { lifts, reachedCap: false, visited };
    }
    visited.add(next.id);
    if (neighbours(graph, next.id, 'in', ['lift']).length > 1) {
      issues.push({ nodeId: next.id, message: `${chainNodeName(next, names)} has more than one lift below it` });
    }
    const bottom = current.data.elevation;
    const top = next.data.elevation;
    if (top <= bottom + SAME_ELEVATION_M) {
      issues.push({
        nodeId: lift.id,
        message: `${liftName} runs from ${formatElevation(bottom)} to ${formatElevation(top)}: the node above a lift must be higher than the node below it`,
      });
    }
    if (next.kind === 'cap') return { lifts, reachedCap: true, visited };
    current = next;
  }
}

export function walkStackChain(graph: StackGraph): { chain: StackChain; issues: Issue[] } {
  const issues: Issue[] = [];
  const support = singleOfKind(graph, 'support', issues);
  const cap = singleOfKind(graph, 'cap', issues);
  const walked = support ? walk(graph, support, issues) : { lifts: [], reachedCap: false, visited: new Set<string>() };
  const noNames = new Map<string, string>();
  for (const node of graph.nodes.values()) {
    if ((node.kind !== 'lift' && node.kind !== 'splice') || walked.visited.has(node.id)) continue;
    issues.push({
      nodeId: node.id,
      message: `${chainNodeName(node, noNames)} is not connected to the chain that runs from the support to the cap`,
    });
  }
  if (cap && support && !walked.visited.has(cap.id)) {
    const below = neighbours(graph, cap.id, 'in', ['lift']);
    issues.push({
      nodeId: cap.id,
      message:
        below.length === 0
          ? 'The cap has no lift below it'
          : 'The cap is not connected to the chain that rises from the support',
    });
  }
  const complete = walked.reachedCap && issues.length === 0;
  return { chain: { support, cap, lifts: walked.lifts, complete }, issues };
}
