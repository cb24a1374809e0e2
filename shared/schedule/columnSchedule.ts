// The column schedule of a building (docs/column-schedule.md): one row per lift of every stack, named by the
// building's levels, with the steel mass of each lift and the tonnage by level and by series and grade. Built
// from the stored documents and results only: nothing is recomputed except each section's mass per metre,
// which comes from the engine's own section properties (the same figure the self-weight uses).
import { findSection } from '../catalogue/index.ts';
import { isLiftSection, resolveLiftSection } from '../engine/stack/liftSections.ts';
import { SAFETY_NOTE } from '../safety.ts';
import type { StackResult } from '../schema/results.ts';
import type { SectionDims, StackDocument } from '../schema/stack.ts';

export interface ScheduleStackInput {
  id: number;
  name: string;
  version: number;
  doc: StackDocument;
  results: StackResult;
}

export interface ScheduleLevel {
  name: string;
  /** m */
  elevation: number;
}

export interface ScheduleRow {
  stackId: number;
  stack: string;
  /** Stacks with the same lifts (ends to the millimetre, sections, grades) and base share a type: T1, T2, … */
  type: string;
  lift: string;
  /** Level (or level + offset) at the bottom and the top of the lift. */
  fromLevel: string;
  toLevel: string;
  /** m */
  bottom: number;
  top: number;
  length: number;
  section: string;
  series: string;
  grade: string;
  /** How the lift starts: 'base' with the support's fixity, or 'splice'. */
  bottomJoint: string;
  /** The stack's splice levels, in words (the same on every row of a stack). */
  splices: string;
  baseFixity: string;
  utilisation: number;
  governing: string;
  status: 'passes' | 'fails';
  /** kg/m and kg */
  massPerMetre: number;
  mass: number;
}

/** A stack the schedule cannot list: its results have errors, so its lifts and their lengths are not known. */
export interface ScheduleGap {
  stackId: number;
  stack: string;
  reason: string;
}

export interface Tonnage {
  /** kg */
  total: number;
  /** Column steel between a level and the next one up (below the lowest level counts with the lowest). */
  byLevel: { level: string; mass: number }[];
  bySeriesGrade: { series: string; grade: string; mass: number }[];
}

/** A column type and the stacks built to it, so typical columns are drawn and fabricated once. */
export interface ColumnType {
  type: string;
  stacks: string[];
}

export interface ColumnSchedule {
  rows: ScheduleRow[];
  types: ColumnType[];
  gaps: ScheduleGap[];
  tonnage: Tonnage;
  note: string;
}

/**
 * A typical column (docs/typical-columns.md) is built once per position: each position is a stack of the
 * schedule under its crossing's name, with the same lifts (so the same type) and its own utilisations.
 * A position the design cannot be checked at is carried as results with its errors.
 */
function atEachPosition(stack: ScheduleStackInput): ScheduleStackInput[] {
  const { positions } = stack.results;
  if (!positions?.length) return [stack];
  return positions.map((p) => {
    const own = new Map(p.lifts.map((l) => [l.liftId, l]));
    const results: StackResult = {
      ...stack.results,
      errors: p.errors.length ? p.errors.map((message) => ({ message })) : stack.results.errors,
      lifts: stack.results.lifts.map((l) => {
        const at = own.get(l.liftId);
        return at ? { ...l, utilisation: at.utilisation, governing: at.governing as typeof l.governing } : l;
      }),
    };
    return { ...stack, name: p.positionId === null ? stack.name : p.name, results };
  });
}

/** Elevations closer than this are the same level (m): stored elevations are typed to the millimetre. */
const SAME_LEVEL_M = 0.0005;

const byName = (a: { name: string; id: number }, b: { name: string; id: number }) =>
  a.name.localeCompare(b.name, 'en', { numeric: true, sensitivity: 'base' }) || a.id - b.id;

/** "Level 2", or "Level 2 + 0.600 m" for a point between levels, or the bare elevation below every level. */
export function describeElevation(elevation: number, levels: readonly ScheduleLevel[]): string {
  let below: ScheduleLevel | undefined;
  for (const l of levels) if (l.elevation <= elevation + SAME_LEVEL_M) below = l;
  if (!below) return `${elevation.toFixed(3)} m`;
  const offset = elevation - below.elevation;
  return Math.abs(offset) <= SAME_LEVEL_M ? below.name : `${below.name} + ${offset.toFixed(3)} m`;
}

function seriesOf(designation: string, dims: SectionDims, own: boolean): string {
  const entry = own ? undefined : findSection(designation);
  return entry ? entry.series : `own ${dims.shape}`;
}

/** Length of [from, to] that lies in each level's band; the bands cover the whole line, so the parts sum to to − from. */
function splitByLevel(from: number, to: number, levels: readonly ScheduleLevel[]): number[] {
  return levels.map((l, i) => {
    const low = i === 0 ? -Infinity : l.elevation;
    const high = i === levels.length - 1 ? Infinity : levels[i + 1]!.elevation;
    return Math.max(0, Math.min(to, high) - Math.max(from, low));
  });
}

