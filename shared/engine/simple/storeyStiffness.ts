// The stiffness of one storey of column, which may be made of several lengths of different sections.
import type { ColumnLength } from './floorMoments.ts';

/** One section's part of a storey, m, with its second moment of area about the axis, mm⁴. */
export interface StoreyPart {
  from: number;
  to: number;
  I: number;
}

export interface StoreyStiffness {
  from: number;
  to: number;
  parts: StoreyPart[];
  /** I/L of the storey, mm⁴/m: 1/(Σ Lᵢ/Iᵢ). One E for the whole column, so I/L stands for EI/L. */
  stiffness: number;
}

/**
 * Lengths in series (a splice inside the storey): the rotation at the floor end is the sum of the parts'
 * L/EI, so L/EI of the storey = Σ Lᵢ/EIᵢ (elastic theory of members in series; common practice for a
 * spliced storey, no source). A storey with no column has stiffness 0.
 */
export function storeyStiffness(
  lifts: readonly ColumnLength[],
  from: number,
  to: number,
  axis: 'Iy' | 'Iz',
): StoreyStiffness {
  const parts: StoreyPart[] = [];
  let flexibility = 0;
  for (const l of lifts) {
    const a = Math.max(from, l.bottom);
    const b = Math.min(to, l.top);
    if (!(b - a > 1e-9)) continue;
    parts.push({ from: a, to: b, I: l[axis] });
    flexibility += (b - a) / l[axis];
  }
  return { from, to, parts, stiffness: flexibility > 0 ? 1 / flexibility : 0 };
}
