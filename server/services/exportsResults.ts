// Results as rows for download (docs/contracts.md §Imports): one row per lift, its governing piece's figures in kN
// and m, read from the stored results of each stack's current version (never recomputed here). A typical column
// (docs/typical-columns.md) lists one set of rows per position, named in the `position` column, own place first.
import type { Knex } from 'knex';
import { connectionRows } from '../../shared/connectionRows.ts';
import type { LiftResult, PieceCheck, StackResult } from '../../shared/schema/results.ts';
import type { PositionResult } from '../../shared/schema/stackPositions.ts';
import { loadStackRow, parseResults, stackRowsWithResults, type StackRow } from './stackRows.ts';

/** README §Safety: every copy of the results carries this. */
export { SAFETY_NOTE as RESULTS_NOTE } from '../../shared/safety.ts';

/** Header of each column, with its unit. */
export const RESULT_COLUMNS = [
  'stack',
  'version',
  'lift',
  'bottom_m',
  'top_m',
  'section',
  'grade',
  'section_class',
  'NEd_kN',
  'Lcr_y_m',
  'Lcr_z_m',
  'Nc_Rd_kN',
  'Nb_y_Rd_kN',
  'Nb_z_Rd_kN',
  'utilisation',
  'governing_check',
  'status',
  'governing_lift',
  'note',
  // Splice and base rows (docs/splices-and-bases.md): the tension to carry and the detail's resistance
  'tension_kN',
  'resistance_kN',
] as const;
/** The columns of a table with typical columns in it: which position each row is of, after the stack. */
export const POSITION_RESULT_COLUMNS = ['stack', 'position', ...RESULT_COLUMNS.slice(1)] as const;
export type ResultColumn = (typeof POSITION_RESULT_COLUMNS)[number];
export type ResultRow = Partial<Record<ResultColumn, string | number>>;

/** A table of stacks at one place each keeps the columns it always had; one with a typical column names positions. */
export const columnsOf = (rows: readonly ResultRow[]): readonly ResultColumn[] =>
  rows.some((r) => r.position !== undefined) ? POSITION_RESULT_COLUMNS : RESULT_COLUMNS;

const round = (n: number, places: number): number => Number(n.toFixed(places));
const kN = (newtons: number): number => round(newtons / 1000, 2);

/** The piece that sets the lift's utilisation (the lowest one on a tie). */
const governingPiece = (lift: LiftResult): PieceCheck | undefined =>
  lift.pieces.reduce<PieceCheck | undefined>(
    (worst, p) => (!worst || p.utilisation > worst.utilisation ? p : worst),
    undefined,
  );

export function stackResultRows(row: StackRow): ResultRow[] {
  const results = parseResults(row);
  const base = { stack: row.name, version: row.version };
  const own = ownPlaceRows(results, base);
  const [ownCheck, ...further] = results.positions ?? [];
  if (!ownCheck) return own;
  const governs = (p: PositionResult) => p.name === results.governingPosition;
  return [
    ...own.map((r) => ({
      ...r,
      position: `${ownCheck.name} (own place)`,
      ...(governs(ownCheck) && r.governing_lift === 'yes' ? { note: withNote(r.note, GOVERNS) } : {}),
    })),
    ...further.flatMap((p) => positionRows(results, p, base, governs(p))),
  ];
}

const GOVERNS = 'governs the type';
const withNote = (...notes: (string | number | undefined)[]) => notes.filter(Boolean).join('; ');

/**
 * A further position's rows, from its check as the results hold it (docs/typical-columns.md): per lift the
 * utilisation, governing check and the largest NEd in the lift at that position. Geometry, section and grade are
 * the design's, the same at every position; splices and the base are checked at the own place only.
 */
function positionRows(results: StackResult, p: PositionResult, base: ResultRow, governs: boolean): ResultRow[] {
  const at = { ...base, position: p.name };
  if (p.errors.length > 0 || p.lifts.length === 0)
    return [{ ...at, status: 'errors', note: p.errors.join('; ') || 'The stack has no lifts' }];
  const design = new Map(results.lifts.map((l) => [l.liftId, l]));
  return p.lifts.map((l) => {
    const lift = design.get(l.liftId);
    const governing = l.liftId === p.governingLiftId;
    return {
      ...at,
      lift: l.label,
      bottom_m: lift ? round(lift.bottom, 3) : undefined,
      top_m: lift ? round(lift.top, 3) : undefined,
      section: lift?.section,
      grade: lift?.grade,
      NEd_kN: round(l.NEd, 2),
      utilisation: round(l.utilisation, 3),
      governing_check: l.governing,
      // EN 1993-1-1 6.3.1.1(1): NEd / Nb,Rd ≤ 1.0
      status: l.utilisation <= 1 ? 'passes' : 'fails',
      governing_lift: governing ? 'yes' : 'no',
      note: withNote('NEd the largest in the lift', governs && governing ? GOVERNS : ''),
    };
  });
}

