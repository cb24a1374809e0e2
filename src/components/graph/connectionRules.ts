// Which connections the stack document allows (docs/contracts.md §Stack document), with the reason when one is refused.
// Edges point upward along the chain; restraints point at the lift they brace; loads at their carrier.
import type { NodeKind, StackDocument, StackNode } from '@shared/schema/stack.ts';
import { formatElevation } from '@/utils/format.ts';
import { liftSpans, nodesById, ownElevation } from '@/utils/stackChain.ts';

const ALLOWED: Record<NodeKind, NodeKind[]> = {
  support: ['lift'],
  lift: ['splice', 'cap'],
  splice: ['lift'],
  restraint: ['lift'],
  cap: [],
  load: ['restraint', 'cap'],
};

const WHAT_IT_CONNECTS_TO: Record<NodeKind, string> = {
  support: 'A support connects only to the lift directly above it.',
  lift: 'A lift connects upward only to a splice or to the cap.',
  splice: 'A splice connects upward only to the lift above it.',
  restraint: 'A restraint connects only to the lift it braces.',
  cap: 'The cap is the top of the stack: nothing connects from it.',
  load: 'A load connects only to the restraint or cap that carries it.',
};

/** Whether a node of this kind can start a connection at all. */
export function canStartConnection(kind: NodeKind): boolean {
  return ALLOWED[kind].length > 0;
}

/** null when the edge source → target may be added to the document, else why not, in plain words. */
export function connectionRefusal(doc: StackDocument, sourceId: string, targetId: string): string | null {
  if (sourceId === targetId) return 'A node cannot connect to itself.';
  const byId = nodesById(doc);
  const source = byId.get(sourceId);
  const target = byId.get(targetId);
  if (!source || !target) return 'That node no longer exists.';
  if (!ALLOWED[source.kind].includes(target.kind)) return WHAT_IT_CONNECTS_TO[source.kind];
  if (
    doc.edges.some(
      (e) => (e.source === sourceId && e.target === targetId) || (e.source === targetId && e.target === sourceId),
    )
  )
    return 'These two nodes are already connected.';

  const outgoing = doc.edges.filter((e) => e.source === sourceId).map((e) => byId.get(e.target)?.kind);
  const incoming = doc.edges.filter((e) => e.target === targetId).map((e) => byId.get(e.source)?.kind);
  const chain: NodeKind[] = ['support', 'lift', 'splice'];

  if (chain.includes(source.kind) && outgoing.some((k) => k && k !== 'restraint' && k !== 'load'))
    return `This ${source.kind} already has a node above it; remove that connection first.`;
  if (source.kind === 'restraint' && outgoing.length > 0) return 'This restraint is already attached to a lift.';
  if (source.kind === 'load' && outgoing.length > 0) return 'This load is already attached; a load has one carrier.';
  if (target.kind === 'lift' && source.kind !== 'restraint' && incoming.some((k) => k === 'support' || k === 'splice'))
    return 'This lift already has a node below it.';
  if ((target.kind === 'splice' || target.kind === 'cap') && source.kind === 'lift' && incoming.includes('lift'))
    return `This ${target.kind} already has a lift below it.`;

  if (source.kind === 'restraint' && target.kind === 'lift') {
    const span = liftSpans(doc).get(targetId);
    const z = source.data.elevation;
    if (span && (z < span.bottom || z > span.top))
      return `Restraint at ${formatElevation(z)} is outside this lift (${formatElevation(span.bottom)} to ${formatElevation(span.top)}).`;
  }
  if (chain.includes(source.kind)) return notRisingRefusal(doc, source, target);
  return null;
}

/** A chain edge must leave the lift longer than zero: its top above its bottom. */
function notRisingRefusal(doc: StackDocument, source: StackNode, target: StackNode): string | null {
  const byId = nodesById(doc);
  const lift = source.kind === 'lift' ? source : target;
  const neighbour = (dir: 'below' | 'above'): number | null => {
    const edge = doc.edges.find((e) =>
      dir === 'below'
        ? e.target === lift.id && ['support', 'splice'].includes(byId.get(e.source)?.kind ?? '')
        : e.source === lift.id && ['splice', 'cap'].includes(byId.get(e.target)?.kind ?? ''),
    );
    const other = edge ? byId.get(dir === 'below' ? edge.source : edge.target) : undefined;
    return other ? ownElevation(other) : null;
  };
  const bottom = source.kind === 'lift' ? neighbour('below') : ownElevation(source);
  const top = source.kind === 'lift' ? ownElevation(target) : neighbour('above');
  if (bottom === null || top === null || top > bottom) return null;
  return `The lift would run from ${formatElevation(bottom)} up to ${formatElevation(top)}: its top must be above its bottom.`;
}
