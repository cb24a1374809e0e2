// Which lifts the combined check will reach: those with a piece in a storey that takes a share of some
// floor's or the cap's nominal moment. It depends on where the floors and faces are, not on the sections.
import type { AnalysisOptions } from '../../schema/results.ts';
import type { SectionDims, StackDocument } from '../../schema/stack.ts';
import { sectionData } from '../sectionData.ts';
import type { StackModel } from '../stack/inspectStack.ts';
import { hasFaceReactions, momentFloors } from './applyNominalMoments.ts';
import { expressionsOf } from './combinationForces.ts';
import { floorMoments } from './floorMoments.ts';

const EPS = 1e-6;

export function liftsUnderMoments(
  doc: StackDocument,
  model: StackModel,
  options: AnalysisOptions,
  sections?: ReadonlyMap<string, SectionDims>,
): boolean[] {
  if (!hasFaceReactions(doc, options)) return model.lifts.map(() => false);
  const floors = momentFloors(doc, model);
  const columns = model.lifts.map((l) => {
    const { props } = sectionData(l.data.section, sections);
    return { bottom: l.bottom, top: l.top, dims: l.section.dims, Iy: props.Iy, Iz: props.Iz };
  });
  const bottom = model.lifts[0].bottom;
  const top = model.lifts[model.lifts.length - 1].top;
  const storeys: [number, number][] = [];
  for (const expression of expressionsOf(options)) {
    for (const m of floorMoments(floors, columns, bottom, top, options, expression)) {
      if (m.y.share.below > 0 || m.z.share.below > 0) storeys.push([m.elevation - m.lengthBelow, m.elevation]);
      if (m.y.share.above > 0 || m.z.share.above > 0) storeys.push([m.elevation, m.elevation + m.lengthAbove]);
    }
  }
  return model.lifts.map((l) => storeys.some(([a, b]) => Math.min(b, l.top) - Math.max(a, l.bottom) > EPS));
}
