import type { SectionClass } from '../schema/results.ts';
import type { SectionDims } from './sectionTypes.ts';

/** One compressed plate element (or a whole tube) with its width-to-thickness ratio. */
export interface ClassifiedElement {
  /** 'flange outstand', 'web', 'wall', 'tube'… */
  element: string;
  kind: 'internal' | 'outstand' | 'tube';
  /** c (d for a tube), mm. */
  c: number;
  t: number;
  /** c/t (d/t for a tube). */
  ratio: number;
  /** Limits for class 1, 2, 3 (EN 1993-1-1 Table 5.2). */
  limits: readonly [number, number, number];
  sectionClass: SectionClass;
  /** How many such elements the section has (for the effective area). */
  count: number;
}

export interface Classification {
  sectionClass: SectionClass;
  governing: ClassifiedElement;
  elements: ClassifiedElement[];
}

function classOf(ratio: number, limits: readonly [number, number, number]): SectionClass {
  if (ratio <= limits[0]) return 1;
  if (ratio <= limits[1]) return 2;
  if (ratio <= limits[2]) return 3;
  return 4;
}

function element(
  name: string,
  kind: ClassifiedElement['kind'],
  c: number,
  t: number,
  limits: readonly [number, number, number],
  count: number,
): ClassifiedElement {
  const ratio = c / t;
  return { element: name, kind, c, t, ratio, limits, sectionClass: classOf(ratio, limits), count };
}

/** Plate widths c that Table 5.2 measures, without the limits. */
export function compressedElements(
  dims: SectionDims,
): Array<Pick<ClassifiedElement, 'element' | 'kind' | 'c' | 't' | 'count'>> {
  if (dims.shape === 'I') {
    // Welded sections: c is measured from the web face (weld size taken as 0)
    const r = dims.make === 'rolled' ? dims.r : 0;
    return [
      // EN 1993-1-1 Table 5.2 (sheet 2): outstand c = (b − tw − 2r)/2
      { element: 'flange outstand', kind: 'outstand', c: (dims.b - dims.tw - 2 * r) / 2, t: dims.tf, count: 4 },
      // EN 1993-1-1 Table 5.2 (sheet 1): web c = h − 2tf − 2r
      { element: 'web', kind: 'internal', c: dims.h - 2 * dims.tf - 2 * r, t: dims.tw, count: 1 },
    ];
  }
  if (dims.shape === 'RHS') {
    // EN 1993-1-1 Table 5.2 (sheet 1) for hollow sections: c = h − 3t and b − 3t (either make)
    const { h, b, t } = dims;
    if (h === b) return [{ element: 'wall', kind: 'internal', c: h - 3 * t, t, count: 4 }];
    return [
      { element: 'wall (h side)', kind: 'internal', c: h - 3 * t, t, count: 2 },
      { element: 'wall (b side)', kind: 'internal', c: b - 3 * t, t, count: 2 },
    ];
  }
  return [{ element: 'tube', kind: 'tube', c: dims.d, t: dims.t, count: 1 }];
}

/** Section class in pure compression (EN 1993-1-1 5.5, Table 5.2), with the element that sets it. */
export function classifySection(dims: SectionDims, epsilon: number): Classification {
  const e2 = epsilon * epsilon;
  const elements = compressedElements(dims).map((p) => {
    // EN 1993-1-1 Table 5.2: internal 33ε/38ε/42ε, outstand 9ε/10ε/14ε, tube d/t 50ε²/70ε²/90ε²
    const limits: readonly [number, number, number] =
      p.kind === 'internal'
        ? [33 * epsilon, 38 * epsilon, 42 * epsilon]
        : p.kind === 'outstand'
          ? [9 * epsilon, 10 * epsilon, 14 * epsilon]
          : [50 * e2, 70 * e2, 90 * e2];
    return element(p.element, p.kind, p.c, p.t, limits, p.count);
  });
  let governing = elements[0]!;
  for (const e of elements)
    if (
      e.sectionClass > governing.sectionClass ||
      (e.sectionClass === governing.sectionClass && e.ratio / e.limits[2] > governing.ratio / governing.limits[2])
    )
      governing = e;
  return { sectionClass: governing.sectionClass, governing, elements };
}
