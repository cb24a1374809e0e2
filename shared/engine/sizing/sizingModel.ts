// What sizing needs of a stack, worked out once: every lift's pieces (docs/analysis-rules.md §Pieces) with the loads
// that enter above each piece, the segment it lies in about each axis and its buckling lengths. Only the
// self-weight changes with the sections chosen, so a candidate costs a few member checks, not an analysis.
import type { AnalysisOptions } from '../../schema/results.ts';
import type { LiftData, SectionDims } from '../../schema/stack.ts';
import type { AxialState } from '../stack/combination.ts';
import type { StackModel } from '../stack/inspectStack.ts';
import { stackPieces } from '../stack/stackPieces.ts';
import { axialStates } from '../stack/takeDown.ts';

export interface SizingPiece {
  from: number;
  /** Loads entering above the piece's bottom, without self-weight. */
  entries: AxialState;
  /** Index (within the lift) of the piece group sharing a segment about y and about z. */
  groupY: number;
  groupZ: number;
  /** Buckling lengths, m: k·L of the segment or the lift's own k (docs/analysis-rules.md §Buckling-length factors). */
  LcrY: number;
  LcrZ: number;
}

export interface SizingLift {
  id: string;
  name: string;
  bottom: number;
  top: number;
  data: LiftData;
  /** The current section as the analysis reads it. */
  designation: string;
  massPerMetre: number;
  pieces: SizingPiece[];
}

export interface SizingModel {
  /** Bottom first, as in the analysis. */
  lifts: SizingLift[];
  options: AnalysisOptions;
  sections?: ReadonlyMap<string, SectionDims>;
}

function groupsOf<T>(items: readonly T[]): number[] {
  return items.map((item) => items.indexOf(item));
}

export function sizingModel(
  model: StackModel,
  options: AnalysisOptions,
  levelElevations: readonly number[],
  sections?: ReadonlyMap<string, SectionDims>,
): SizingModel {
  // Spans and segments exactly as the analysis cuts them; self-weight is added per candidate.
  const spans = stackPieces(model, levelElevations);
  const states = axialStates(
    model.entries,
    [],
    spans.flat().map((p) => ({ elevation: p.from, includeEntriesAt: false })),
  );
  let next = 0;
  const lifts = model.lifts.map((lift, i) => {
    const own = spans[i];
    const groupY = groupsOf(own.map((p) => p.segmentY));
    const groupZ = groupsOf(own.map((p) => p.segmentZ));
    const pieces = own.map((p, k) => ({
      from: p.from,
      entries: states[next++],
      groupY: groupY[k],
      groupZ: groupZ[k],
      LcrY: (lift.data.kY ?? p.segmentY.k) * (p.segmentY.top - p.segmentY.bottom),
      LcrZ: (lift.data.kZ ?? p.segmentZ.k) * (p.segmentZ.top - p.segmentZ.bottom),
    }));
    return {
      id: lift.id,
      name: lift.name,
      bottom: lift.bottom,
      top: lift.top,
      data: lift.data,
      designation: lift.section.designation,
      massPerMetre: lift.section.massPerMetre,
      pieces,
    };
  });
  return { lifts, options, sections };
}
