// A stack document from a template: the server creates stacks with it and the client may
// preview with it. Pure.
import type { Level, StackTemplate } from '../schema/api.ts';
import type { RestraintFaces, StackDocument, StackEdge, StackNode } from '../schema/stack.ts';

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

/** The elevations of a template's base, each floor and its top (m), bottom first. */
export function templateFloors(
  t: Pick<StackTemplate, 'elevations' | 'storeys' | 'storeyHeight' | 'baseElevation'>,
): number[] {
  if (t.elevations) return t.elevations.map(round);
  const { storeys, storeyHeight } = t;
  // stackTemplateSchema refuses a body with neither; this guards a caller that skipped it.
  if (storeys === undefined || storeyHeight === undefined)
    throw new Error('A template needs elevations, or storeys and a storey height');
  return Array.from({ length: storeys + 1 }, (_, k) => round((t.baseElevation ?? 0) + k * storeyHeight));
}

/** The floors each lift spans, as indexes into the floors: a splice every n storeys, the top lift taking what is left. */
export function liftFloorRanges(storeys: number, spliceEvery: number): { bottom: number; top: number }[] {
  const ranges: { bottom: number; top: number }[] = [];
  for (let bottom = 0; bottom < storeys; bottom += spliceEvery)
    ranges.push({ bottom, top: Math.min(bottom + spliceEvery, storeys) });
  return ranges;
}

/**
 * The splice above a floor: SPLICE_ABOVE_FLOOR_M up, but never past half-way to the next floor. On a storey
 * shorter than twice that offset (a mezzanine, a plant deck close above a floor) the splice sits half-way
 * up, as far from both floors' beam connections as the storey allows. We place it rather than refuse: the
 * template cannot move splices to other floors, so refusing would make a building's own levels unusable
 * for this spacing, while a splice placed in the storey keeps the stack valid and the engineer can move it.
 */
export function spliceElevation(floor: number, nextFloor: number): number {
  return round(Math.min(floor + SPLICE_ABOVE_FLOOR_M, (floor + nextFloor) / 2));
}

/** The faces as given, when one of them carries a reaction (an empty set adds nothing to the document). */
function givenFaces(faces: RestraintFaces | undefined): { faces: RestraintFaces } | Record<string, never> {
  const any = faces && Object.values(faces).some((f) => !!f && (f.Gk > 0 || f.Qk > 0));
  return any && faces ? { faces } : {};
}

/** Input as parsed by stackTemplateSchema (defaults applied). */
export function stackFromTemplate(t: StackTemplate, levels: readonly Level[] = []): StackDocument {
  const floors = templateFloors(t);
  const storeys = floors.length - 1;
  const ranges = liftFloorRanges(storeys, t.spliceEvery);
  const nodes: StackNode[] = [];
  const edges: StackEdge[] = [];
  const link = (source: string, target: string) => edges.push({ id: `e-${source}-${target}`, source, target });

  // Every node at a building level's elevation sits on that level, so it follows when the level moves.
  const onLevel = (elevation: number) => {
    const levelId = levelAt(levels, elevation);
    return levelId ? { levelId } : {};
  };
  nodes.push({
    id: 'support',
    kind: 'support',
    data: { elevation: floors[0], ...onLevel(floors[0]), fixity: t.baseFixity },
    position: at(CHAIN_X, floors[0]),
  });
  let below = 'support';
  let belowElevation = floors[0];
  ranges.forEach(({ bottom, top }, i) => {
    const last = i === ranges.length - 1;
    const topElevation = last ? floors[storeys] : spliceElevation(floors[top], floors[top + 1]);
    const liftId = `lift-${i + 1}`;
    const section = t.sections[Math.min(i, t.sections.length - 1)];
    nodes.push({
      id: liftId,
      kind: 'lift',
      data: { section, grade: t.grade },
      position: at(CHAIN_X, (belowElevation + topElevation) / 2),
    });
    link(below, liftId);
    const above = last ? 'cap' : `splice-${i + 1}`;
    if (last) {
      const data = {
        elevation: topElevation,
        ...onLevel(topElevation),
        fixity: 'pinned' as const,
        Gk: t.Gk,
        Qk: t.Qk,
        category: 'H' as const,
        ...givenFaces(t.roofFaces),
      };
      nodes.push({ id: 'cap', kind: 'cap', data, position: at(CHAIN_X, topElevation) });
    } else {
      nodes.push({ id: above, kind: 'splice', data: { elevation: topElevation }, position: at(CHAIN_X, topElevation) });
    }
    link(liftId, above);
    // Floors inside this lift's span (the floor just below its splice included); the top floor is the cap.
    for (let k = bottom + 1; k <= Math.min(top, storeys - 1); k++) {
      const elevation = floors[k];
      const id = `restraint-${k}`;
      nodes.push({
        id,
        kind: 'restraint',
        data: {
          elevation,
          ...onLevel(elevation),
          axes: 'both',
          fixity: 'pinned',
          Gk: t.Gk,
          Qk: t.Qk,
          category: 'B',
          ...givenFaces(t.faces),
        },
        position: at(RESTRAINT_X, elevation),
      });
      link(id, liftId);
    }
    below = above;
    belowElevation = topElevation;
  });
  return { nodes, edges };
}
