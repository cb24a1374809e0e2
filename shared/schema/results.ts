// Result shapes produced by the engine (docs/contracts.md §Analysis options and results) and carried by the API, the
// live channel and the calculation package. They are computed by our own code, so they are plain types, not zod
// schemas.
import { z } from 'zod';
import { concreteClassSchema } from './stack.ts';
import type { PositionResult } from './stackPositions.ts';

export const analysisOptionsSchema = z
  .object({
    combination: z.enum(['6.10', '6.10ab']),
    annex: z.enum(['UK', 'EN']),
    imposedReduction: z.boolean(),
    selfWeight: z.boolean(),
    /** Nominal moments of simple construction and the combined check; absent means on (older stored options). */
    nominalMoments: z.boolean().optional(),
    /** Where buckling lengths come from; absent means 'factors' (the table of factors per segment). */
    bucklingLengths: z.enum(['factors', 'critical']).optional(),
    /** EN 1991-1-7 Annex A Table A.1; absent means not given (the tying check then says so). */
    consequenceClass: z.enum(['1', '2a', '2b', '3']).optional(),
    /** Concrete of the foundations under the base plates (EN 1992-1-1 Table 3.1); absent means not given. */
    concreteClass: concreteClassSchema.optional(),
  })
  .strict();
export type AnalysisOptions = z.infer<typeof analysisOptionsSchema>;
export type Annex = AnalysisOptions['annex'];
export type ConsequenceClass = NonNullable<AnalysisOptions['consequenceClass']>;

export const DEFAULT_ANALYSIS_OPTIONS: AnalysisOptions = {
  combination: '6.10ab',
  annex: 'UK',
  imposedReduction: true,
  selfWeight: true,
};

export type BucklingCurve = 'a0' | 'a' | 'b' | 'c' | 'd';
export type SectionClass = 1 | 2 | 3 | 4;
/** Terms of the axial check (docs/analysis-rules.md §Pieces). */
export type AxialMode = 'cross-section' | 'flexural-y' | 'flexural-z';
/** 'combined': the simple-construction interaction with nominal moments governs. */
export type GoverningMode = AxialMode | 'combined';

/** One line of working: what the UI and the PDF print, in the engine's own units. */
export interface CalcStep {
  symbol: string;
  value: number | string;
  unit: string;
  /** Clause, table or equation reference, e.g. "EN 1993-1-1 eq. 6.49". */
  clause: string;
  description?: string;
}

/** checkCompression result: N, mm, N/mm² (docs/analysis-rules.md §Member check). */
export interface CompressionResult {
  fy: number;
  epsilon: number;
  sectionClass: SectionClass;
  /** Element that sets the class, e.g. "flange outstand", "web", "wall", "tube". */
  classGoverningElement: string;
  A: number;
  Aeff: number;
  NcRd: number;
  NcrY: number;
  NcrZ: number;
  lambdaBarY: number;
  lambdaBarZ: number;
  curveY: BucklingCurve;
  curveZ: BucklingCurve;
  chiY: number;
  chiZ: number;
  NbRdY: number;
  NbRdZ: number;
  NbRd: number;
  utilisation: number;
  governing: AxialMode;
  steps: CalcStep[];
}

/**
 * Combined check of a column in simple construction (N, mm): NEd/Nb,min,Rd + My,Ed/Mb,Rd + 1.5·Mz,Ed/Mz,Rd ≤ 1
 * with the nominal moments from eccentric beam reactions (see shared/engine/simple).
 */
export interface CombinedCheck {
  NEdY: number;
  NEdZ: number;
  /** Nominal moments at the end of the column length between floors, N·mm. */
  MyEd: number;
  MzEd: number;
  NbRdY: number;
  NbRdZ: number;
  lambdaBarLT: number;
  chiLT: number;
  MbRd: number;
  MzRd: number;
  /** The three terms of the interaction. */
  axialTerm: number;
  majorTerm: number;
  minorTerm: number;
  utilisation: number;
  /** The expression of EN 1990 6.4.3.2 that governs, e.g. "6.10b"; NEd and the reactions both come from it.
   *  Absent in results stored before the check was made per combination. */
  combination?: string;
  steps: CalcStep[];
}

export interface Issue {
  nodeId?: string;
  /** Set when the problem is an edge (a dangling or disallowed connection). */
  edgeId?: string;
  message: string;
}

/** validateStack: errors stop the analysis; warnings accompany the results. */
export interface StackValidation {
  errors: Issue[];
  warnings: Issue[];
}

/** One piece of a lift between consecutive cut elevations (m, kN). */
export interface PieceCheck {
  from: number;
  to: number;
  NEd: number;
  NEdY: number;
  NEdZ: number;
  LcrY: number;
  LcrZ: number;
  kY: number;
  kZ: number;
  /** max(NEd/Nc,Rd, NEd,y/Nb,y,Rd, NEd,z/Nb,z,Rd) (docs/analysis-rules.md §Pieces). */
  utilisation: number;
  /** The term of `utilisation` that is largest. */
  governing: GoverningMode;
  /** The member check run with the larger of NEdY and NEdZ (N, mm), so its buckling terms are not
   *  relaxed by 6.3.1.2(4) for a force smaller than the one they are checked against. */
  check: CompressionResult;
  /** Present when nominal moments act on this piece: the simple-construction combined check (N, mm). */
  combined?: CombinedCheck;
  /** The axial utilisation above, kept when `combined` raises `utilisation`. */
  axialUtilisation?: number;
  /** Present when LcrY/LcrZ came from the critical buckling analysis: the tabulated factor beside it. */
  tableKY?: number;
  tableKZ?: number;
}

