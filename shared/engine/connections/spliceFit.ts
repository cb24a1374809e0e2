// How the sections either side of a bearing splice meet (common practice, no source: the usual detailing of
// bearing splices in simple construction). Same serial size: flange cover plates, with packs where the
// upper section is shallower. Different serial size: a division plate between the ends carries the bearing.
import type { SectionDims } from '../../schema/stack.ts';
import { serialSize } from '../sizing/serialSize.ts';

export interface SpliceFit {
  sameSerialSize: boolean | null;
  packThickness: number;
  divisionPlate: boolean;
  fit: string;
}

export function spliceFit(
  above: { designation: string; dims: SectionDims },
  below: { designation: string; dims: SectionDims },
): SpliceFit {
  if (above.dims.shape !== 'I' || below.dims.shape !== 'I') {
    return {
      sameSerialSize: null,
      packThickness: 0,
      divisionPlate: false,
      fit: 'Splices of hollow sections are not detailed here: end plates or a cap plate to be designed',
    };
  }
  const same = serialSize(above.designation) === serialSize(below.designation);
  if (!same) {
    return {
      sameSerialSize: false,
      packThickness: 0,
      divisionPlate: true,
      fit: `${above.designation} on ${below.designation}: different serial sizes, a division plate between the ends carries the bearing`,
    };
  }
  // Packs bring the upper flanges out to the lower ones: half the difference in overall depth
  const pack = Math.max(0, (below.dims.h - above.dims.h) / 2);
  const rounded = Math.round(pack * 10) / 10;
  return {
    sameSerialSize: true,
    packThickness: rounded,
    divisionPlate: false,
    fit:
      rounded > 0
        ? `Same serial size: flange cover plates with ${rounded} mm packs on the upper column`
        : 'Same serial size and depth: flange cover plates without packs',
  };
}
