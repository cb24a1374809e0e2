// Geometry of a spandrel: the piece between a square corner and a quarter circle of radius r
// inscribed in it (root fillet of a rolled I, corner of a hollow section). Standard results for a
// square minus a quarter circle; they give the familiar 0.2146 r², 0.2234 r and 0.0075 r⁴.

export interface Spandrel {
  /** Area (1 − π/4) r². */
  area: number;
  /** Distance of the centroid from each straight edge. */
  offset: number;
  /** Second moment about its own centroidal axis parallel to an edge. */
  ownI: number;
}

export function spandrel(r: number): Spandrel {
  const area = (1 - Math.PI / 4) * r * r;
  if (r === 0) return { area: 0, offset: 0, ownI: 0 };
  const offset = (r * (10 - 3 * Math.PI)) / (3 * (4 - Math.PI));
  const quarterArea = (Math.PI * r * r) / 4;
  const quarterCentroidFromEdge = r - (4 * r) / (3 * Math.PI);
  const quarterOwnI = (Math.PI * r ** 4) / 16 - quarterArea * ((4 * r) / (3 * Math.PI)) ** 2;
  const quarterEdgeI = quarterOwnI + quarterArea * quarterCentroidFromEdge ** 2;
  const edgeI = r ** 4 / 3 - quarterEdgeI;
  return { area, offset, ownI: edgeI - area * offset * offset };
}
