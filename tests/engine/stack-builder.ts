// Builds stack documents for the engine tests from a short description (demo data, invented).
import type {
  Axes,
  Category,
  Fixity,
  Grade,
  SectionDims,
  StackDocument,
  StackEdge,
  StackNode,
} from '../../shared/schema/stack.ts';

export interface FloorSpec {
  elevation: number;
  Gk?: number;
  Qk?: number;
  category?: Category;
  axes?: Axes;
  fixity?: Fixity;
  levelId?: string;
  id?: string;
}

export interface LiftSpec {
  /** Elevation of the splice or cap above this lift. */
  top: number;
  section?: string | SectionDims;
  grade?: Grade;
  kY?: number;
  kZ?: number;
}

export interface StackSpec {
  base?: { elevation?: number; fixity?: Fixity };
  lifts: LiftSpec[];
  floors?: FloorSpec[];
  cap?: { fixity?: Fixity | 'free'; Gk?: number; Qk?: number; category?: Category };
  loads?: { on: string; label?: string; Gk?: number; Qk?: number; category?: Category }[];
}

/** UKC 254x254x73 dimensions, BS 4-1 (from memory: h 254.1, b 254.6, tw 8.6, tf 14.2, r 12.7). */
export const UKC_254_73: SectionDims = { shape: 'I', make: 'rolled', h: 254.1, b: 254.6, tw: 8.6, tf: 14.2, r: 12.7 };

/** Support s, lifts l1…, splices p1…, cap c, restraints r1… from the bottom; edges point upward. */
export function buildStack(spec: StackSpec): StackDocument {
  const nodes: StackNode[] = [];
  const edges: StackEdge[] = [];
  const connect = (source: string, target: string): void =>
    void edges.push({ id: `e${edges.length + 1}`, source, target });
  const baseElevation = spec.base?.elevation ?? 0;
  nodes.push({ id: 's', kind: 'support', data: { elevation: baseElevation, fixity: spec.base?.fixity ?? 'pinned' } });
  let below = 's';
  let bottom = baseElevation;
  const spans: { id: string; bottom: number; top: number }[] = [];
  spec.lifts.forEach((lift, i) => {
    const id = `l${i + 1}`;
    const data = { section: lift.section ?? UKC_254_73, grade: lift.grade ?? 'S355', kY: lift.kY, kZ: lift.kZ };
    if (data.kY === undefined) delete data.kY;
    if (data.kZ === undefined) delete data.kZ;
    nodes.push({ id, kind: 'lift', data });
    connect(below, id);
    const last = i === spec.lifts.length - 1;
    const above = last ? 'c' : `p${i + 1}`;
    if (last) {
      const cap = spec.cap ?? {};
      nodes.push({
        id: 'c',
        kind: 'cap',
        data: {
          elevation: lift.top,
          fixity: cap.fixity ?? 'pinned',
          Gk: cap.Gk ?? 0,
          Qk: cap.Qk ?? 0,
          category: cap.category ?? 'H',
        },
      });
    } else nodes.push({ id: above, kind: 'splice', data: { elevation: lift.top } });
    connect(id, above);
    spans.push({ id, bottom, top: lift.top });
    below = above;
    bottom = lift.top;
  });
  (spec.floors ?? []).forEach((floor, i) => {
    const id = floor.id ?? `r${i + 1}`;
    const data = {
      elevation: floor.elevation,
      axes: floor.axes ?? 'both',
      fixity: floor.fixity ?? 'pinned',
      Gk: floor.Gk ?? 0,
      Qk: floor.Qk ?? 0,
      category: floor.category ?? 'A',
      ...(floor.levelId ? { levelId: floor.levelId } : {}),
    };
    nodes.push({ id, kind: 'restraint', data });
    const span = spans.find((s) => floor.elevation >= s.bottom && floor.elevation <= s.top) ?? spans[0];
    connect(id, span.id);
  });
  (spec.loads ?? []).forEach((load, i) => {
    const id = `x${i + 1}`;
    nodes.push({
      id,
      kind: 'load',
      data: {
        label: load.label ?? `Load ${i + 1}`,
        Gk: load.Gk ?? 0,
        Qk: load.Qk ?? 0,
        category: load.category ?? 'A',
      },
    });
    connect(id, load.on);
  });
  return { nodes, edges };
}

/** The document with one node's data changed (for building invalid documents from a valid one). */
export function withNode(doc: StackDocument, id: string, change: (node: StackNode) => StackNode): StackDocument {
  return { nodes: doc.nodes.map((n) => (n.id === id ? change(n) : n)), edges: doc.edges };
}