export interface LiftResult {
  liftId: string;
  /** L1, L2, … counted from the bottom of the stack: how engineers name lifts. Absent in results stored before it existed. */
  label?: string;
  bottom: number;
  top: number;
  section: string;
  grade: string;
  utilisation: number;
  governing: GoverningMode;
  pieces: PieceCheck[];
}

/** Load take-down at each point where load enters the column (m, kN), top to bottom. */
export interface TakeDownRow {
  nodeId: string;
  elevation: number;
  /** Characteristic loads entering here (including load nodes attached here). */
  Gk: number;
  Qk: number;
  category: string;
  /** Totals just below this point, before self-weight of the column below. */
  sumGk: number;
  sumQkByCategory: Record<string, number>;
  /** Design axial force just below this point, with the combination that governs. */
  NEd: number;
  combination: string;
  /** Storeys above carrying imposed load of the leading category (of any category when none leads), and the
   *  αn applied to the leading action (EN 1991-1-1 6.3.1.2(11)); null when no variable action leads (6.10a),
   *  so none is reduced. Absent in results stored before they were reported. */
  n?: number;
  alphaN?: number | null;
}

/** Lowest load factor of the stack about one axis and its buckled shape (critical buckling analysis). */
export interface CriticalAxis {
  alphaCr: number;
  /** Lateral displacement (largest 1) at node elevations (m), bottom to top. */
  shape?: { elevations: number[]; displacements: number[] };
}

/** Loads a level's floor brought into a restraint or the cap of a stack on the grid (m², kN). */
export interface FloorLoadUse {
  nodeId: string;
  levelId: string;
  area: number;
  gridArea: number;
  Gk: number;
  Qk: number;
  category: string;
  faces: Partial<Record<'yPlus' | 'yMinus' | 'zPlus' | 'zMinus', { Gk: number; Qk: number }>>;
  /** Line loads within Gk and Qk. */
  lineGk: number;
  lineQk: number;
  overrideReason?: string;
  /** The node keeps loads set by hand; the figures above are what the floor would give. */
  byHand: boolean;
}

export interface StackResult {
  errors: Issue[];
  warnings: Issue[];
  lifts: LiftResult[];
  governingLiftId: string | null;
  takeDown: TakeDownRow[];
  /** With `bucklingLengths: 'critical'`: the lowest load factor per axis on the design forces. */
  criticalBuckling?: { y: CriticalAxis; z: CriticalAxis };
  /** The rules that produced these results (ENGINE_VERSION), set by the server when it stores them; absent in
   *  results stored before it was recorded. */
  engineVersion?: string;
  /** Present for a stack on the building's grid: the loads derived from the floors (docs/building-model.md). */
  floorLoads?: FloorLoadUse[];
  /** Splice checks, bottom to top (shared/engine/connections). Absent in results stored before they existed. */
  splices?: SpliceCheck[];
  /** Base plate check at the support. */
  base?: BaseCheck;
  /**
   * A typical column (docs/typical-columns.md): the same design checked at each position it stands at, its
   * own place first. The rest of these results are those of its own place. Absent for a stack at one place.
   */
  positions?: PositionResult[];
  /** The name of the position whose check governs, with `positions`. */
  governingPosition?: string;
}

/** 'not-given': the engineer has not given the detail (or the building the class) the check needs. */
export type ConnectionStatus = 'passes' | 'fails' | 'not-given';

/** One splice: the fit of the sections either side and its tension check (kN, mm). */
export interface SpliceCheck {
  nodeId: string;
  elevation: number;
  above: string;
  below: string;
  /** Null when a section is not an I section (the fit rules here are for I sections). */
  sameSerialSize: boolean | null;
  /** Pack under each flange cover plate on the upper column (mm), 0 when none. */
  packThickness: number;
  divisionPlate: boolean;
  fit: string;
  /** Design compression in the joint, its least value under permanent load alone (kN; compression positive). */
  NEd: number;
  NminEd: number;
  /** EN 1991-1-7 A.6 vertical tie force (kN); null when the class does not ask for it or is not given. */
  tieForce: number | null;
  /** Tension the splice must carry (kN). */
  tension: number;
  /** Resistance of the given detail to tension (kN); null when no detail is given. */
  NtRd: number | null;
  utilisation: number | null;
  status: ConnectionStatus;
  /** Whether the splice meets the tying requirement: null when the class is not given or asks for no ties. */
  meetsTie: boolean | null;
  notes: string[];
  steps: CalcStep[];
}

/** The base plate by the effective-area method (EN 1993-1-8 6.2.5), kN and mm. */
export interface BaseCheck {
  nodeId: string;
  elevation: number;
  NEd: number;
  NminEd: number;
  /** Some combination puts the base in tension: holding-down bolts must be designed for it. */
  tension: boolean;
  fjd: number | null;
  c: number | null;
  tRequired: number | null;
  NjRd: number | null;
  utilisation: number | null;
  status: ConnectionStatus;
  notes: string[];
  steps: CalcStep[];
}

export type StackStatus = 'passes' | 'fails' | 'errors';

/** One stack of the building overview (analyseBuilding). */
export interface BuildingStackResult<Id extends string | number = string | number> {
  id: Id;
  name: string;
  governingLiftId: string | null;
  /** Utilisation of the governing lift; null when the stack has errors. */
  utilisation: number | null;
  status: StackStatus;
  result: StackResult;
}

export interface BuildingResult<Id extends string | number = string | number> {
  stacks: BuildingStackResult<Id>[];
  /** The stack with the highest utilisation (first on a tie); null when no stack has results. */
  worstStackId: Id | null;
}
