// What follows from A, Iy and Iz for any section symmetric about both axes: radii of gyration, elastic
// moduli (extreme fibre at half the depth and half the width) and mass. Used by the I and hollow sections.
import { STEEL_DENSITY } from './constants.ts';
import type { SectionProperties } from './sectionTypes.ts';

type Derived = Pick<SectionProperties, 'A' | 'Iy' | 'Iz' | 'iy' | 'iz' | 'WelY' | 'WelZ' | 'massPerMetre' | 'h' | 'b'>;

/** mm, mm², mm⁴ in; i = √(I/A), Wel = I / (extreme fibre distance), mass = A ρ (kg/m). */
export function symmetricProperties(A: number, Iy: number, Iz: number, h: number, b: number): Derived {
  return {
    A,
    Iy,
    Iz,
    iy: Math.sqrt(Iy / A),
    iz: Math.sqrt(Iz / A),
    WelY: Iy / (h / 2),
    WelZ: Iz / (b / 2),
    massPerMetre: A * 1e-6 * STEEL_DENSITY,
    h,
    b,
  };
}
