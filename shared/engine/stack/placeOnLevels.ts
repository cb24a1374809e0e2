// The one place a node tied to a building level (a restraint, the cap or the support with a levelId) gets its
// elevation: the level's. The copy a document may carry in `elevation` is a cache that is never trusted while
// the building has the level (docs/contracts.md §Stack document, docs/stack-editing.md); it is read only for a
// level the building no longer has, and then with a warning. Every reader of a document's elevations (the
// engine's entry points, the server, the package, the client's graph) places the document here first.
import type { Issue } from '../../schema/results.ts';
import type { StackDocument, StackNode } from '../../schema/stack.ts';
import { levelElevation, type LevelElevations } from './context.ts';
import { formatElevation } from './formatElevation.ts';

const NAMES = { restraint: 'Restraint', cap: 'Cap', support: 'Support' } as const;

/** Levels as the engine's map or record, or as the API lists them (`{ id, elevation }`). */
export type LevelsLike = LevelElevations | readonly { id: string; elevation: number }[];

export type Placeable = Extract<StackNode, { kind: keyof typeof NAMES }>;
export const isPlaceable = (n: StackNode): n is Placeable => n.kind in NAMES;

function elevationOf(levels: LevelsLike | undefined, levelId: string): number | undefined {
  if (Array.isArray(levels))
    return (levels as readonly { id: string; elevation: number }[]).find((l) => l.id === levelId)?.elevation;
  return levelElevation(levels as LevelElevations | undefined, levelId);
}

/** The level's elevation for a node tied to a level the building has; the node's own elevation otherwise. */
export function nodeElevation(node: Placeable, levels: LevelsLike | undefined): number {
  const tied = node.data.levelId === undefined ? undefined : elevationOf(levels, node.data.levelId);
  return tied ?? node.data.elevation;
}

/** The document with every tied node at its level's elevation; the same document when nothing moves. */
export function placeOnLevels<D extends StackDocument>(doc: D, levels: LevelsLike | undefined): D {
  if (!levels) return doc;
  let moved = false;
  const nodes = doc.nodes.map((node) => {
    if (!isPlaceable(node)) return node;
    const elevation = nodeElevation(node, levels);
    if (elevation === node.data.elevation) return node;
    moved = true;
    return { ...node, data: { ...node.data, elevation } } as Placeable;
  });
  return moved ? { ...doc, nodes } : doc;
}

/** A warning for each node tied to a level the building no longer has (its own elevation is used), by node id. */
export function lostLevelWarnings(doc: StackDocument, levels: LevelsLike | undefined): Issue[] {
  if (!levels) return [];
  const lost: Issue[] = [];
  for (const node of doc.nodes) {
    if (!isPlaceable(node) || node.data.levelId === undefined) continue;
    if (elevationOf(levels, node.data.levelId) !== undefined) continue;
    lost.push({
      nodeId: node.id,
      message: `${NAMES[node.kind]} at ${formatElevation(node.data.elevation)} refers to a level the building no longer has; its own elevation is used`,
    });
  }
  // By node id, so the results do not depend on the order of nodes in the document.
  return lost.sort((a, b) => (a.nodeId! < b.nodeId! ? -1 : 1));
}
