// Runs the engine for a stored stack with its building's options and levels, and summarises the
// result for lists (so listing never recomputes).
import type { Knex } from 'knex';
import { applyFloorLoads } from '../../shared/engine/building/applyFloorLoads.ts';
import { stackFloorLoads } from '../../shared/engine/building/stackFloorLoads.ts';
import { analyseStack } from '../../shared/engine/index.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import type { BuildingModel, StackPlacement } from '../../shared/schema/building.ts';
import type { AnalysisOptions, StackResult } from '../../shared/schema/results.ts';
import type { SectionDims, StackDocument } from '../../shared/schema/stack.ts';
import { readModel } from './buildingModelStore.ts';
import { getBuildingOptions } from './buildings.ts';
import { companySectionMap } from './companySections.ts';

export interface AnalysisInputs {
  options: AnalysisOptions;
  /** levelId (as a string) → elevation, m */
  levels: Map<string, number>;
  /** The building's own sections by designation (docs/contracts.md §Imports). */
  sections: Map<string, SectionDims>;
  /** Grid, floor loads and area overrides (docs/building-model.md). */
  model: BuildingModel;
}

/** A stored stack's place on the grid, for deriving its loads. */
export interface StackPlace extends StackPlacement {
  stackId: number;
}

export async function analysisInputs(db: Knex, buildingId: number): Promise<AnalysisInputs> {
  const options = await getBuildingOptions(db, buildingId);
  const rows = await db('levels')
    .where({ building_id: buildingId })
    .select<{ id: number; elevation: number }[]>('id', 'elevation');
  const levels = new Map(rows.map((r) => [String(r.id), Number(r.elevation)]));
  return {
    options,
    levels,
    sections: await companySectionMap(db, buildingId),
    model: (await readModel(db, buildingId)).model,
  };
}

/** What each level's floor brings into a stack on the grid; undefined for a stack off the grid. */
export function floorLoadsOf(inputs: AnalysisInputs, place?: StackPlace) {
  return place && place.gridX !== null ? stackFloorLoads(inputs.model, place, place.stackId) : undefined;
}

/** The results as stored: marked with the rules that produced them, so results of older rules can be found. */
export function analyse(doc: StackDocument, inputs: AnalysisInputs, place?: StackPlace): StackResult {
  return analyseWithLoads(doc, inputs, floorLoadsOf(inputs, place));
}

/** `analyse` with the floors' loads already derived (`floorLoadsOf`). */
export function analyseWithLoads(
  doc: StackDocument,
  inputs: AnalysisInputs,
  floorLoads: ReturnType<typeof floorLoadsOf>,
): StackResult {
  const options = { levels: inputs.levels, sections: inputs.sections, shapeChecked: true, floorLoads };
  return { ...analyseStack(doc, inputs.options, options), engineVersion: ENGINE_VERSION };
}

/**
 * The document with its floors' loads on its restraints and cap, for sizing, which reads loads from the
 * document. Sizing so leaves out αA (the area is not in the document): its proposal can only be heavier.
 */
export function withDerivedLoads(doc: StackDocument, inputs: AnalysisInputs, place?: StackPlace): StackDocument {
  return applyFloorLoads(doc, floorLoadsOf(inputs, place)).doc;
}

export type StackStatus = 'passes' | 'fails' | 'errors';

export interface ResultSummary {
  utilisation: number | null;
  status: StackStatus;
  governingLiftId: string | null;
  /** L1, L2, … as the engine names the lift; its node id for results stored before lifts had labels. */
  governingLiftLabel: string | null;
  governingSection: string | null;
  liftCount: number;
}

export function summariseResult(doc: StackDocument, results: StackResult): ResultSummary {
  const governing = results.lifts.find((l) => l.liftId === results.governingLiftId) ?? null;
  const utilisation = results.errors.length === 0 && governing ? governing.utilisation : null;
  let status: StackStatus = 'passes';
  if (results.errors.length > 0 || utilisation === null) status = 'errors';
  // EN 1993-1-1 6.3.1.1(1): the design force must not exceed the resistance, i.e. utilisation ≤ 1.0.
  else if (utilisation > 1) status = 'fails';
  return {
    utilisation,
    status,
    governingLiftId: governing?.liftId ?? null,
    governingLiftLabel: governing ? (governing.label ?? governing.liftId) : null,
    governingSection: governing?.section ?? null,
    liftCount: doc.nodes.filter((n) => n.kind === 'lift').length,
  };
}

/** Columns of the stacks table that hold the results of a version. */
export function resultColumns(doc: StackDocument, results: StackResult) {
  const s = summariseResult(doc, results);
  return {
    results: JSON.stringify(results),
    utilisation: s.utilisation,
    status: s.status,
    governing_lift_id: s.governingLiftId,
    governing_lift_label: s.governingLiftLabel,
    governing_section: s.governingSection,
    lift_count: s.liftCount,
  };
}
