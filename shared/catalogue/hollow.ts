// Hot-finished structural hollow sections to EN 10210-2: the common square (SHS), rectangular
// (RHS) and circular (CHS) sizes with their standard wall thicknesses, as listed in SCI P363
// (steel building design: design data); size lists from memory. Only h, b, t or d, t are stored:
// the corner radii (1.5t outside, 1.0t inside) and every property follow from EN 10210-2 Annex B.
import type { CatalogueEntry } from './types.ts';
import { formatMm } from './designation.ts';

type SizeList = ReadonlyArray<readonly [size: readonly number[], thicknesses: readonly number[]]>;

const SQUARE: SizeList = [
  [[40], [3.0, 3.2, 4.0, 5.0]],
  [[50], [3.0, 3.2, 4.0, 5.0, 6.3]],
  [[60], [3.0, 3.2, 4.0, 5.0, 6.3, 8.0]],
  [[70], [3.6, 5.0, 6.3, 8.0]],
  [[80], [3.6, 4.0, 5.0, 6.3, 8.0]],
  [[90], [3.6, 4.0, 5.0, 6.3, 8.0]],
  [[100], [4.0, 5.0, 6.3, 8.0, 10.0]],
  [[120], [5.0, 6.3, 8.0, 10.0]],
  [[140], [5.0, 6.3, 8.0, 10.0]],
  [[150], [5.0, 6.3, 8.0, 10.0, 12.5]],
  [[160], [5.0, 6.3, 8.0, 10.0, 12.5]],
  [[180], [6.3, 8.0, 10.0, 12.5, 16.0]],
  [[200], [5.0, 6.3, 8.0, 10.0, 12.5, 16.0]],
  [[250], [6.3, 8.0, 10.0, 12.5, 16.0]],
  [[300], [6.3, 8.0, 10.0, 12.5, 16.0]],
  [[350], [8.0, 10.0, 12.5, 16.0]],
  [[400], [8.0, 10.0, 12.5, 16.0, 20.0]],
];

const RECTANGULAR: SizeList = [
  [
    [100, 50],
    [3.0, 3.2, 4.0, 5.0, 6.3],
  ],
  [
    [100, 60],
    [3.6, 4.0, 5.0, 6.3, 8.0],
  ],
  [
    [120, 60],
    [3.6, 4.0, 5.0, 6.3],
  ],
  [
    [120, 80],
    [5.0, 6.3, 8.0],
  ],
  [
    [150, 100],
    [5.0, 6.3, 8.0, 10.0],
  ],
  [
    [160, 80],
    [5.0, 6.3, 8.0, 10.0],
  ],
  [
    [200, 100],
    [5.0, 6.3, 8.0, 10.0, 12.5],
  ],
  [
    [250, 150],
    [6.3, 8.0, 10.0, 12.5, 16.0],
  ],
  [
    [300, 200],
    [6.3, 8.0, 10.0, 12.5, 16.0],
  ],
  [
    [400, 200],
    [8.0, 10.0, 12.5, 16.0],
  ],
  [
    [450, 250],
    [8.0, 10.0, 12.5, 16.0],
  ],
  [
    [500, 300],
    [10.0, 12.5, 16.0, 20.0],
  ],
];

const CIRCULAR: SizeList = [
  [[48.3], [3.2, 4.0, 5.0]],
  [[60.3], [3.2, 4.0, 5.0]],
  [[76.1], [3.2, 4.0, 5.0]],
  [[88.9], [3.2, 4.0, 5.0, 6.3]],
  [[114.3], [3.6, 5.0, 6.3]],
  [[139.7], [5.0, 6.3, 8.0, 10.0]],
  [[168.3], [5.0, 6.3, 8.0, 10.0]],
  [[193.7], [6.3, 8.0, 10.0, 12.5]],
  [[219.1], [6.3, 8.0, 10.0, 12.5, 16.0]],
  [[244.5], [8.0, 10.0, 12.5, 16.0]],
  [[273.0], [6.3, 8.0, 10.0, 12.5, 16.0]],
  [[323.9], [6.3, 8.0, 10.0, 12.5, 16.0]],
  [[355.6], [8.0, 10.0, 12.5, 16.0]],
  [[406.4], [10.0, 12.5, 16.0]],
  [[457.0], [10.0, 12.5, 16.0]],
  [[508.0], [10.0, 12.5, 16.0]],
];

const expand = (list: SizeList) => list.flatMap(([size, ts]) => ts.map((t) => [size, t] as const));

export const SHS: readonly CatalogueEntry[] = expand(SQUARE).map(([[a], t]) => ({
  designation: `SHS ${formatMm(a!)}x${formatMm(a!)}x${formatMm(t)}`,
  series: 'SHS',
  dims: { shape: 'RHS', make: 'hot-finished', h: a!, b: a!, t },
}));

export const RHS: readonly CatalogueEntry[] = expand(RECTANGULAR).map(([[h, b], t]) => ({
  designation: `RHS ${formatMm(h!)}x${formatMm(b!)}x${formatMm(t)}`,
  series: 'RHS',
  dims: { shape: 'RHS', make: 'hot-finished', h: h!, b: b!, t },
}));

export const CHS: readonly CatalogueEntry[] = expand(CIRCULAR).map(([[d], t]) => ({
  designation: `CHS ${d!.toFixed(1)}x${t.toFixed(1)}`,
  series: 'CHS',
  dims: { shape: 'CHS', make: 'hot-finished', d: d!, t },
}));
