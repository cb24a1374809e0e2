// Where each node is drawn when it has no stored position, or when the user asks to tidy the graph:
// the chain in one column with height following elevation (y = −elevation × scale, screen y grows
// downward), restraints beside it, loads beside their carriers. Drawing only; the analysis never reads it.
import type { StackDocument } from '@shared/schema/stack.ts';
import { drawingElevations } from '@/utils/stackChain.ts';

export interface XY {
  x: number;
  y: number;
}

/** Pixels per metre of elevation at full scale. */
export const PX_PER_METRE = 24;
export const COLUMN_X = { chain: 0, restraint: 240, load: 470, unplaced: -240 } as const;
/** In the compressed drawing (Fit on a tall stack) lifts step left of the spine so their labels never sit on a splice's. */
export const COMPACT_LIFT_X = -210;

/** The vertical scale of the drawing: full size, or compressed so a tall stack fits with one-line labels. */
export interface GraphScale {
  pxPerMetre: number;
  compact: boolean;
}
export const FULL_SCALE: GraphScale = { pxPerMetre: PX_PER_METRE, compact: false };
/** Spacing for nodes that share a slot (several loads on one restraint, unconnected lifts). */
const STACKED_GAP = 80;
/** Height of a one-line node label in the compressed drawing (px at zoom 1): 11-px type on a 15-px line. */
export const COMPACT_LINE_PX = 15;

export function layoutByElevation(doc: StackDocument, scale: GraphScale = FULL_SCALE): Map<string, XY> {
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
    const chainX = scale.compact && n.kind === 'lift' ? COMPACT_LIFT_X : COLUMN_X.chain;
    const x = n.kind === 'restraint' ? COLUMN_X.restraint : n.kind === 'load' ? COLUMN_X.load : chainX;
    const slot = `${x}:${z}`;
    const taken = usedSlots.get(slot) ?? 0;
    usedSlots.set(slot, taken + 1);
    const gap = scale.compact ? COMPACT_LINE_PX : STACKED_GAP;
    out.set(n.id, {
      x,
      y: Math.round(-z * scale.pxPerMetre - (scale.compact ? COMPACT_LINE_PX / 2 : 0) + taken * gap),
    });
  }
  return out;
}
