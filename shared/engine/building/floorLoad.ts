// Area loads of a floor build-up (kN/m²): the permanent items summed, the imposed load with its category,
// and the partition allowance added to whichever the build-up says it is.
import type { Buildup } from '../../schema/building.ts';
import type { Category } from '../../schema/stack.ts';

export interface AreaLoads {
  gk: number;
  qk: number;
  category: Category;
}

export function areaLoads(buildup: Buildup): AreaLoads {
  let gk = 0;
  for (const item of buildup.permanent) gk += item.gk;
  let qk = buildup.imposed.qk;
  const partitions = buildup.partitions;
  // EN 1991-1-1 6.3.1.2(8): movable partitions as an imposed load on the floor, in the floor's category.
  if (partitions?.as === 'imposed') qk += partitions.load;
  else if (partitions) gk += partitions.load;
  return { gk, qk, category: buildup.imposed.category };
}
