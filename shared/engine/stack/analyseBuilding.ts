// The building overview: every stack analysed, each one's governing lift, and the worst stack.
import type { AnalysisOptions, BuildingResult, BuildingStackResult, StackStatus } from '../../schema/results.ts';
import type { StackDocument } from '../../schema/stack.ts';
import { analyseStack } from './analyseStack.ts';
import type { AnalysisContext, LevelElevations } from './context.ts';

export interface BuildingStack<Id extends string | number> {
  id: Id;
  name: string;
  doc: StackDocument;
  /** For a stack on the building's grid: what each level's floor brings into it (engine/building). */
  floorLoads?: AnalysisContext['floorLoads'];
}

export function analyseBuilding<Id extends string | number>(
  stacks: readonly BuildingStack<Id>[],
  levels: LevelElevations | undefined,
  options: Partial<AnalysisOptions> = {},
  context: AnalysisContext = {},
): BuildingResult<Id> {
  const shared: AnalysisContext = { ...context, levels: levels ?? context.levels };
  const results: BuildingStackResult<Id>[] = stacks.map(({ id, name, doc, floorLoads }) => {
    const result = analyseStack(doc, options, floorLoads ? { ...shared, floorLoads } : shared);
    const governing = result.lifts.find((l) => l.liftId === result.governingLiftId);
    const utilisation = result.errors.length || !governing ? null : governing.utilisation;
    const status: StackStatus = utilisation === null ? 'errors' : utilisation > 1 ? 'fails' : 'passes';
    return { id, name, governingLiftId: result.governingLiftId, utilisation, status, result };
  });
  let worst: BuildingStackResult<Id> | null = null;
  for (const stack of results) {
    if (stack.utilisation !== null && (!worst || stack.utilisation > (worst.utilisation ?? -Infinity))) worst = stack;
  }
  return { stacks: results, worstStackId: worst ? worst.id : null };
}
