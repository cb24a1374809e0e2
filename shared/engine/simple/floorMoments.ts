// Nominal moments at each floor (and at the cap) from the beam reactions on the column faces, shared
// between the storeys above and below the floor (m, kN, kN·m; section properties in mm).
import type { AnalysisOptions } from '../../schema/results.ts';
import type { Category, RestraintFaces } from '../../schema/stack.ts';
import type { Expression } from '../stack/combination.ts';
import type { SectionDims } from '../sectionTypes.ts';
import { netDesignReaction, reactionFactors, type NetReaction } from './netDesignReaction.ts';
import { reactionEccentricity } from './reactionEccentricity.ts';
import { shareMoment, type MomentShare } from './shareMoment.ts';
import { storeyStiffness, type StoreyStiffness } from './storeyStiffness.ts';

/** A restraint or the cap, where beams may frame into the column. */
export interface MomentFloor {
  nodeId: string;
  elevation: number;
  category: Category;
  faces?: RestraintFaces;
  /** Load enters the column here (the restraint's own or an attached load node): a floor or roof, not a tie. */
  loaded?: boolean;
  /** The cap: no column above it. */
  cap?: boolean;
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
  /** Stiffness I/L of the storeys below and above, mm⁴/m (0 where there is no column). */
  below: StoreyStiffness | null;
  above: StoreyStiffness | null;
}

export interface FloorMoment {
  nodeId: string;
  elevation: number;
  cap: boolean;
  /** The expression of EN 1990 6.4.3.2 the reactions were factored with. */
  expression: Expression;
  /** Storeys below and above the floor: to the next floor, the support or the cap, m (0 where there is none). */
  lengthBelow: number;
  lengthAbove: number;
  y: AxisMoment;
  z: AxisMoment;
}

const EPS = 1e-6;

export function hasReactions(faces: RestraintFaces | undefined): boolean {
  if (!faces) return false;
  return [faces.yPlus, faces.yMinus, faces.zPlus, faces.zMinus].some((f) => !!f && (f.Gk > 0 || f.Qk > 0));
}

/**
 * The levels that end a storey: the support, the cap, and every restraint that carries a floor (load or
 * beam reactions). A lateral-only restraint (a tie with no load and no faces) and a splice do not: the
 * storey, and so the stiffness that draws the floor's moment, runs floor to floor (common practice for
 * simple construction, the storey-height column lengths of the design guides, from memory).
 */
export function storeyLevels(floors: readonly MomentFloor[], bottom: number, top: number): number[] {
  const levels = [bottom, top];
  for (const f of floors) if (f.loaded || hasReactions(f.faces)) levels.push(f.elevation);
  levels.sort((a, b) => a - b);
  return levels.filter((z, i) => i === 0 || z - levels[i - 1] > EPS);
}

/** The section the beams connect to: the one just below the floor (at the cap, the top lift). */
function sectionAt(lifts: readonly ColumnLength[], elevation: number): ColumnLength | undefined {
  return (
    lifts.find((l) => l.bottom < elevation - EPS && l.top >= elevation - EPS) ??
    lifts.find((l) => l.bottom <= elevation + EPS && l.top > elevation + EPS)
  );
}

function axisMoment(
  e: number,
  reaction: NetReaction,
  below: StoreyStiffness | null,
  above: StoreyStiffness | null,
): AxisMoment {
  // kN × mm / 1000 = kN·m
  const M = (reaction.value * e) / 1000;
  return { e, reaction, M, share: shareMoment(M, above?.stiffness ?? 0, below?.stiffness ?? 0), below, above };
}

/**
 * Moments at every floor (and the cap) with face reactions, for one expression of EN 1990 6.4.3.2.
 * `floors` lists every restraint of the stack and the cap; `bottom` and `top` are the support and cap
 * elevations. The cap has no storey above, so its moment goes wholly into the top storey.
 */
export function floorMoments(
  floors: readonly MomentFloor[],
  lifts: readonly ColumnLength[],
  bottom: number,
  top: number,
  options: Pick<AnalysisOptions, 'combination' | 'annex'>,
  expression: Expression,
): FloorMoment[] {
  const levels = storeyLevels(floors, bottom, top);
  const out: FloorMoment[] = [];
  for (const floor of floors) {
    if (!hasReactions(floor.faces) || !floor.faces) continue;
    const home = sectionAt(lifts, floor.elevation);
    if (!home) continue;
    const i = levels.findIndex((p) => Math.abs(p - floor.elevation) <= EPS);
    const atTop = floor.cap || i === levels.length - 1;
    const lower = i > 0 ? levels[i - 1] : floor.elevation;
    const upper = atTop ? floor.elevation : levels[i + 1];
    const stiffness = (axis: 'Iy' | 'Iz') => ({
      below: i > 0 ? storeyStiffness(lifts, lower, floor.elevation, axis) : null,
      above: atTop ? null : storeyStiffness(lifts, floor.elevation, upper, axis),
    });
    const sy = stiffness('Iy');
    const sz = stiffness('Iz');
    const e = reactionEccentricity(home.dims);
    const factors = reactionFactors(options, floor.category).filter((f) => f.expression.endsWith(`eq. ${expression}`));
    const { yPlus, yMinus, zPlus, zMinus } = floor.faces;
    out.push({
      nodeId: floor.nodeId,
      elevation: floor.elevation,
      cap: atTop,
      expression,
      lengthBelow: floor.elevation - lower,
      lengthAbove: upper - floor.elevation,
      y: axisMoment(e.y, netDesignReaction(yPlus, yMinus, factors), sy.below, sy.above),
      z: axisMoment(e.z, netDesignReaction(zPlus, zMinus, factors), sz.below, sz.above),
    });
  }
  return out;
}
