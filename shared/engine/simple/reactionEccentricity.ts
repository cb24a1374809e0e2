// Where a simply connected beam's reaction acts relative to the column axis (mm).
import type { SectionDims } from '../sectionTypes.ts';
import { REACTION_OFFSET_MM } from './constants.ts';

export interface Eccentricities {
  /** Reactions on the flanges (y faces), moment about y-y. */
  y: number;
  /** Reactions on the web (z faces), moment about z-z. */
  z: number;
}

/**
 * The reaction is taken 100 mm from the face it bears on: h/2 + 100 for a flange, tw/2 + 100 for the web
 * of an I section (common practice for simple construction, SCI P358/P360 method, from memory). A hollow
 * section has no web in the middle, so its z faces are its side walls: b/2 + 100 (d/2 + 100 for a CHS).
 */
export function reactionEccentricity(dims: SectionDims): Eccentricities {
  if (dims.shape === 'I') return { y: dims.h / 2 + REACTION_OFFSET_MM, z: dims.tw / 2 + REACTION_OFFSET_MM };
  if (dims.shape === 'RHS') return { y: dims.h / 2 + REACTION_OFFSET_MM, z: dims.b / 2 + REACTION_OFFSET_MM };
  return { y: dims.d / 2 + REACTION_OFFSET_MM, z: dims.d / 2 + REACTION_OFFSET_MM };
}
