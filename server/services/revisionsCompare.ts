// Comparing two states of a building (two revisions, or a revision and the current state): stacks and
// nodes added, removed and changed, and the change of utilisation of every lift.
import type { Knex } from 'knex';
import type { Level } from '../../shared/schema/api.ts';
import { formatElevation } from '../../shared/engine/index.ts';
import type { AnalysisOptions } from '../../shared/schema/results.ts';
import type {
  CompareQuery,
  FieldChange,
  FieldValue,
  LiftUtilisationChange,
  NodeChange,
  RevisionComparison,
  SnapshotStack,
  StackComparison,
} from '../../shared/schema/revisions.ts';
import type { StackNode } from '../../shared/schema/stack.ts';
import { notFound } from '../errors.ts';
import { getBuildingOptions } from './buildings.ts';
import { listLevels } from './levels.ts';
import { loadSnapshot } from './revisions.ts';
import { byStackName, snapshotStacks } from './snapshot.ts';

interface BuildingState {
  id: number | null;
  code: string;
  stacks: SnapshotStack[];
  levels: Level[];
  options: AnalysisOptions;
}

/** Utilisations closer than this print the same to three decimals and are not reported as changed. */
const UTILISATION_TOLERANCE = 5e-4;

const asValue = (v: unknown): FieldValue =>
  v === undefined ? null : typeof v === 'string' || typeof v === 'number' ? v : JSON.stringify(v);

function fieldChanges(before: Record<string, unknown>, after: Record<string, unknown>): FieldChange[] {
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort();
  return keys
    .map((field) => ({ field, from: asValue(before[field]), to: asValue(after[field]) }))
    .filter((c) => c.from !== c.to);
}

/** L1, L2, … by lift id, from the results of both states (the later one wins). */
type LiftLabels = ReadonlyMap<string, string>;

function liftLabels(...states: (SnapshotStack | undefined)[]): LiftLabels {
  return new Map(states.flatMap((s) => s?.results.lifts ?? []).map((l) => [l.liftId, l.label ?? l.liftId]));
}

function nodeLabel(n: StackNode, lifts: LiftLabels): string {
  switch (n.kind) {
    case 'lift':
      return `Lift ${lifts.get(n.id) ?? n.id}`;
    case 'load':
      return `Load "${n.data.label || n.id}"`;
    case 'support':
      return `Support at ${formatElevation(n.data.elevation)}`;
    case 'cap':
      return `Cap at ${formatElevation(n.data.elevation)}`;
    case 'splice':
      return `Splice at ${formatElevation(n.data.elevation)}`;
    case 'restraint':
      return `Restraint at ${formatElevation(n.data.elevation)}`;
  }
}

function compareNodes(before: StackNode[], after: StackNode[], lifts: LiftLabels): NodeChange[] {
  const old = new Map(before.map((n) => [n.id, n]));
  const next = new Map(after.map((n) => [n.id, n]));
  const changes: NodeChange[] = [];
  for (const n of before)
    if (!next.has(n.id))
      changes.push({ nodeId: n.id, kind: n.kind, label: nodeLabel(n, lifts), change: 'removed', fields: [] });
  for (const n of after) {
    const o = old.get(n.id);
    if (!o) {
      changes.push({ nodeId: n.id, kind: n.kind, label: nodeLabel(n, lifts), change: 'added', fields: [] });
      continue;
    }
    const fields = fieldChanges({ kind: o.kind, ...o.data }, { kind: n.kind, ...n.data });
    if (fields.length > 0)
      changes.push({ nodeId: n.id, kind: n.kind, label: nodeLabel(n, lifts), change: 'changed', fields });
  }
  return changes;
}

function compareLifts(
  before: SnapshotStack | undefined,
  after: SnapshotStack | undefined,
  labels: LiftLabels,
): LiftUtilisationChange[] {
  const old = new Map((before?.results.lifts ?? []).map((l) => [l.liftId, l]));
  const next = new Map((after?.results.lifts ?? []).map((l) => [l.liftId, l]));
  const ids = [...new Set([...old.keys(), ...next.keys()])];
  return ids
    .map((liftId) => {
      const o = old.get(liftId);
      const n = next.get(liftId);
      return {
        liftId,
        label: labels.get(liftId) ?? liftId,
        section: { from: o?.section ?? null, to: n?.section ?? null },
        from: o?.utilisation ?? null,
        to: n?.utilisation ?? null,
      };
    })
    .filter(
      (c) =>
        c.section.from !== c.section.to ||
        c.from === null ||
        c.to === null ||
        Math.abs(c.from - c.to) > UTILISATION_TOLERANCE,
    );
}

export function compareStates(from: BuildingState, to: BuildingState): RevisionComparison {
  const old = new Map(from.stacks.map((s) => [s.id, s]));
  const next = new Map(to.stacks.map((s) => [s.id, s]));
  const stacks: StackComparison[] = [];
  let unchangedStacks = 0;
  const all = [...to.stacks, ...from.stacks.filter((s) => !next.has(s.id))].sort(byStackName);
  for (const s of all) {
    const o = old.get(s.id);
    const n = next.get(s.id);
    const labels = liftLabels(o, n);
    const nodes = compareNodes(o?.doc.nodes ?? [], n?.doc.nodes ?? [], labels);
    const lifts = compareLifts(o, n, labels);
    const change = !o
      ? 'added'
      : !n
        ? 'removed'
        : nodes.length > 0 || lifts.length > 0 || o.name !== n.name
          ? 'changed'
          : null;
    if (change) stacks.push({ stackId: s.id, name: s.name, change, nodes: change === 'changed' ? nodes : [], lifts });
    else unchangedStacks += 1;
  }
  // Level names are unique in a building, so the name alone identifies a level to a person.
  const levelMap = (levels: Level[]) => Object.fromEntries(levels.map((l) => [l.name, l.elevation]));
  return {
    from: { id: from.id ?? 0, code: from.code },
    to: { id: to.id, code: to.code },
    stacks,
    unchangedStacks,
    levels: fieldChanges(levelMap(from.levels), levelMap(to.levels)),
    options: fieldChanges(from.options, to.options),
  };
}

async function revisionState(db: Knex, buildingId: number, id: number): Promise<BuildingState> {
  const { snapshot } = await loadSnapshot(db, id);
  if (snapshot.building.id !== buildingId) throw notFound('Revision');
  return { id, code: snapshot.code, stacks: snapshot.stacks, levels: snapshot.levels, options: snapshot.options };
}

async function currentState(db: Knex, buildingId: number): Promise<BuildingState> {
  const [stacks, levels, options] = await Promise.all([
    snapshotStacks(db, buildingId),
    listLevels(db, buildingId),
    getBuildingOptions(db, buildingId),
  ]);
  return { id: null, code: 'current', stacks, levels, options };
}

export async function compareRevisions(db: Knex, buildingId: number, q: CompareQuery): Promise<RevisionComparison> {
  const from = await revisionState(db, buildingId, q.from);
  const to = q.to === 'current' ? await currentState(db, buildingId) : await revisionState(db, buildingId, q.to);
  return compareStates(from, to);
}
