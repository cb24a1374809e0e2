// Reading a stack document as the vertical chain of docs/contracts.md §Stack document: where each node sits and how
// it is named on screen. Pure functions of the document, shared by the graph, the forms and the results pane.
import type { LiftData, NodeKind, StackDocument, StackNode } from '@shared/schema/stack.ts';
import { formatElevation } from '@/utils/format.ts';

export interface Span {
  bottom: number;
  top: number;
}

export function nodesById(doc: StackDocument): Map<string, StackNode> {
  return new Map(doc.nodes.map((n) => [n.id, n]));
}

/** Elevation of a node that has one in its own data (support, splice, restraint, cap). */
export function ownElevation(node: StackNode): number | null {
  return 'elevation' in node.data ? node.data.elevation : null;
}

/** Bottom and top of each lift, from the nodes joined to it below and above (docs/contracts.md §Stack document). */
export function liftSpans(doc: StackDocument): Map<string, Span> {
  const byId = nodesById(doc);
  const below = new Map<string, number>();
  const above = new Map<string, number>();
  for (const e of doc.edges) {
    const s = byId.get(e.source);
    const t = byId.get(e.target);
    if (!s || !t) continue;
    if (t.kind === 'lift' && (s.kind === 'support' || s.kind === 'splice')) below.set(t.id, s.data.elevation);
    if (s.kind === 'lift' && (t.kind === 'splice' || t.kind === 'cap')) above.set(s.id, t.data.elevation);
  }
  const spans = new Map<string, Span>();
  for (const n of doc.nodes) {
    if (n.kind !== 'lift') continue;
    const bottom = below.get(n.id);
    const top = above.get(n.id);
    if (bottom !== undefined && top !== undefined) spans.set(n.id, { bottom, top });
  }
  return spans;
}

/** The elevation at which each node is drawn: lifts at mid-span, loads at the node that carries them. */
export function drawingElevations(doc: StackDocument): Map<string, number> {
  const byId = nodesById(doc);
  const spans = liftSpans(doc);
  const out = new Map<string, number>();
  for (const n of doc.nodes) {
    const own = ownElevation(n);
    if (own !== null) out.set(n.id, own);
    const span = spans.get(n.id);
    if (span) out.set(n.id, (span.bottom + span.top) / 2);
  }
  for (const e of doc.edges) {
    const s = byId.get(e.source);
    const t = byId.get(e.target);
    if (s?.kind === 'load' && t && out.has(t.id)) out.set(s.id, out.get(t.id) as number);
  }
  return out;
}

const KIND_WORD: Record<NodeKind, string> = {
  support: 'Support',
  lift: 'Lift',
  splice: 'Splice',
  restraint: 'Restraint',
  cap: 'Cap',
  load: 'Load',
};

export function kindWord(kind: NodeKind): string {
  return KIND_WORD[kind];
}

/** Lifts numbered from the bottom (L1, L2…) by the elevation of their bottom; unplaced lifts last. */
export function liftNumbers(doc: StackDocument): Map<string, string> {
  const spans = liftSpans(doc);
  const lifts = doc.nodes.filter((n) => n.kind === 'lift');
  const sorted = [...lifts].sort(
    (a, b) => (spans.get(a.id)?.bottom ?? Infinity) - (spans.get(b.id)?.bottom ?? Infinity),
  );
  return new Map(sorted.map((n, i) => [n.id, `L${i + 1}`]));
}

/** A short name for a node in lists and messages: "Lift L2", "Splice +8.000", 'Load "Plant room"' (the
 *  description quoted, so a new node's 'Load "Extra load"' does not read as "Load Extra load"). */
export function nodeTitle(node: StackNode, liftNo: Map<string, string>): string {
  if (node.kind === 'lift') return `Lift ${liftNo.get(node.id) ?? ''}`.trim();
  if (node.kind === 'load') return node.data.label ? `Load "${node.data.label}"` : 'Load';
  return `${KIND_WORD[node.kind]} ${formatElevation(node.data.elevation)}`;
}

/** Designation of a lift's section, whether from the catalogue or given by its dimensions (mm). */
export function sectionName(section: LiftData['section']): string {
  if (typeof section === 'string') return section;
  if (section.shape === 'I') return `${section.make} I ${section.h}x${section.b}x${section.tw}/${section.tf}`;
  if (section.shape === 'RHS') return `${section.make} RHS ${section.h}x${section.b}x${section.t}`;
  return `${section.make} CHS ${section.d}x${section.t}`;
}
