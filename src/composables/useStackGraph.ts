// The stored document ↔ Vue Flow: nodes and edges to draw, and the ops that the graph's gestures
// (connect, drag, tidy) turn into. The document never holds Vue Flow's own types.
import { computed, ref, toValue, type MaybeRefOrGetter } from 'vue';
import type { Edge, Node } from '@vue-flow/core';
import type { Op } from '@shared/schema/ops.ts';
import type { StackResult } from '@shared/schema/results.ts';
import type { PresenceUser } from '@shared/schema/socket.ts';
import type { Level } from '@shared/schema/api.ts';
import type { StackDocument, StackEdge, StackNode } from '@shared/schema/stack.ts';
import { moveRestraintOps, moveSpliceOps } from '@shared/ops/structuralEdits.ts';
import {
  COMPACT_LINE_PX,
  FULL_SCALE,
  PX_PER_METRE,
  layoutByElevation,
  type GraphScale,
  type XY,
} from '@/utils/layoutByElevation.ts';
import {
  HANDLE,
  LEVEL_LINE_X,
  colleagueColour,
  type Colleague,
  type LevelView,
  type NodeProblem,
  type NodeView,
} from '@/utils/nodeView.ts';
import { snapElevation } from '@/utils/snapElevation.ts';
import { drawingElevations, liftNumbers, liftSpans, nodeTitle, nodesById } from '@/utils/stackChain.ts';
import { newId } from '@/utils/clipboardOps.ts';

export interface StackGraphInput {
  doc: MaybeRefOrGetter<StackDocument | null>;
  results: MaybeRefOrGetter<StackResult | null>;
  selection: MaybeRefOrGetter<readonly string[]>;
  others: MaybeRefOrGetter<readonly PresenceUser[]>;
  readOnly: MaybeRefOrGetter<boolean>;
  /** The building's levels, drawn across the graph and snapped to when a node is dragged. */
  levels?: MaybeRefOrGetter<readonly Level[]>;
  scale?: MaybeRefOrGetter<GraphScale>;
}

/** Level names closer together than this (px on screen at zoom 1) would overlap: only every k-th is named. */
const LEVEL_LABEL_PX = 14;

function handlesFor(edge: StackEdge, byId: Map<string, StackNode>): { sourceHandle: string; targetHandle: string } {
  const source = byId.get(edge.source)?.kind;
  const target = byId.get(edge.target)?.kind;
  const fromSide = source === 'restraint' || source === 'load';
  return {
    sourceHandle: fromSide ? HANDLE.side : HANDLE.up,
    targetHandle:
      source === 'load' ? HANDLE.load : target === 'lift' && source === 'restraint' ? HANDLE.side : HANDLE.below,
  };
}

