// The floor loads of a stack on the grid, put on its restraints and cap for the analysis alone: the stored
// document keeps what was typed (one source of truth, docs/building-model.md). A node marked loadsByHand
// keeps its own loads; the result still says what the floor would give.
import type { FloorLoadUse } from '../../schema/results.ts';
import type { Category, StackDocument, StackNode } from '../../schema/stack.ts';
import type { DerivedLevelLoad } from './stackFloorLoads.ts';

export interface LoadedArea {
  area: number;
  category: Category;
}

export interface FloorLoadsApplied {
  doc: StackDocument;
  uses: FloorLoadUse[];
  /** Tributary area under imposed load at each node that took a floor's loads, for αA. */
  areas: Map<string, LoadedArea>;
}

type Loaded = Extract<StackNode, { kind: 'restraint' | 'cap' }>;

export function applyFloorLoads(
  doc: StackDocument,
  floors: ReadonlyMap<string, DerivedLevelLoad> | undefined,
): FloorLoadsApplied {
  const uses: FloorLoadUse[] = [];
  const areas = new Map<string, LoadedArea>();
  if (!floors || floors.size === 0) return { doc, uses, areas };
  const nodes = doc.nodes.map((node) => {
    if ((node.kind !== 'restraint' && node.kind !== 'cap') || node.data.levelId === undefined) return node;
    const floor = floors.get(node.data.levelId);
    if (!floor) return node;
    const byHand = node.data.loadsByHand === true;
    const { levelId, area, gridArea, Gk, Qk, category, faces, lineGk, lineQk, overrideReason } = floor;
    uses.push({
      nodeId: node.id,
      levelId,
      area,
      gridArea,
      Gk,
      Qk,
      category,
      faces,
      lineGk,
      lineQk,
      byHand,
      ...(overrideReason ? { overrideReason } : {}),
    });
    if (byHand) return node;
    if (Qk > 0) areas.set(node.id, { area, category });
    return { ...node, data: { ...node.data, Gk, Qk, category, faces } } as Loaded;
  });
  uses.sort((a, b) => (a.nodeId < b.nodeId ? -1 : 1));
  return { doc: { nodes, edges: doc.edges }, uses, areas };
}
