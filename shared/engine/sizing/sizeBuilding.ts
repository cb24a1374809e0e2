// Sizing every stack of a building: stacks carry their own loads, so each is sized on its own; a typical column
// (docs/typical-columns.md) for every position it stands at.
import type { AnalysisOptions } from '../../schema/results.ts';
import type { SizingRequest, StackSizing } from '../../schema/sizing.ts';
import type { StackDocument } from '../../schema/stack.ts';
import type { AnalysisContext } from '../stack/context.ts';
import { sizeTypicalColumn } from './sizeStack.ts';

export interface BuildingSizing<T> {
  stacks: (T & StackSizing)[];
  /** kg, over the stacks without errors. */
  massBefore: number;
  massAfter: number;
}

export function sizeBuilding<T extends { doc: StackDocument; positionDocs?: StackDocument[] }>(
  stacks: readonly T[],
  request: SizingRequest,
  options: Partial<AnalysisOptions> = {},
  context: AnalysisContext = {},
): BuildingSizing<Omit<T, 'doc' | 'positionDocs'>> {
  let massBefore = 0;
  let massAfter = 0;
  const sized = stacks.map(({ doc, positionDocs, ...rest }) => {
    const result = sizeTypicalColumn([doc, ...(positionDocs ?? [])], request, options, context);
    massBefore += result.massBefore ?? 0;
    massAfter += result.massAfter ?? 0;
    return { ...rest, ...result };
  });
  return { stacks: sized, massBefore, massAfter };
}