/** What makes two stacks the same column for the drawing office: every lift's ends, section and grade, and the base. */
const signature = (rows: readonly ScheduleRow[]): string =>
  rows.map((r) => `${r.bottom.toFixed(3)}|${r.top.toFixed(3)}|${r.section}|${r.grade}|${r.baseFixity}`).join(';');

/** Numbers the types in schedule order and marks each row with its stack's type. */
function groupTypes(rows: ScheduleRow[]): ColumnType[] {
  // By stack and name: the positions of a typical column share a stack id.
  const byStack = new Map<string, ScheduleRow[]>();
  for (const r of rows) {
    const key = `${r.stackId}\u0000${r.stack}`;
    byStack.set(key, [...(byStack.get(key) ?? []), r]);
  }
  const types = new Map<string, ColumnType>();
  for (const stackRows of byStack.values()) {
    const key = signature(stackRows);
    const type = types.get(key) ?? { type: `T${types.size + 1}`, stacks: [] };
    type.stacks.push(stackRows[0]!.stack);
    types.set(key, type);
    for (const r of stackRows) r.type = type.type;
  }
  return [...types.values()];
}

export function buildColumnSchedule(
  stacks: readonly ScheduleStackInput[],
  levelsIn: readonly ScheduleLevel[],
  sections?: ReadonlyMap<string, SectionDims>,
): ColumnSchedule {
  const levels = [...levelsIn].sort((a, b) => a.elevation - b.elevation);
  const rows: ScheduleRow[] = [];
  const gaps: ScheduleGap[] = [];
  const levelMass = levels.map(() => 0);
  const seriesGrade = new Map<string, { series: string; grade: string; mass: number }>();
  let total = 0;

  for (const stack of stacks.flatMap(atEachPosition).sort(byName)) {
    const { doc, results } = stack;
    if (results.errors.length > 0 || results.lifts.length === 0) {
      const reason = results.errors.map((e) => e.message).join('; ') || 'The stack has no lifts';
      gaps.push({ stackId: stack.id, stack: stack.name, reason });
      continue;
    }
    const support = doc.nodes.find((n) => n.kind === 'support');
    const baseFixity = support?.kind === 'support' ? support.data.fixity : '';
    const spliceElevations = results.lifts.slice(1).map((l) => l.bottom);
    const splices = spliceElevations.map((e) => describeElevation(e, levels)).join('; ') || 'none';
    const lifts = [...results.lifts].sort((a, b) => a.bottom - b.bottom);

    for (const [index, lift] of lifts.entries()) {
      const node = doc.nodes.find((n) => n.id === lift.liftId);
      if (node?.kind !== 'lift') {
        gaps.push({
          stackId: stack.id,
          stack: stack.name,
          reason: `Lift ${lift.label ?? lift.liftId} is not in the stored document`,
        });
        continue;
      }
      const label = lift.label ?? lift.liftId;
      const resolved = resolveLiftSection(node.data, label, lift.liftId, sections);
      if (!isLiftSection(resolved)) {
        gaps.push({ stackId: stack.id, stack: stack.name, reason: resolved.message });
        continue;
      }
      const own = typeof node.data.section !== 'string' || (sections?.has(node.data.section) ?? false);
      const series = seriesOf(resolved.designation, resolved.dims, own);
      const length = lift.top - lift.bottom;
      const mass = resolved.massPerMetre * length;
      rows.push({
        stackId: stack.id,
        stack: stack.name,
        type: '',
        lift: label,
        fromLevel: describeElevation(lift.bottom, levels),
        toLevel: describeElevation(lift.top, levels),
        bottom: lift.bottom,
        top: lift.top,
        length,
        section: lift.section,
        series,
        grade: lift.grade,
        bottomJoint: index === 0 ? 'base' : 'splice',
        splices,
        baseFixity: index === 0 ? baseFixity : '',
        utilisation: lift.utilisation,
        governing: lift.governing,
        // EN 1993-1-1 6.3.1.1(1): NEd / Nb,Rd ≤ 1.0
        status: lift.utilisation <= 1 ? 'passes' : 'fails',
        massPerMetre: resolved.massPerMetre,
        mass,
      });
      total += mass;
      const key = `${series}\u0000${lift.grade}`;
      const group = seriesGrade.get(key) ?? { series, grade: lift.grade, mass: 0 };
      group.mass += mass;
      seriesGrade.set(key, group);
      splitByLevel(lift.bottom, lift.top, levels).forEach((part, i) => (levelMass[i]! += part * resolved.massPerMetre));
    }
  }

  const byLevel =
    levels.length > 0
      ? levels.map((l, i) => ({ level: l.name, mass: levelMass[i]! }))
      : [{ level: '(no levels)', mass: total }];
  const bySeriesGrade = [...seriesGrade.values()].sort(
    (a, b) => a.series.localeCompare(b.series) || a.grade.localeCompare(b.grade),
  );
  const types = groupTypes(rows);
  return { rows, types, gaps, tonnage: { total, byLevel, bySeriesGrade }, note: SAFETY_NOTE };
}
