// Geometry of the buckled-shape plot: SVG polyline points of one axis' mode and the held points, in a box.
import type { CriticalAxis } from '@shared/schema/results.ts';

export interface ShapeBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface ShapeGeometry {
  /** "x,y x,y …" for a polyline, bottom to top. */
  points: string;
  /** Vertical positions of the held points (no lateral displacement). */
  held: number[];
  /** Vertical position of an elevation (m). */
  yOf: (elevation: number) => number;
  /** The column's straight line. */
  axisX: number;
}

/** The mode scaled so its largest displacement takes half the box width less a margin. */
export function shapeGeometry(axis: CriticalAxis, box: ShapeBox): ShapeGeometry | null {
  const shape = axis.shape;
  if (!shape || shape.elevations.length < 2) return null;
  const bottom = shape.elevations[0];
  const span = Math.max(shape.elevations[shape.elevations.length - 1] - bottom, 1e-3);
  const yOf = (z: number) => box.y + box.height - ((z - bottom) / span) * box.height;
  const axisX = box.x + box.width / 2;
  const amplitude = box.width / 2 - 4;
  const points = shape.elevations
    .map((z, i) => `${(axisX + shape.displacements[i] * amplitude).toFixed(1)},${yOf(z).toFixed(1)}`)
    .join(' ');
  const held = shape.elevations.filter((_, i) => shape.displacements[i] === 0).map(yOf);
  return { points, held, yOf, axisX };
}
