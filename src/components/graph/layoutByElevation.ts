// Where each node is drawn when it has no stored position, or when the user asks to tidy the graph:
// the chain in one column with height following elevation (y = −elevation × scale, screen y grows
// downward), restraints beside it, loads beside their carriers. Drawing only; the analysis never reads it.
import type { StackDocument } from '@shared/schema/stack.ts';
import { drawingElevations } from '@/composables/stackChain.ts';

export interface XY {
  x: number;
  y: number;
}

/** Pixels per metre of elevation. */
export const PX_PER_METRE = 24;
export const COLUMN_X = { chain: 0, restraint: 240, load: 470, unplaced: -240 } as const;
/** Spacing for nodes that share a slot (several loads on one restraint, unconnected lifts). */
const STACKED_GAP = 80;

export function layoutByElevation(doc: StackDocument): Map<string, XY> {
  const elevations = drawingElevations(doc);
  const out = new Map<string, XY>();
  const usedSlots = new Map<string, number>();
  let unplaced = 0;
  for (const n of doc.nodes) {
    const z = elevations.get(n.id);
    if (z === undefined) {
      out.set(n.id, { x: COLUMN_X.unplaced, y: unplaced++ * STACKED_GAP });
      continue;
    }
    const x = n.kind === 'restraint' ? COLUMN_X.restraint : n.kind === 'load' ? COLUMN_X.load : COLUMN_X.chain;
    const slot = `${x}:${z}`;
    const taken = usedSlots.get(slot) ?? 0;
    usedSlots.set(slot, taken + 1);
    out.set(n.id, { x, y: Math.round(-z * PX_PER_METRE + taken * STACKED_GAP) });
  }
  return out;
}
