// A stack document as a list an engineer reads, bottom first (docs/stack-history.md): for showing a stack as it was.
import { buildStackGraph } from '../engine/stack/stackGraph.ts';
import { walkStackChain } from '../engine/stack/stackChain.ts';
import { formatElevation } from '../engine/stack/formatElevation.ts';
import type { StackDocument } from '../schema/stack.ts';
import type { LevelNames } from './describeOps.ts';
import type { OutlineRow } from './historyTypes.ts';

const at = (data: { elevation: number; levelId?: string }, levels: LevelNames): string => {
  const level = data.levelId ? levels.get(data.levelId) : undefined;
  return level ? `${level} (${formatElevation(data.elevation)})` : formatElevation(data.elevation);
};
const loads = (d: { Gk: number; Qk: number; category: string }) =>
  `Gk ${d.Gk} kN, Qk ${d.Qk} kN, category ${d.category}`;

export function stackOutline(doc: StackDocument, levels: LevelNames): OutlineRow[] {
  const { chain } = walkStackChain(buildStackGraph(doc).graph);
  const lifts = new Map(chain.lifts.map((l) => [l.node.id, l]));
  const rows: { elevation: number; order: number; row: OutlineRow }[] = [];
  for (const node of doc.nodes) {
    switch (node.kind) {
      case 'support':
        rows.push({
          elevation: node.data.elevation,
          order: 0,
          row: { part: 'Support', where: at(node.data, levels), details: `${node.data.fixity} base` },
        });
        break;
      case 'splice':
        rows.push({
          elevation: node.data.elevation,
          order: 0,
          row: { part: 'Splice', where: formatElevation(node.data.elevation), details: '' },
        });
        break;
      case 'restraint':
        rows.push({
          elevation: node.data.elevation,
          order: 2,
          row: {
            part: 'Restraint',
            where: at(node.data, levels),
            details: `${loads(node.data)}; ${node.data.fixity}, axes ${node.data.axes}`,
          },
        });
        break;
      case 'cap':
        rows.push({
          elevation: node.data.elevation,
          order: 3,
          row: { part: 'Cap', where: at(node.data, levels), details: `${loads(node.data)}; ${node.data.fixity}` },
        });
        break;
      case 'lift': {
        const link = lifts.get(node.id);
        const bottom = link && 'elevation' in link.below.data ? link.below.data.elevation : Number.NaN;
        const top = link?.above && 'elevation' in link.above.data ? link.above.data.elevation : Number.NaN;
        const where = link
          ? `${link.name}: ${formatElevation(bottom)} to ${Number.isNaN(top) ? '?' : formatElevation(top)}`
          : 'not connected';
        const section =
          typeof node.data.section === 'string' ? node.data.section : `${node.data.section.shape} by dimensions`;
        rows.push({
          elevation: Number.isNaN(bottom) ? Infinity : bottom,
          order: 1,
          row: { part: 'Lift', where, details: `${section} ${node.data.grade}` },
        });
        break;
      }
      case 'load':
        rows.push({
          elevation: Infinity,
          order: 4,
          row: { part: 'Load', where: node.data.label, details: loads(node.data) },
        });
        break;
    }
  }
  return rows.sort((a, b) => a.elevation - b.elevation || a.order - b.order).map((r) => r.row);
}
