// Load take-down and member checks of one stack (docs/analysis-rules.md). Pure and synchronous; never throws for
// a bad document, which is reported through `errors` instead.
import {
  DEFAULT_ANALYSIS_OPTIONS,
  type AnalysisOptions,
  type Issue,
  type LiftResult,
  type StackResult,
} from '../../schema/results.ts';
import type { StackDocument } from '../../schema/stack.ts';
import { applyFloorLoads } from '../building/applyFloorLoads.ts';
import { isEngineError } from '../errors.ts';
import { connectionChecks } from '../connections/connectionChecks.ts';
import { withCriticalBuckling } from '../critical/withCriticalBuckling.ts';
import { applyNominalMoments } from '../simple/applyNominalMoments.ts';
import { checkLift } from './checkLift.ts';
import { allLevelElevations, type AnalysisContext } from './context.ts';
import { inspectStack } from './inspectStack.ts';
import { placeOnLevels } from './placeOnLevels.ts';
import { stackPieces } from './stackPieces.ts';
import { selfWeightPerMetre, takeDown } from './takeDown.ts';

function withErrors(errors: Issue[], warnings: Issue[]): StackResult {
  return { errors, warnings, lifts: [], governingLiftId: null, takeDown: [] };
}

export function analyseStack(
  doc: StackDocument,
  options: Partial<AnalysisOptions> = {},
  context: AnalysisContext = {},
): StackResult {
  const settings: AnalysisOptions = { ...DEFAULT_ANALYSIS_OPTIONS, ...options };
  // Tied nodes stand at their levels for every part below (connections, nominal moments), not only the model;
  // loads from the building's floors replace those typed on the nodes, for this analysis only
  const floor = applyFloorLoads(placeOnLevels(doc, context.levels), context.floorLoads);
  const { model, errors, warnings } = inspectStack(floor.doc, context);
  if (!model) return withErrors(errors, warnings);
  const entries =
    floor.areas.size === 0
      ? model.entries
      : model.entries.map((e) => {
          const loaded = floor.areas.get(e.nodeId);
          return loaded ? { ...e, area: { [loaded.category]: loaded.area } } : e;
        });

  // Self-weight is permanent load on the column below (docs/analysis-rules.md §Take-down)
  const weights = model.lifts.map((l) => ({
    bottom: l.bottom,
    top: l.top,
    perMetre: settings.selfWeight ? selfWeightPerMetre(l.section.massPerMetre) : 0,
  }));
  const pieces = stackPieces(model, allLevelElevations(context.levels));
  const { rows, sectionNEd } = takeDown(
    entries,
    weights,
    settings,
    pieces.flat().map((p) => p.from),
  );
  // Buckling lengths from the elastic critical buckling analysis of the stack, when the building asks for it
  const critical =
    settings.bucklingLengths === 'critical' ? withCriticalBuckling(model, pieces, sectionNEd, context.sections) : null;
  if (critical?.errors.length) return withErrors(critical.errors, warnings);
  const lifts: LiftResult[] = [];
  const checkErrors: Issue[] = [];
  let first = 0;
  for (const [i, lift] of model.lifts.entries()) {
    const NEd = sectionNEd.slice(first, first + pieces[i].length);
    first += pieces[i].length;
    try {
      lifts.push(checkLift(lift, pieces[i], NEd, settings, context.sections, critical?.forLift(i)));
    } catch (error) {
      if (!isEngineError(error)) throw error;
      checkErrors.push({ nodeId: lift.id, message: `Lift ${lift.name}: ${error.message}` });
    }
  }
  if (checkErrors.length) return withErrors(checkErrors, warnings);
  // Simple construction: nominal moments from the beam reactions on the column faces, and the combined check
  const simple = applyNominalMoments(floor.doc, model, lifts, settings, context.sections);
  warnings.push(...simple.warnings);
  if (simple.errors.length) return withErrors(simple.errors, warnings);

  // The governing lift is the most utilised, the lowest one on a tie (docs/analysis-rules.md §Pieces)
  let governing: LiftResult | null = null;
  for (const lift of lifts) if (!governing || lift.utilisation > governing.utilisation) governing = lift;
  const result: StackResult = {
    errors: [],
    warnings,
    lifts,
    governingLiftId: governing?.liftId ?? null,
    takeDown: rows,
  };
  if (critical?.result) critical.finish(result);
  if (floor.uses.length) result.floorLoads = floor.uses;
  // Splices and the base: additive results, never a change to the member checks above
  const connections = connectionChecks(floor.doc, model, weights, rows, settings);
  result.splices = connections.splices;
  if (connections.base) result.base = connections.base;
  return result;
}
