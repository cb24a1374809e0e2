// The work done on the worker thread (server/offThread/pool.ts): what takes long enough to stall the
// requests and live edits of a process. Each task takes and returns plain data (structured clone).
import { analyseBuilding, isEngineError, sizeBuilding } from '../../shared/engine/index.ts';
import type { BuildingSizing } from '../../shared/engine/sizing/sizeBuilding.ts';
import type { AnalysisOptions, BuildingStackResult } from '../../shared/schema/results.ts';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import type { SizingRequest } from '../../shared/schema/sizing.ts';
import type { SectionDims, StackDocument } from '../../shared/schema/stack.ts';
import type { Op } from '../../shared/schema/ops.ts';
import type { AnalysisContext } from '../../shared/engine/stack/context.ts';
import type { StackResult } from '../../shared/schema/results.ts';
import { stackDocumentSchema } from '../../shared/schema/stack.ts';
import { analyseStack } from '../../shared/engine/index.ts';
import { applyOps, OpError, touchedIds } from '../../shared/ops/applyOps.ts';
import { renderCalcPackage, type PackageExtras } from '../pdf/calcPackage.ts';

/** The snapshot goes as its stored text, parsed here: a string crosses the thread boundary in one copy, where the
 *  object would be cloned, and a parse of megabytes would hold the main thread. */
export interface PackageTask extends PackageExtras {
  snapshotText: string;
  hash: string;
}

export function renderPackage({ snapshotText, hash, ...extras }: PackageTask): Promise<Buffer> {
  // Written by freezeRevision from validated documents and our engine's results, and its hash checked on reading.
  return renderCalcPackage(JSON.parse(snapshotText) as RevisionSnapshot, hash, extras);
}

export interface SizingStack {
  stackId: number;
  name: string;
  version: number;
  doc: StackDocument;
  /** A typical column: the document with each further position's loads (docs/typical-columns.md). */
  positionDocs?: StackDocument[];
}

export interface BuildingSizingTask {
  stacks: SizingStack[];
  request: SizingRequest;
  options: AnalysisOptions;
  levels: Map<string, number>;
  sections: Map<string, SectionDims>;
}

/** The engine's refusal crosses the thread as data: an Error's own fields do not survive the trip. */
export type BuildingSizingOutcome =
  | { sizing: BuildingSizing<Omit<SizingStack, 'doc' | 'positionDocs'>> }
  | { refused: { message: string; code: string } };

export function sizeWholeBuilding({
  stacks,
  request,
  options,
  levels,
  sections,
}: BuildingSizingTask): BuildingSizingOutcome {
  try {
    return { sizing: sizeBuilding(stacks, request, options, { levels, sections }) };
  } catch (error) {
    if (isEngineError(error)) return { refused: { message: error.message, code: error.code } };
    throw error;
  }
}

export interface BuildingAnalysisTask {
  stacks: { id: number; name: string; doc: StackDocument; floorLoads?: AnalysisContext['floorLoads'] }[];
  options: AnalysisOptions;
  levels: Map<string, number>;
  sections: Map<string, SectionDims>;
}

export interface EditTask {
  /** The stored document as text: parsing and checking it is part of the work moved off the main thread. */
  docText: string;
  ops: Op[];
  /** For a stack on the building's grid: what each level's floor brings into it. */
  floorLoads?: AnalysisContext['floorLoads'];
  options: AnalysisOptions;
  levels: Map<string, number>;
  sections: Map<string, SectionDims>;
}

/** One stack's analysis as it crosses the thread: the result as JSON text, as the stacks table stores it. */
export interface AnalysedStack {
  id: number;
  status: BuildingStackResult['status'];
  utilisation: number | null;
  governingLiftId: string | null;
  resultJson: string;
}

/**
 * Every stack of a building analysed (with the critical buckling analysis of each stack, seconds for a
 * large building). Results go back as text: copying one string per stack to the main thread costs a
 * fraction of cloning the objects, and the caller stores the text as it is.
 */
export function analyseWholeBuilding({ stacks, options, levels, sections }: BuildingAnalysisTask): AnalysedStack[] {
  return analyseBuilding(stacks, levels, options, { sections, shapeChecked: true }).stacks.map((s) => ({
    id: s.id,
    status: s.status,
    utilisation: s.utilisation,
    governingLiftId: s.governingLiftId,
    resultJson: JSON.stringify(s.result),
  }));
}

export type EditOutcome =
  | { doc: StackDocument; touched: string[]; results: StackResult }
  | { touched: string[]; opError: { message: string; opIndex: number; id: string } };

/** One edit of a large stack: parse the stored document, apply the ops, analyse (docs/access.md). */
export function editLargeStack({ docText, ops, options, levels, sections, floorLoads }: EditTask): EditOutcome {
  const before = stackDocumentSchema.parse(JSON.parse(docText));
  const touched = [...touchedIds(before, ops)];
  let doc: StackDocument;
  try {
    doc = applyOps(before, ops);
  } catch (e) {
    if (e instanceof OpError) return { touched, opError: { message: e.message, opIndex: e.opIndex, id: e.id } };
    throw e;
  }
  return { doc, touched, results: analyseStack(doc, options, { levels, sections, shapeChecked: true, floorLoads }) };
}
