// How a floor's nominal moment divides between the column lengths above and below it.
import { EQUAL_SHARE_RATIO } from './constants.ts';

export interface MomentShare {
  above: number;
  below: number;
  rule: 'equal' | 'stiffness' | 'one side';
}

/**
 * In proportion to the stiffnesses EI/L of the lengths above and below, or equally when the larger is at
 * most 1.5 times the smaller (common practice for simple construction, SCI P358/P360 method, from memory).
 * A side with no column (stiffness 0) takes nothing. The moment is not carried to the next floor.
 */
export function shareMoment(moment: number, stiffnessAbove: number, stiffnessBelow: number): MomentShare {
  if (!(stiffnessAbove > 0) || !(stiffnessBelow > 0)) {
    return stiffnessAbove > 0
      ? { above: moment, below: 0, rule: 'one side' }
      : { above: 0, below: moment, rule: 'one side' };
  }
  const ratio = Math.max(stiffnessAbove, stiffnessBelow) / Math.min(stiffnessAbove, stiffnessBelow);
  if (ratio <= EQUAL_SHARE_RATIO) return { above: moment / 2, below: moment / 2, rule: 'equal' };
  const total = stiffnessAbove + stiffnessBelow;
  return { above: (moment * stiffnessAbove) / total, below: (moment * stiffnessBelow) / total, rule: 'stiffness' };
}
