// A stack's stored edits in the words engineers read (docs/stack-history.md): "Gk at Level 3 140 → 150 kN".
// Each op is described against the document it was applied to, so the old value is the one it replaced.
import { applyOps } from '../ops/applyOps.ts';
import { buildStackGraph } from '../engine/stack/stackGraph.ts';
import { walkStackChain } from '../engine/stack/stackChain.ts';
import { formatElevation } from '../engine/stack/formatElevation.ts';
import type { Op } from '../schema/ops.ts';
import type { StackDocument, StackNode } from '../schema/stack.ts';

/** level id → name, for naming points that sit on a level. */
export type LevelNames = ReadonlyMap<string, string>;

const UNITS: Record<string, string> = { Gk: ' kN', Qk: ' kN', elevation: ' m' };
const FIELD_NAMES: Record<string, string> = {
  section: 'Section',
  grade: 'Grade',
  kY: 'k about y',
  kZ: 'k about z',
  note: 'Note',
  elevation: 'Elevation',
  levelId: 'Level',
  axes: 'Restrained axes',
  fixity: 'Fixity',
  category: 'Category',
  faces: 'Beam reactions by face',
  label: 'Label',
};

function liftLabels(doc: StackDocument): Map<string, string> {
  const { graph } = buildStackGraph(doc);
  const { chain } = walkStackChain(graph);
  return new Map(chain.lifts.map((l) => [l.node.id, l.name]));
}

function place(data: { elevation?: number; levelId?: string }, levels: LevelNames): string {
  const level = data.levelId ? levels.get(data.levelId) : undefined;
  if (level) return level;
  return typeof data.elevation === 'number' ? formatElevation(data.elevation) : '?';
}

/** "Level 3", "the support", "lift L2", "splice at +7.700", "load 'plant'". */
export function nodeName(node: StackNode, doc: StackDocument, levels: LevelNames): string {
  switch (node.kind) {
    case 'support':
      return `the support at ${place(node.data, levels)}`;
    case 'cap':
      return `the cap at ${place(node.data, levels)}`;
    case 'restraint':
      return place(node.data, levels);
    case 'splice':
      return `the splice at ${formatElevation(node.data.elevation)}`;
    case 'lift':
      return `lift ${liftLabels(doc).get(node.id) ?? node.id}`;
    case 'load':
      return `load "${node.data.label}"`;
  }
}

function value(field: string, v: unknown, levels: LevelNames): string {
  if (v === undefined) return '(none)';
  if (field === 'levelId' && typeof v === 'string') return levels.get(v) ?? `level ${v}`;
  if (typeof v === 'number') return Number(v.toFixed(3)).toString();
  if (typeof v === 'string') return v;
  return JSON.stringify(v);
}

function describeOne(op: Op, doc: StackDocument, levels: LevelNames): string[] {
  const find = (id: string) => doc.nodes.find((n) => n.id === id);
  switch (op.op) {
    case 'updateNode': {
      const node = find(op.id);
      if (!node) return [`changed ${op.id}`];
      const where = nodeName(node, doc, levels);
      const before = node.data as Record<string, unknown>;
      return Object.entries(op.data)
        .filter(([field, next]) => JSON.stringify(before[field]) !== JSON.stringify(next))
        .map(([field, next]) => {
          const unit = UNITS[field] ?? '';
          return `${FIELD_NAMES[field] ?? field} at ${where} ${value(field, before[field], levels)} → ${value(field, next, levels)}${unit}`;
        });
    }
    case 'addNode': {
      const after = { ...doc, nodes: [...doc.nodes, op.node] };
      return [
        `Added ${nodeName(op.node, after, levels)}${op.node.kind === 'lift' ? ` (${value('section', op.node.data.section, levels)} ${op.node.data.grade})` : ''}`,
      ];
    }
    case 'removeNode': {
      const node = find(op.id);
      return [`Removed ${node ? nodeName(node, doc, levels) : op.id}`];
    }
    case 'moveNode':
      return [];
    case 'addEdge':
    case 'removeEdge':
      return [];
  }
}

/**
 * Lines describing ops applied to `before`. Moves on the drawing and connections are summed up in one line each,
 * since engineers read the changes to the column, not to the picture.
 */
export function describeOps(before: StackDocument, ops: readonly Op[], levels: LevelNames): string[] {
  const lines: string[] = [];
  let doc = before;
  let moves = 0;
  let connections = 0;
  for (const op of ops) {
    if (op.op === 'moveNode') moves += 1;
    if (op.op === 'addEdge' || op.op === 'removeEdge') connections += 1;
    lines.push(...describeOne(op, doc, levels));
    doc = applyOps(doc, [op]);
  }
  if (connections > 0) lines.push(`Changed ${connections} connection${connections === 1 ? '' : 's'} between parts`);
  if (moves > 0) lines.push(`Rearranged the drawing (${moves} part${moves === 1 ? '' : 's'} moved)`);
  return lines;
}
