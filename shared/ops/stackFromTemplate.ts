// A stack document from a template (issue 5): the server creates stacks with it and the client may
// preview with it. Pure.
import type { Level, StackTemplate } from '../schema/api.ts';
import type { StackDocument, StackEdge, StackNode } from '../schema/stack.ts';

/**
 * Splices sit a little above the floor so the connection is clear of the floor beams
 * (common practice, no source); the floor restraint then belongs to the lift below the splice.
 */
export const SPLICE_ABOVE_FLOOR_M = 0.5;
/** Drawing scale: pixels per metre of elevation, and the x of each column of nodes. */
const PX_PER_M = 60;
const CHAIN_X = 0;
const RESTRAINT_X = 240;

const round = (m: number) => Math.round(m * 1e6) / 1e6;
const at = (x: number, elevation: number) => ({ x, y: round(-elevation * PX_PER_M) });

function levelAt(levels: readonly Level[], elevation: number): string | undefined {
  return levels.find((l) => Math.abs(l.elevation - elevation) < 1e-6)?.id;
}

/** Input as parsed by stackTemplateSchema (defaults applied). */
export function stackFromTemplate(t: StackTemplate, levels: readonly Level[] = []): StackDocument {
  const floor = (k: number) => round(t.baseElevation + k * t.storeyHeight);
  const liftCount = Math.ceil(t.storeys / t.spliceEvery);
  const nodes: StackNode[] = [];
  const edges: StackEdge[] = [];
  const link = (source: string, target: string) => edges.push({ id: `e-${source}-${target}`, source, target });

  nodes.push({ id: 'support', kind: 'support', data: { elevation: floor(0), fixity: t.baseFixity }, position: at(CHAIN_X, floor(0)) });
  let below = 'support';
  let belowElevation = floor(0);
  for (let i = 0; i < liftCount; i++) {
    const last = i === liftCount - 1;
    const topElevation = last ? floor(t.storeys) : round(floor((i + 1) * t.spliceEvery) + SPLICE_ABOVE_FLOOR_M);
    const liftId = `lift-${i + 1}`;
    const section = t.sections[Math.min(i, t.sections.length - 1)];
    nodes.push({ id: liftId, kind: 'lift', data: { section, grade: t.grade }, position: at(CHAIN_X, (belowElevation + topElevation) / 2) });
    link(below, liftId);
    const above = last ? 'cap' : `splice-${i + 1}`;
    if (last) {
      nodes.push({ id: 'cap', kind: 'cap', data: { elevation: topElevation, fixity: 'pinned', Gk: t.Gk, Qk: t.Qk, category: 'H' }, position: at(CHAIN_X, topElevation) });
    } else {
      nodes.push({ id: above, kind: 'splice', data: { elevation: topElevation }, position: at(CHAIN_X, topElevation) });
    }
    link(liftId, above);
    // Floors inside this lift's span; the top floor is the cap.
    for (let k = i * t.spliceEvery + 1; k <= Math.min((i + 1) * t.spliceEvery, t.storeys - 1); k++) {
      const elevation = floor(k);
      const id = `restraint-${k}`;
      const levelId = levelAt(levels, elevation);
      nodes.push({
        id,
        kind: 'restraint',
        data: { elevation, ...(levelId ? { levelId } : {}), axes: 'both', fixity: 'pinned', Gk: t.Gk, Qk: t.Qk, category: 'B' },
        position: at(RESTRAINT_X, elevation),
      });
      link(id, liftId);
    }
    below = above;
    belowElevation = topElevation;
  }
  return { nodes, edges };
}
