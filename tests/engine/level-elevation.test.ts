// A node tied to a building level stands at the level's elevation; the copy of it a document may carry is a cache
// that is never trusted (docs/contracts.md §Stack document, docs/stack-editing.md). Invented building and loads.
import { describe, expect, it } from 'vitest';
import { sizeStack } from '../../shared/engine/sizing/sizeStack.ts';
import { analyseStack } from '../../shared/engine/stack/analyseStack.ts';
import { nodeElevation, placeOnLevels } from '../../shared/engine/stack/placeOnLevels.ts';
import { sizingRequestSchema } from '../../shared/schema/sizing.ts';
import type { StackDocument, StackNode } from '../../shared/schema/stack.ts';
import { buildStack, withNode } from './stack-builder.ts';

const levels = new Map([
  ['ground', 0],
  ['first', 4],
  ['second', 8],
  ['roof', 12],
]);

/** A two-lift stack whose support, floors and cap sit on the levels, each node's copy set to `copies`. */
function tiedStack(copies: { ground: number; first: number; second: number; roof: number }): StackDocument {
  let doc = buildStack({
    base: { elevation: copies.ground, fixity: 'fixed' },
    lifts: [{ top: 6 }, { top: copies.roof }],
    floors: [
      { elevation: copies.first, levelId: 'first', Gk: 180, Qk: 90, category: 'B' },
      { elevation: copies.second, levelId: 'second', Gk: 180, Qk: 90, category: 'B' },
    ],
    cap: { Gk: 60, Qk: 20, category: 'H' },
  });
  const tie = (id: string, levelId: string) =>
    withNode(doc, id, (n) => ({ ...n, data: { ...n.data, levelId } }) as StackNode);
  doc = tie('s', 'ground');
  doc = tie('c', 'roof');
  // Beam reactions on one flange at the first floor, so the nominal moments read the floor's elevation too
  return withNode(doc, 'r1', (n) =>
    n.kind === 'restraint' ? { ...n, data: { ...n.data, faces: { yPlus: { Gk: 120, Qk: 60 } } } } : n,
  );
}

const atLevels = tiedStack({ ground: 0, first: 4, second: 8, roof: 12 });
// The copies a document kept from before its levels moved: every one of them wrong
const stale = tiedStack({ ground: 0.3, first: 3.6, second: 8.45, roof: 11.2 });

describe('a node tied to a level takes its elevation from the level', () => {
  it('nodeElevation is the level for a tied node, the node’s own for one not tied or tied to a level gone', () => {
    const floor = stale.nodes.find((n) => n.id === 'r1');
    if (floor?.kind !== 'restraint') throw new Error('no floor r1');
    expect(nodeElevation(floor, levels)).toBe(4);
    expect(nodeElevation({ ...floor, data: { ...floor.data, levelId: undefined } }, levels)).toBe(3.6);
    expect(nodeElevation({ ...floor, data: { ...floor.data, levelId: 'demolished' } }, levels)).toBe(3.6);
  });

  it('placeOnLevels reads levels as a map, a record or the API’s list alike, and keeps the same document when nothing moves', () => {
    const list = [...levels].map(([id, elevation]) => ({ id, name: id, elevation }));
    const placed = placeOnLevels(stale, levels);
    expect(placeOnLevels(stale, Object.fromEntries(levels))).toEqual(placed);
    expect(placeOnLevels(stale, list)).toEqual(placed);
    expect(placed).toEqual(atLevels);
    expect(placeOnLevels(atLevels, levels)).toBe(atLevels);
    expect(placeOnLevels(stale, undefined)).toBe(stale);
  });

  it('analyseStack gives the same numbers for a tied node with a stale copied elevation as for one with the level’s', () => {
    const fresh = analyseStack(atLevels, {}, { levels });
    const fromStale = analyseStack(stale, {}, { levels });
    expect(fresh.errors).toEqual([]);
    expect(fromStale).toEqual(fresh);
    // The column stands where the levels are (docs/contracts.md §Stack document), not where the copies say
    expect(fromStale.lifts.map((l) => [l.bottom, l.top])).toEqual([
      [0, 6],
      [6, 12],
    ]);
    expect(fromStale.takeDown.map((r) => r.elevation)).toEqual([12, 8, 4]);
  });

  it('sizeStack proposes the same sections for a tied node with a stale copy as for one with the level’s', () => {
    const request = sizingRequestSchema.parse({ series: 'UKC', grade: 'S355' });
    const fresh = sizeStack(atLevels, request, {}, { levels });
    expect(fresh.errors).toEqual([]);
    expect(sizeStack(stale, request, {}, { levels })).toEqual(fresh);
  });
});
