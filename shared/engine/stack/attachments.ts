// Restraints attached to the lift that contains them, and loads attached to a restraint or the cap (docs/contracts.md
// §Stack document).
import type { Issue } from '../../schema/results.ts';
import type { Axes, Category, Fixity, NodeOf } from '../../schema/stack.ts';
import { SAME_ELEVATION_M } from './context.ts';
import { formatElevation } from './formatElevation.ts';
import type { ChainLift, StackChain } from './stackChain.ts';
import { neighbours, type StackGraph } from './stackGraph.ts';
import type { LoadEntry } from './takeDown.ts';

export interface ModelRestraint {
  id: string;
  elevation: number;
  axes: Axes;
  fixity: Fixity;
  liftId: string;
}

function addLoad(entry: LoadEntry, Gk: number, Qk: number, category: Category): void {
  entry.Gk += Gk;
  if (Qk > 0) entry.Qk[category] = (entry.Qk[category] ?? 0) + Qk;
}

function restraintName(elevation: number): string {
  return `Restraint at ${formatElevation(elevation)}`;
}

function checkRestraint(
  node: NodeOf<'restraint'>,
  elevation: number,
  graph: StackGraph,
  chain: StackChain,
  liftsById: ReadonlyMap<string, ChainLift>,
  errors: Issue[],
): ModelRestraint | null {
  const lifts = neighbours(graph, node.id, 'out', ['lift']);
  if (lifts.length !== 1) {
    const problem = lifts.length === 0 ? 'is not attached to a lift' : 'is attached to more than one lift';
    errors.push({ nodeId: node.id, message: `${restraintName(elevation)} ${problem}` });
    return null;
  }
  const lift = liftsById.get(lifts[0].id);
  if (!lift || !lift.above) return null;
  const bottom = lift.below.data.elevation;
  const top = lift.above.data.elevation;
  if (elevation < bottom - SAME_ELEVATION_M || elevation > top + SAME_ELEVATION_M) {
    errors.push({
      nodeId: node.id,
      message: `${restraintName(elevation)} is outside the lift it is attached to (lift ${lift.name} runs from ${formatElevation(bottom)} to ${formatElevation(top)})`,
    });
    return null;
  }
  if (chain.support && elevation <= chain.support.data.elevation + SAME_ELEVATION_M) {
    errors.push({
      nodeId: node.id,
      message: `${restraintName(elevation)} is at the support, which already restrains the column there`,
    });
    return null;
  }
  if (chain.cap && elevation >= chain.cap.data.elevation - SAME_ELEVATION_M) {
    errors.push({
      nodeId: node.id,
      message: `${restraintName(elevation)} is at the cap; put its loads and beam reactions (faces) on the cap instead`,
    });
    return null;
  }
  return { id: node.id, elevation, axes: node.data.axes, fixity: node.data.fixity, liftId: lift.node.id };
}

export interface Attachments {
  restraints: ModelRestraint[];
  entries: LoadEntry[];
}

export function readAttachments(graph: StackGraph, chain: StackChain): { attachments: Attachments; errors: Issue[] } {
  const errors: Issue[] = [];
  const restraints: ModelRestraint[] = [];
  const entries = new Map<string, LoadEntry>();
  const liftsById = new Map(chain.lifts.map((l) => [l.node.id, l]));
  // Sorted so that sums, and so results, do not depend on the order of nodes in the document.
  const nodes = [...graph.nodes.values()].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  for (const node of nodes) {
    if (node.kind === 'restraint') {
      const { elevation } = node.data;
      const restraint = checkRestraint(node, elevation, graph, chain, liftsById, errors);
      if (!restraint) continue;
      restraints.push(restraint);
      const entry: LoadEntry = { nodeId: node.id, elevation, Gk: 0, Qk: {} };
      addLoad(entry, node.data.Gk, node.data.Qk, node.data.category);
      entries.set(node.id, entry);
    } else if (node.kind === 'cap' && node === chain.cap) {
      const entry: LoadEntry = { nodeId: node.id, elevation: node.data.elevation, Gk: 0, Qk: {} };
      addLoad(entry, node.data.Gk, node.data.Qk, node.data.category);
      entries.set(node.id, entry);
    }
  }
  restraints.sort((a, b) => a.elevation - b.elevation || (a.id < b.id ? -1 : 1));
  for (let i = 1; i < restraints.length; i++) {
    if (restraints[i].elevation - restraints[i - 1].elevation > SAME_ELEVATION_M) continue;
    errors.push({
      nodeId: restraints[i].id,
      message: `Restraint at ${formatElevation(restraints[i].elevation)} is at the same elevation as restraint ${restraints[i - 1].id}`,
    });
  }
  for (const node of nodes) {
    if (node.kind !== 'load') continue;
    const name = node.data.label.trim() ? `Load "${node.data.label.trim()}"` : 'A load with no description';
    const targets = neighbours(graph, node.id, 'out', ['restraint', 'cap']);
    if (targets.length === 0)
      errors.push({ nodeId: node.id, message: `${name} is not attached to a restraint or the cap` });
    else if (targets.length > 1) errors.push({ nodeId: node.id, message: `${name} is attached to more than one node` });
    else {
      const entry = entries.get(targets[0].id);
      if (entry) addLoad(entry, node.data.Gk, node.data.Qk, node.data.category);
    }
  }
  const ordered = [...entries.values()].sort((a, b) => b.elevation - a.elevation);
  return { attachments: { restraints, entries: ordered }, errors };
}
