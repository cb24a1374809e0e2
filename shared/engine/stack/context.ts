// What a stack's analysis may need from its building (docs/contracts.md §Stack document: restraints that refer to a
// level).
import type { SectionDims } from '../../schema/stack.ts';
import type { DerivedLevelLoad } from '../building/stackFloorLoads.ts';

export type LevelElevations = ReadonlyMap<string, number> | Readonly<Record<string, number>>;

export interface AnalysisContext {
  /** levelId → elevation (m). A restraint with a levelId takes its elevation from here when present. */
  levels?: LevelElevations;
  /** A building's own sections, by designation. */
  sections?: ReadonlyMap<string, SectionDims>;
  /**
   * The caller has already parsed the document with stackDocumentSchema (the server does on every
   * read and write), so its shape need not be checked again; its meaning always is.
   */
  shapeChecked?: boolean;
  /**
   * For a stack on the building's grid: what each level's floor brings into it, by level id
   * (engine/building/stackFloorLoads). Restraints and the cap on those levels take these loads.
   */
  floorLoads?: ReadonlyMap<string, DerivedLevelLoad>;
}

/** Elevations closer than this (m) are the same elevation. */
export const SAME_ELEVATION_M = 1e-6;

export function levelElevation(levels: LevelElevations | undefined, levelId: string): number | undefined {
  if (!levels) return undefined;
  if (levels instanceof Map) return levels.get(levelId);
  const record = levels as Readonly<Record<string, number>>;
  return Object.hasOwn(record, levelId) ? record[levelId] : undefined;
}

export function allLevelElevations(levels: LevelElevations | undefined): number[] {
  if (!levels) return [];
  return levels instanceof Map ? [...levels.values()] : Object.values(levels as Readonly<Record<string, number>>);
}