export function useStackGraph(input: StackGraphInput) {
  const scale = computed(() => toValue(input.scale) ?? FULL_SCALE);
  const levels = computed(() => toValue(input.levels) ?? []);
  const layout = computed(() => {
    const doc = toValue(input.doc);
    return doc ? layoutByElevation(doc, scale.value) : new Map<string, XY>();
  });
  const elevations = computed(() => {
    const doc = toValue(input.doc);
    return doc ? drawingElevations(doc) : new Map<string, number>();
  });

  /**
   * Where a node is drawn. Height always follows elevation (the graph stands at true elevation); the
   * stored position gives only the sideways place, and not in the compressed drawing, which lines the
   * chain up itself. A node with no elevation yet (not connected) is drawn where it was put.
   */
  function placeOf(n: StackNode): XY {
    const laid = layout.value.get(n.id) ?? { x: 0, y: 0 };
    if (!elevations.value.has(n.id)) return { ...(n.position ?? laid) };
    return { x: scale.value.compact ? laid.x : (n.position?.x ?? laid.x), y: laid.y };
  }

  function drawnAt(id: string): XY | undefined {
    const node = toValue(input.doc)?.nodes.find((n) => n.id === id);
    return node ? placeOf(node) : undefined;
  }

  const problems = computed(() => {
    const out = new Map<string, NodeProblem[]>();
    const res = toValue(input.results);
    const add = (severity: NodeProblem['severity']) => (i: { nodeId?: string; message: string }) => {
      if (i.nodeId) out.set(i.nodeId, [...(out.get(i.nodeId) ?? []), { severity, message: i.message }]);
    };
    res?.errors.forEach(add('error'));
    res?.warnings.forEach(add('warning'));
    return out;
  });

  const colleagues = computed(() => {
    const out = new Map<string, Colleague[]>();
    for (const u of toValue(input.others)) {
      for (const id of u.selection)
        out.set(id, [...(out.get(id) ?? []), { name: u.name, colour: colleagueColour(u.userId) }]);
    }
    return out;
  });

  /** The building's levels as lines across the graph, behind the stack, named at the left. */
  const levelNodes = computed<Node<LevelView>[]>(() => {
    const sorted = [...levels.value].sort((a, b) => a.elevation - b.elevation);
    let lastNamed = Infinity;
    return sorted.map((l) => {
      const y = Math.round(-l.elevation * scale.value.pxPerMetre);
      const labelled = lastNamed - y >= LEVEL_LABEL_PX;
      if (labelled) lastNamed = y;
      return {
        id: `level:${l.id}`,
        type: 'level',
        position: { x: LEVEL_LINE_X, y },
        draggable: false,
        selectable: false,
        connectable: false,
        focusable: false,
        zIndex: -1,
        class: 'stack-graph__level',
        data: { name: l.name, elevation: l.elevation, labelled, compact: scale.value.compact },
      };
    });
  });

  const nodes = computed<(Node<NodeView> | Node<LevelView>)[]>(() => [...levelNodes.value, ...stackNodes.value]);

  /** Bumped after a drag, so a node dragged where it cannot go is drawn back at its place. */
  const redraw = ref(0);
  const stackNodes = computed<Node<NodeView>[]>(() => {
    void redraw.value;
    const doc = toValue(input.doc);
    if (!doc) return [];
    const res = toValue(input.results);
    const selected = new Set(toValue(input.selection));
    const readOnly = toValue(input.readOnly);
    const numbers = liftNumbers(doc);
    const spans = liftSpans(doc);
    const lifts = new Map((res?.lifts ?? []).map((l) => [l.liftId, l]));
    // The analysis takes these nodes' loads from the floors (docs/building-model.md): the card shows those.
    const floors = new Map((res?.floorLoads ?? []).map((u) => [u.nodeId, u]));
    const shown = (n: (typeof doc.nodes)[number]) => {
      const use = floors.get(n.id);
      if (!use || use.byHand || (n.kind !== 'restraint' && n.kind !== 'cap')) return n.data;
      return { ...n.data, Gk: use.Gk, Qk: use.Qk, category: use.category as typeof n.data.category };
    };
    return doc.nodes.map((n) => ({
      id: n.id,
      type: n.kind,
      position: placeOf(n),
      selected: selected.has(n.id),
      draggable: !readOnly,
      connectable: !readOnly,
      data: {
        kind: n.kind,
        value: shown(n),
        title: nodeTitle(n, numbers),
        problems: problems.value.get(n.id) ?? [],
        utilisation: lifts.get(n.id)?.utilisation ?? null,
        governing: res?.governingLiftId === n.id,
        span: spans.get(n.id) ?? null,
        others: colleagues.value.get(n.id) ?? [],
        readOnly,
        compact: scale.value.compact,
        ...(floors.has(n.id) ? { loadsFrom: floors.get(n.id)!.byHand ? ('hand' as const) : ('floor' as const) } : {}),
      } satisfies NodeView,
    }));
  });

  const edges = computed<Edge[]>(() => {
    const doc = toValue(input.doc);
    if (!doc) return [];
    const byId = nodesById(doc);
    const bad = new Set((toValue(input.results)?.errors ?? []).map((i) => i.edgeId).filter(Boolean));
    return doc.edges.map((e) => ({
      id: e.id,
      source: e.source,
      target: e.target,
      ...handlesFor(e, byId),
      type: byId.get(e.source)?.kind === 'restraint' || byId.get(e.source)?.kind === 'load' ? 'smoothstep' : 'straight',
      class: bad.has(e.id) ? 'stack-edge--invalid' : undefined,
      deletable: !toValue(input.readOnly),
    }));
  });

  /** addEdge for a connection the rules allowed. */
  function connectOp(source: string, target: string): Op[] {
    const doc = toValue(input.doc);
    if (!doc) return [];
    const taken = new Set(doc.edges.map((e) => e.id).concat(doc.nodes.map((n) => n.id)));
    return [{ op: 'addEdge', edge: { id: newId('edge', taken), source, target } }];
  }

  /** moveNode for each dragged node that ended somewhere new (rounded to whole pixels). */
  function moveOps(moved: readonly { id: string; position: XY }[]): Op[] {
    return moved.flatMap(({ id, position }): Op[] => {
      const at = { x: Math.round(position.x), y: Math.round(position.y) };
      const was = drawnAt(id);
      return was && was.x === at.x && was.y === at.y ? [] : [{ op: 'moveNode', id, position: at }];
    });
  }

  /**
   * The edit a drag makes. Sideways, a node keeps its new place (moveNode). Up or down, a splice or a
   * restraint not tied to a level takes the elevation it was dropped at (snapped to a level or to `offset`
   * above one); every other node's height is its elevation, so it goes back to it. Throws
   * StructuralEditError when the new elevation does not fit (a splice past the next one).
   */
  function dragOps(moved: readonly { id: string; position: XY }[], offset: number): Op[] {
    const doc = toValue(input.doc);
    if (!doc) return [];
    const taken = new Set(doc.edges.map((e) => e.id).concat(doc.nodes.map((n) => n.id)));
    const make = (prefix: 'lift' | 'splice' | 'restraint' | 'edge') => newId(prefix, taken);
    const ops: Op[] = [];
    try {
      for (const { id, position } of moved) {
        const node = doc.nodes.find((n) => n.id === id);
        const was = drawnAt(id);
        if (!node || !was) continue;
        const x = scale.value.compact ? (node.position?.x ?? was.x) : Math.round(position.x);
        const vertical = node.kind === 'splice' || (node.kind === 'restraint' && !node.data.levelId);
        const dropped = -(position.y + (scale.value.compact ? COMPACT_LINE_PX / 2 : 0)) / scale.value.pxPerMetre;
        const z = vertical ? snapElevation(dropped, levels.value, offset) : null;
        let y = was.y;
        if (
          z !== null &&
          (node.kind === 'splice' || node.kind === 'restraint') &&
          Math.abs(z - node.data.elevation) >= 0.001
        ) {
          ops.push(...(node.kind === 'splice' ? moveSpliceOps(doc, id, z, make) : moveRestraintOps(doc, id, z, make)));
          y = Math.round(-z * PX_PER_METRE);
        }
        if (x !== node.position?.x || (node.position && y !== node.position.y))
          ops.push({ op: 'moveNode', id, position: { x, y } });
      }
    } finally {
      redraw.value++;
    }
    return ops;
  }

  /** moveNode for every node whose stored position differs from its place by elevation ("tidy"). */
  function tidyOps(): Op[] {
    const doc = toValue(input.doc);
    if (!doc) return [];
    const target = layoutByElevation(doc);
    return doc.nodes.flatMap((n): Op[] => {
      const at = target.get(n.id);
      // Nodes without a stored position are already drawn by elevation and keep following it.
      if (!at || !n.position || (n.position.x === at.x && n.position.y === at.y)) return [];
      return [{ op: 'moveNode', id: n.id, position: at }];
    });
  }

  return { nodes, edges, drawnAt, connectOp, moveOps, dragOps, tidyOps };
}
