// The work done on the worker thread (server/offThread/pool.ts): what takes long enough to stall the
// requests and live edits of a process. Each task takes and returns plain data (structured clone).
import { isEngineError, sizeBuilding } from '../../shared/engine/index.ts';
import type { BuildingSizing } from '../../shared/engine/sizing/sizeBuilding.ts';
import type { AnalysisOptions } from '../../shared/schema/results.ts';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import type { SizingRequest } from '../../shared/schema/sizing.ts';
import type { SectionDims, StackDocument } from '../../shared/schema/stack.ts';
import { renderCalcPackage } from '../pdf/calcPackage.ts';

export interface PackageTask {
  snapshot: RevisionSnapshot;
  hash: string;
  mark?: string;
}

export function renderPackage({ snapshot, hash, mark }: PackageTask): Promise<Buffer> {
  return renderCalcPackage(snapshot, hash, mark);
}

export interface SizingStack {
  stackId: number;
  name: string;
  version: number;
  doc: StackDocument;
}

export interface BuildingSizingTask {
  stacks: SizingStack[];
  request: SizingRequest;
  options: AnalysisOptions;
  levels: Map<string, number>;
  sections: Map<string, SectionDims>;
}

/** The engine's refusal crosses the thread as data: an Error's own fields do not survive the trip. */
export type BuildingSizingOutcome = { sizing: BuildingSizing<Omit<SizingStack, 'doc'>> } | { refused: { message: string; code: string } };

export function sizeWholeBuilding({ stacks, request, options, levels, sections }: BuildingSizingTask): BuildingSizingOutcome {
  try {
    return { sizing: sizeBuilding(stacks, request, options, { levels, sections }) };
  } catch (error) {
    if (isEngineError(error)) return { refused: { message: error.message, code: error.code } };
    throw error;
  }
}
