import type { IDims, SectionProperties } from './sectionTypes.ts';
import { spandrel } from './spandrel.ts';
import { symmetricProperties } from './symmetricProperties.ts';

/**
 * Doubly symmetric I section: two flanges, a web and four root fillets of radius r (r = 0 for
 * welded plates). The formulas are the exact sums of rectangles and spandrels, as used for the
 * EN 10365 / BS 4-1 property tables.
 */
export function iSectionProperties({ make, h, b, tw, tf, r: rootRadius }: IDims): SectionProperties {
  // Welded sections: the fillet welds are ignored, as in Table 5.2 (weld size taken as 0)
  const r = make === 'rolled' ? rootRadius : 0;
  const hw = h - 2 * tf;
  const f = spandrel(r);
  const filletY = h / 2 - tf - f.offset;
  const filletZ = tw / 2 + f.offset;

  const A = 2 * b * tf + hw * tw + 4 * f.area;
  const Iy = (b * h ** 3 - (b - tw) * hw ** 3) / 12 + 4 * (f.ownI + f.area * filletY ** 2);
  const Iz = (2 * tf * b ** 3 + hw * tw ** 3) / 12 + 4 * (f.ownI + f.area * filletZ ** 2);
  const WplY = b * tf * (h - tf) + (tw * hw * hw) / 4 + 4 * f.area * filletY;
  const WplZ = (tf * b * b) / 2 + (hw * tw * tw) / 4 + 4 * f.area * filletZ;

  return {
    ...symmetricProperties(A, Iy, Iz, h, b),
    WplY,
    WplZ,
    It: r > 0 ? rolledTorsionConstant(h, b, tw, tf, r) : (2 * b * tf ** 3 + hw * tw ** 3) / 3,
    // Warping constant of a doubly symmetric I: Iz (h − tf)² / 4 (thin-walled theory)
    Iw: (Iz * (h - tf) ** 2) / 4,
    tMax: Math.max(tf, tw),
  };
}

/**
 * Torsion constant of a rolled I with the allowance for the web–flange junctions that the
 * EN 10365 and SCI P363 tables use (formula from memory).
 */
function rolledTorsionConstant(h: number, b: number, tw: number, tf: number, r: number): number {
  const D = ((tf + r) ** 2 + tw * (r + tw / 4)) / (2 * r + tf);
  const alpha = (tw / tf) * (0.145 + (0.1 * r) / tf);
  return (2 / 3) * b * tf ** 3 + (1 / 3) * (h - 2 * tf) * tw ** 3 + 2 * alpha * D ** 4 - 0.42 * tf ** 4;
}
