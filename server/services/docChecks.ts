// What every write of a stack document must satisfy before it is stored, whichever way it came (the
// ops of the live channel and REST, or a whole document by PUT turned into ops): one check for both.
// A node sits on levels the building has; every edge joins two nodes of the document, never a node to
// itself; the edges make no loop. The analysis reports problems an engineer fixes while drawing
// (a lift with no node above it); these are refused because no drawing step could produce them.
import type { StackDocument } from '../../shared/schema/stack.ts';
import { unprocessable } from '../errors.ts';
import { assertUniqueIds } from './stackRows.ts';

function assertEdgesJoinNodes(doc: StackDocument): void {
  const nodes = new Set(doc.nodes.map((n) => n.id));
  for (const e of doc.edges) {
    if (!nodes.has(e.source))
      throw unprocessable(`Connection ${e.id}: its source ${e.source} does not exist`, { id: e.id });
    if (!nodes.has(e.target))
      throw unprocessable(`Connection ${e.id}: its target ${e.target} does not exist`, { id: e.id });
    if (e.source === e.target)
      throw unprocessable(`Connection ${e.id}: an edge cannot join a node to itself`, { id: e.id });
  }
}

/** Kahn's algorithm: nodes left with incoming edges after peeling every source lie on a loop. */
function assertNoLoop(doc: StackDocument): void {
  const incoming = new Map(doc.nodes.map((n) => [n.id, 0]));
  const out = new Map<string, string[]>();
  for (const e of doc.edges) {
    incoming.set(e.target, (incoming.get(e.target) ?? 0) + 1);
    out.set(e.source, [...(out.get(e.source) ?? []), e.target]);
  }
  const ready = [...incoming].filter(([, n]) => n === 0).map(([id]) => id);
  let peeled = 0;
  while (ready.length > 0) {
    const id = ready.pop() as string;
    peeled += 1;
    for (const t of out.get(id) ?? []) {
      const left = (incoming.get(t) ?? 0) - 1;
      incoming.set(t, left);
      if (left === 0) ready.push(t);
    }
  }
  if (peeled < incoming.size) {
    const onLoop = [...incoming].filter(([, n]) => n > 0).map(([id]) => id);
    throw unprocessable(`The connections make a loop through ${onLoop.slice(0, 5).join(', ')}`, { ids: onLoop });
  }
}

/** Nodes this write touches may only name levels the building has (untouched ones are left as they are). */
function assertLevelsExist(
  doc: StackDocument,
  levels: ReadonlyMap<string, number>,
  touched: ReadonlySet<string>,
): void {
  for (const n of doc.nodes) {
    if (!touched.has(n.id) || !('levelId' in n.data) || n.data.levelId === undefined) continue;
    if (!levels.has(n.data.levelId))
      throw unprocessable(`Node ${n.id} sits on level ${n.data.levelId}, which this building no longer has`, {
        id: n.id,
        levelId: n.data.levelId,
      });
  }
}

export function assertDocSound(
  doc: StackDocument,
  levels: ReadonlyMap<string, number>,
  touched: ReadonlySet<string>,
): void {
  assertUniqueIds(doc);
  assertEdgesJoinNodes(doc);
  assertNoLoop(doc);
  assertLevelsExist(doc, levels, touched);
}
