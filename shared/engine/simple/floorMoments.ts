// Nominal moments at each floor of a stack from the beam reactions on the column faces, shared between
// the column lengths above and below the floor (m, kN, kN·m; section properties in mm).
import type { AnalysisOptions } from '../../schema/results.ts';
import type { Category, RestraintFaces } from '../../schema/stack.ts';
import type { SectionDims } from '../sectionTypes.ts';
import { netDesignReaction, reactionFactors, type NetReaction } from './netDesignReaction.ts';
import { reactionEccentricity } from './reactionEccentricity.ts';
import { shareMoment, type MomentShare } from './shareMoment.ts';

/** A floor where beams frame into the column (a restraint). */
export interface MomentFloor {
  nodeId: string;
  elevation: number;
  category: Category;
  faces?: RestraintFaces;
}

/** One length of one section (a lift), m; second moments of area in mm⁴. */
export interface ColumnLength {
  bottom: number;
  top: number;
  dims: SectionDims;
  Iy: number;
  Iz: number;
}

export interface AxisMoment {
  /** Eccentricity of the reactions, mm. */
  e: number;
  reaction: NetReaction;
  /** Net design moment at the floor, kN·m. */
  M: number;
  share: MomentShare;
}

export interface FloorMoment {
  nodeId: string;
  elevation: number;
  /** Column lengths below and above the floor, to the next floor, the support or the cap, m. */
  lengthBelow: number;
  lengthAbove: number;
  y: AxisMoment;
  z: AxisMoment;
}

const EPS = 1e-6;

function lengthAt(lifts: readonly ColumnLength[], elevation: number, side: 'below' | 'above'): ColumnLength | undefined {
  return side === 'below'
    ? lifts.find((l) => l.bottom < elevation - EPS && l.top >= elevation - EPS)
    : lifts.find((l) => l.bottom <= elevation + EPS && l.top > elevation + EPS);
}

function axisMoment(e: number, reaction: NetReaction, I: 'Iy' | 'Iz', below: ColumnLength | undefined, above: ColumnLength | undefined, Lb: number, La: number): AxisMoment {
  // kN × mm / 1000 = kN·m
  const M = (reaction.value * e) / 1000;
  // Stiffness EI/L with one E for the whole column: I/L is enough for the ratio
  const kBelow = below && Lb > 0 ? below[I] / Lb : 0;
  const kAbove = above && La > 0 ? above[I] / La : 0;
  return { e, reaction, M, share: shareMoment(M, kAbove, kBelow) };
}

/**
 * Moments at every floor that has face reactions. `floors` lists every floor of the stack (they bound the
 * column lengths); `bottom` and `top` are the support and cap elevations.
 */
export function floorMoments(
  floors: readonly MomentFloor[],
  lifts: readonly ColumnLength[],
  bottom: number,
  top: number,
  options: Pick<AnalysisOptions, 'combination' | 'annex'>,
): FloorMoment[] {
  const points = [bottom, ...floors.map((f) => f.elevation), top].sort((a, b) => a - b);
  const out: FloorMoment[] = [];
  for (const floor of floors) {
    if (!floor.faces) continue;
    const below = lengthAt(lifts, floor.elevation, 'below');
    const above = lengthAt(lifts, floor.elevation, 'above');
    const home = below ?? above;
    if (!home) continue;
    const i = points.findIndex((p) => Math.abs(p - floor.elevation) <= EPS);
    const lengthBelow = floor.elevation - points[i - 1];
    const lengthAbove = points[i + 1] - floor.elevation;
    const e = reactionEccentricity(home.dims);
    const factors = reactionFactors(options, floor.category);
    const { yPlus, yMinus, zPlus, zMinus } = floor.faces;
    out.push({
      nodeId: floor.nodeId,
      elevation: floor.elevation,
      lengthBelow,
      lengthAbove,
      y: axisMoment(e.y, netDesignReaction(yPlus, yMinus, factors), 'Iy', below, above, lengthBelow, lengthAbove),
      z: axisMoment(e.z, netDesignReaction(zPlus, zMinus, factors), 'Iz', below, above, lengthBelow, lengthAbove),
    });
  }
  return out;
}
