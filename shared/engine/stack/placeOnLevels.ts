// Nodes that sit on a building level (a restraint, the cap or the support with a levelId) take the
// level's elevation, so moving a level moves them. A level the building no longer has leaves the
// node at its own elevation, with a warning.
import type { Issue } from '../../schema/results.ts';
import type { StackDocument, StackNode } from '../../schema/stack.ts';
import { levelElevation, type AnalysisContext } from './context.ts';
import { formatElevation } from './formatElevation.ts';

const NAMES = { restraint: 'Restraint', cap: 'Cap', support: 'Support' } as const;

type Placeable = Extract<StackNode, { kind: keyof typeof NAMES }>;
const isPlaceable = (n: StackNode): n is Placeable => n.kind in NAMES;

/** The document with every tied node at its level's elevation; the same document when nothing moves. */
export function placeOnLevels(doc: StackDocument, context: AnalysisContext, warnings: Issue[]): StackDocument {
  const { levels } = context;
  if (!levels) return doc;
  let moved = false;
  const lost: Issue[] = [];
  const nodes = doc.nodes.map((node) => {
    if (!isPlaceable(node) || node.data.levelId === undefined) return node;
    const elevation = levelElevation(levels, node.data.levelId);
    if (elevation === undefined) {
      lost.push({
        nodeId: node.id,
        message: `${NAMES[node.kind]} at ${formatElevation(node.data.elevation)} refers to a level the building no longer has; its own elevation is used`,
      });
      return node;
    }
    if (elevation === node.data.elevation) return node;
    moved = true;
    return { ...node, data: { ...node.data, elevation } } as Placeable;
  });
  // By node id, so the results do not depend on the order of nodes in the document.
  warnings.push(...lost.sort((a, b) => (a.nodeId! < b.nodeId! ? -1 : 1)));
  return moved ? { nodes, edges: doc.edges } : doc;
}