/** The rows of the stack's own place: every lift's governing piece, then its splices and base. */
function ownPlaceRows(results: StackResult, base: ResultRow): ResultRow[] {
  if (results.errors.length > 0) {
    return [{ ...base, status: 'errors', note: results.errors.map((e) => e.message).join('; ') }];
  }
  if (results.lifts.length === 0) return [{ ...base, status: 'errors', note: 'The stack has no lifts' }];
  return [...liftRows(results, base), ...connectionResultRows(results, base)];
}

/** One row per splice and one for the base, after the lifts; "not given" until the engineer gives a detail. */
function connectionResultRows(results: StackResult, base: ResultRow): ResultRow[] {
  const number = (text: string): number | undefined => (text === '–' || text === '' ? undefined : Number(text));
  const rows: ResultRow[] = [];
  for (const r of connectionRows(results)) {
    const splice = results.splices?.find((s) => s.nodeId === r.id);
    const check = splice ?? results.base;
    rows.push({
      ...base,
      lift: r.where,
      bottom_m: check ? round(check.elevation, 3) : undefined,
      section: splice ? `${splice.above} on ${splice.below}` : undefined,
      NEd_kN: check ? round(check.NEd, 2) : undefined,
      utilisation: check?.utilisation == null ? undefined : round(check.utilisation, 3),
      governing_check: splice ? 'splice tension' : 'base plate',
      status: r.status === 'not-given' ? 'not given' : r.status,
      note: [r.fit, ...r.notes].join('; '),
      tension_kN: splice ? round(splice.tension, 2) : number(r.tension),
      resistance_kN: splice
        ? splice.NtRd === null
          ? undefined
          : round(splice.NtRd, 2)
        : results.base?.NjRd == null
          ? undefined
          : round(results.base.NjRd, 2),
    });
  }
  return rows;
}

function liftRows(results: StackResult, base: ResultRow): ResultRow[] {
  return results.lifts.map((lift) => {
    const p = governingPiece(lift);
    const c = p?.check;
    return {
      ...base,
      lift: lift.label ?? lift.liftId,
      bottom_m: round(lift.bottom, 3),
      top_m: round(lift.top, 3),
      section: lift.section,
      grade: lift.grade,
      section_class: c?.sectionClass,
      NEd_kN: p ? round(Math.max(p.NEdY, p.NEdZ), 2) : undefined,
      Lcr_y_m: p ? round(p.LcrY, 3) : undefined,
      Lcr_z_m: p ? round(p.LcrZ, 3) : undefined,
      Nc_Rd_kN: c ? kN(c.NcRd) : undefined,
      Nb_y_Rd_kN: c ? kN(c.NbRdY) : undefined,
      Nb_z_Rd_kN: c ? kN(c.NbRdZ) : undefined,
      utilisation: round(lift.utilisation, 3),
      governing_check: lift.governing,
      // EN 1993-1-1 6.3.1.1(1): NEd / Nb,Rd ≤ 1.0
      status: lift.utilisation <= 1 ? 'passes' : 'fails',
      governing_lift: lift.liftId === results.governingLiftId ? 'yes' : 'no',
    };
  });
}

const byName = (a: StackRow, b: StackRow) =>
  a.name.localeCompare(b.name, 'en', { numeric: true, sensitivity: 'base' }) || a.id - b.id;

export async function stackResults(db: Knex, stackId: number): Promise<{ name: string; rows: ResultRow[] }> {
  const row = await loadStackRow(db, stackId);
  return { name: row.name, rows: stackResultRows(row) };
}

export async function buildingResults(db: Knex, buildingId: number): Promise<{ name: string; rows: ResultRow[] }> {
  const building = await db('buildings').where({ id: buildingId }).first<{ name: string }>('name');
  const stacks = await stackRowsWithResults(db).where({ building_id: buildingId });
  return { name: building.name, rows: stacks.sort(byName).flatMap(stackResultRows) };
}
