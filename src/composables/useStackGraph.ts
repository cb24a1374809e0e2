// The stored document ↔ Vue Flow: nodes and edges to draw, and the ops that the graph's gestures
// (connect, drag, tidy) turn into. The document never holds Vue Flow's own types.
import { computed, toValue, type MaybeRefOrGetter } from 'vue';
import type { Edge, Node } from '@vue-flow/core';
import type { Op } from '@shared/schema/ops.ts';
import type { StackResult } from '@shared/schema/results.ts';
import type { PresenceUser } from '@shared/schema/socket.ts';
import type { StackDocument, StackEdge, StackNode } from '@shared/schema/stack.ts';
import { layoutByElevation, type XY } from '@/components/graph/layoutByElevation.ts';
import { HANDLE, colleagueColour, type Colleague, type NodeProblem, type NodeView } from '@/components/graph/nodeView.ts';
import { liftNumbers, liftSpans, nodeTitle, nodesById } from './stackChain.ts';
import { newId } from './clipboardOps.ts';

export interface StackGraphInput {
  doc: MaybeRefOrGetter<StackDocument | null>;
  results: MaybeRefOrGetter<StackResult | null>;
  selection: MaybeRefOrGetter<readonly string[]>;
  others: MaybeRefOrGetter<readonly PresenceUser[]>;
  readOnly: MaybeRefOrGetter<boolean>;
}

function handlesFor(edge: StackEdge, byId: Map<string, StackNode>): { sourceHandle: string; targetHandle: string } {
  const source = byId.get(edge.source)?.kind;
  const target = byId.get(edge.target)?.kind;
  const fromSide = source === 'restraint' || source === 'load';
  return {
    sourceHandle: fromSide ? HANDLE.side : HANDLE.up,
    targetHandle: source === 'load' ? HANDLE.load : target === 'lift' && source === 'restraint' ? HANDLE.side : HANDLE.below,
  };
}

export function useStackGraph(input: StackGraphInput) {
  const layout = computed(() => {
    const doc = toValue(input.doc);
    return doc ? layoutByElevation(doc) : new Map<string, XY>();
  });

  function drawnAt(id: string): XY | undefined {
    const node = toValue(input.doc)?.nodes.find((n) => n.id === id);
    return node?.position ?? layout.value.get(id);
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
      for (const id of u.selection) out.set(id, [...(out.get(id) ?? []), { name: u.name, colour: colleagueColour(u.userId) }]);
    }
    return out;
  });

  const nodes = computed<Node<NodeView>[]>(() => {
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
      position: { ...(n.position ?? layout.value.get(n.id) ?? { x: 0, y: 0 }) },
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

  return { nodes, edges, drawnAt, connectOp, moveOps, tidyOps };
}
