// Runs the engine for a stored stack with its building's options and levels, and summarises the
// result for lists (so listing never recomputes).
import type { Knex } from 'knex';
import { applyFloorLoads } from '../../shared/engine/building/applyFloorLoads.ts';
import { floorLoadsKey, stackFloorLoads } from '../../shared/engine/building/stackFloorLoads.ts';
import { positionResult, withPositionResults } from '../../shared/engine/building/typicalColumn.ts';
import { analyseStack } from '../../shared/engine/index.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import {
  gridRef,
  positionOverridesKey,
  type BuildingModel,
  type StackPlacement,
} from '../../shared/schema/building.ts';
import type { AnalysisOptions, StackResult } from '../../shared/schema/results.ts';
import type { SectionDims, StackDocument } from '../../shared/schema/stack.ts';
import { readModel } from './buildingModelStore.ts';
import { getBuildingOptions } from './buildings.ts';
import { companySectionMap } from './companySections.ts';
import { positionsByStack, type PositionRow } from './stackPositionRows.ts';
import { packResults, resultsRef, storeResults, type PackedResults } from './stackRows.ts';

export interface AnalysisInputs {
  options: AnalysisOptions;
  /** levelId (as a string) → elevation, m */
  levels: Map<string, number>;
  /** The building's own sections by designation (docs/contracts.md §Imports). */
  sections: Map<string, SectionDims>;
  /** Grid, floor loads and area overrides (docs/building-model.md). */
  model: BuildingModel;
  /** The further positions of typical columns by stack id (docs/typical-columns.md); none when absent. */
  positions?: Map<number, PositionRow[]>;
}

/** A stored stack's place on the grid, for deriving its loads. */
export interface StackPlace extends StackPlacement {
  stackId: number;
  /** Whose areas set by hand apply here, when not the stack's own: a further position's (`positionOverridesKey`). */
  overridesKey?: string;
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
    positions: await positionsByStack(db, buildingId),
  };
}

/** What each level's floor brings into a stack on the grid; undefined for a stack off the grid. */
export function floorLoadsOf(inputs: AnalysisInputs, place?: StackPlace) {
  return place && place.gridX !== null
    ? stackFloorLoads(inputs.model, place, place.overridesKey ?? place.stackId)
    : undefined;
}

/** Places with the same key get the same floor loads from `floorLoadsOf` (`floorLoadsKey`). */
export function floorLoadsKeyOf(inputs: AnalysisInputs, place: StackPlace): string {
  return floorLoadsKey(inputs.model, place, place.overridesKey ?? place.stackId);
}

/** The results as stored: marked with the rules that produced them, so results of older rules can be found. */
export function analyse(doc: StackDocument, inputs: AnalysisInputs, place?: StackPlace): StackResult {
  return withPositions(analyseWithLoads(doc, inputs, floorLoadsOf(inputs, place)), doc, inputs, place);
}

/**
 * The further positions of a typical column on the grid, each as a place to derive floor loads for, with the
 * areas set by hand for that position (under `p<position id>`, never a stack id: docs/typical-columns.md).
 */
export function positionPlaces(inputs: AnalysisInputs, place?: StackPlace) {
  if (!place || place.gridX === null || place.gridY === null) return [];
  return (inputs.positions?.get(place.stackId) ?? []).map((p) => ({
    positionId: p.id,
    name: gridRef(inputs.model.grid, p.grid_x, p.grid_y) ?? `${p.grid_x}/${p.grid_y}`,
    place: {
      stackId: -p.id,
      gridX: p.grid_x,
      gridY: p.grid_y,
      webAlong: p.web_along === 'y' ? 'y' : 'x',
      overridesKey: positionOverridesKey(p.id),
    } as StackPlace,
  }));
}

/**
 * Own results with the design checked at each further position (docs/typical-columns.md). `worked` holds
 * results already worked out per position id (on the worker thread); the others are analysed here.
 */
export function withPositions(
  own: StackResult,
  doc: StackDocument,
  inputs: AnalysisInputs,
  place?: StackPlace,
  worked?: Map<number, StackResult>,
): StackResult {
  const further = positionPlaces(inputs, place);
  if (further.length === 0 || own.positions || !place) return own;
  const ownName = gridRef(inputs.model.grid, place.gridX!, place.gridY!) ?? `${place.gridX}/${place.gridY}`;
  const context = { levels: inputs.levels, sections: inputs.sections, shapeChecked: true };
  return withPositionResults(own, [
    positionResult({ positionId: null, gridX: place.gridX!, gridY: place.gridY!, name: ownName }, own),
    ...further.map((p) =>
      positionResult(
        { positionId: p.positionId, gridX: p.place.gridX!, gridY: p.place.gridY!, name: p.name },
        worked?.get(p.positionId) ??
          analyseStack(doc, inputs.options, { ...context, floorLoads: floorLoadsOf(inputs, p.place) }),
      ),
    ),
  ]);
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

/** A typical column is summarised by the position that governs it (docs/typical-columns.md). */
export function summariseResult(doc: StackDocument, results: StackResult): ResultSummary {
  const typical = results.positions?.find((p) => p.name === results.governingPosition);
  if (typical)
    return {
      utilisation: typical.utilisation,
      status: typical.status,
      governingLiftId: typical.governingLiftId,
      governingLiftLabel: typical.governingLiftLabel,
      governingSection: typical.governingSection,
      liftCount: doc.nodes.filter((n) => n.kind === 'lift').length,
    };
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

/** Columns of the stacks table that name and summarise the results of a version (docs/contracts.md §Stored results). */
export function resultColumns(doc: StackDocument, results: StackResult, packed: PackedResults) {
  const s = summariseResult(doc, results);
  return {
    ...resultsRef(packed),
    utilisation: s.utilisation,
    status: s.status,
    governing_lift_id: s.governingLiftId,
    governing_lift_label: s.governingLiftLabel,
    governing_section: s.governingSection,
    lift_count: s.liftCount,
  };
}

/** Stores one version's results and returns the columns of its stack row that name and summarise them. */
export async function storedResultColumns(trx: Knex, doc: StackDocument, results: StackResult) {
  const packed = packResults(results);
  await storeResults(trx, [packed]);
  return resultColumns(doc, results, packed);
}
