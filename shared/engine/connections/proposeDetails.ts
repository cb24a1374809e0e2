// Starting details the engineer then changes (common practice, no source): the usual proportions of flange cover
// plates and base plates for columns in simple construction.
import type { BasePlate, SectionDims, SpliceDetail } from '../../schema/stack.ts';

const PLATE_THICKNESSES = [10, 12, 15, 20, 25, 30, 35, 40, 50, 60] as const;

function roundUp(value: number, step: number): number {
  return Math.ceil(value / step - 1e-9) * step;
}

/**
 * Cover plates as wide as the upper column's flange (to 5 mm below) and at least half its flange thick, never under
 * 10 mm; four M20 8.8 bolts a flange each side of the joint. Without an I section above: 250 × 12.
 */
export function proposeSpliceDetail(above: SectionDims | null): SpliceDetail {
  const width = above?.shape === 'I' ? Math.floor(above.b / 5) * 5 : 250;
  const half = above?.shape === 'I' ? above.tf / 2 : 0;
  const thickness = PLATE_THICKNESSES.find((t) => t >= Math.max(10, half)) ?? 60;
  return { plate: { width, thickness, grade: 'S275' }, bolts: { number: 4, diameter: 20, class: '8.8' } };
}

/** A plate 100 mm beyond the footprint each way (to the next 25 mm), 25 mm thick S275, on a 25 mm grout joint. */
export function proposeBasePlate(column: SectionDims | null): BasePlate {
  const footprint = !column
    ? { b: 250, l: 250 }
    : column.shape === 'CHS'
      ? { b: column.d, l: column.d }
      : { b: column.b, l: column.h };
  return { b: roundUp(footprint.b + 200, 25), l: roundUp(footprint.l + 200, 25), t: 25, grade: 'S275', grout: 25 };
}
