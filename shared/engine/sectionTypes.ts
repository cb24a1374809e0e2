import type { SectionDims } from '../schema/stack.ts';

export type { SectionDims };
export type IDims = Extract<SectionDims, { shape: 'I' }>;
export type RhsDims = Extract<SectionDims, { shape: 'RHS' }>;
export type ChsDims = Extract<SectionDims, { shape: 'CHS' }>;

/** Gross section properties, mm-based (mm², mm⁴, mm³, mm⁶) and kg/m. y-y is the major axis. */
export interface SectionProperties {
  A: number;
  Iy: number;
  Iz: number;
  iy: number;
  iz: number;
  WelY: number;
  WelZ: number;
  WplY: number;
  WplZ: number;
  /** St Venant torsion constant. */
  It: number;
  /** Warping constant; given for I sections only (negligible for closed sections). */
  Iw?: number;
  massPerMetre: number;
  /** Overall depth (d for a CHS). */
  h: number;
  /** Overall width (d for a CHS). */
  b: number;
  /** Thickest element, which sets fy (tf for I sections, t for hollow). */
  tMax: number;
}
