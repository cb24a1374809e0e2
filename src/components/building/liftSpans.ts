// The lifts a template makes: a splice every n storeys, the top lift taking what is left.

export interface LiftSpan {
  index: number;
  bottom: number;
  top: number;
}

export function templateLiftSpans(storeys: number, storeyHeight: number, spliceEvery: number, baseElevation: number): LiftSpan[] {
  if (!(storeys >= 1 && spliceEvery >= 1 && storeyHeight > 0)) return [];
  const spans: LiftSpan[] = [];
  for (let first = 0, index = 1; first < storeys; first += spliceEvery, index++) {
    const last = Math.min(first + spliceEvery, storeys);
    spans.push({ index, bottom: baseElevation + first * storeyHeight, top: baseElevation + last * storeyHeight });
  }
  return spans;
}
