// The graph stands at true elevation: heights come from elevations (not from stored positions), the
// building's levels are drawn across it, and dragging a splice or a free restraint up or down changes its
// elevation, snapped to a level or to the chosen offset above one.
import { describe, expect, it } from 'vitest';
import { applyOps } from '@shared/ops/applyOps.ts';
import { StructuralEditError } from '@shared/ops/structuralEdits.ts';
import type { Level } from '@shared/schema/api.ts';
import { PX_PER_METRE } from '@/utils/layoutByElevation.ts';
import { snapElevation } from '@/utils/snapElevation.ts';
import { useStackGraph } from '@/composables/useStackGraph.ts';
import { buildStack } from '../engine/stack-builder.ts';

// Invented: levels every 4 m; two lifts spliced at +4.5, floors at +4 (free) and +8 (on level L2)
const levels: Level[] = [0, 4, 8, 12].map((elevation, i) => ({
  id: `lv${i}`,
  name: i === 0 ? 'Ground' : `Level ${i}`,
  elevation,
}));
const doc = buildStack({
  lifts: [{ top: 4.5 }, { top: 12 }],
  floors: [{ elevation: 4 }, { elevation: 8, levelId: 'lv2' }],
});
// A stored position far from its elevation: only its sideways place is kept
doc.nodes.find((n) => n.id === 'p1')!.position = { x: 30, y: 900 };

const graphOf = (d = doc) =>
  useStackGraph({ doc: d, results: null, selection: [], others: [], readOnly: false, levels });
const at = (z: number) => -z * PX_PER_METRE;

describe('snapElevation', () => {
  it('snaps to a level or to the offset above it within 0.25 m, else to 50 mm', () => {
    expect(snapElevation(4.2, levels, 0.5)).toBe(4);
    expect(snapElevation(4.6, levels, 0.5)).toBe(4.5);
    expect(snapElevation(8.95, levels, 1)).toBe(9);
    expect(snapElevation(6.12, levels, 0.5)).toBeCloseTo(6.1, 12);
  });
});

describe('the graph at true elevation', () => {
  it('draws a node at the height of its elevation whatever its stored position, keeping its stored x', () => {
    const splice = graphOf().nodes.value.find((n) => n.id === 'p1');
    expect(splice?.position).toEqual({ x: 30, y: at(4.5) });
  });

  it('draws each level as a line across the graph at its elevation, behind the stack and not selectable', () => {
    const lines = graphOf().nodes.value.filter((n) => n.type === 'level');
    expect(lines.map((n) => [n.id, n.position.y])).toEqual(levels.map((l) => [`level:${l.id}`, at(l.elevation)]));
    expect(lines.every((n) => n.selectable === false && n.draggable === false)).toBe(true);
  });

  it('dragging a splice up sets its new elevation, snapped to the offset above the level, and re-attaches the floor it passes', () => {
    const ops = graphOf().dragOps([{ id: 'p1', position: { x: 30, y: at(8.4) } }], 0.5);
    const moved = applyOps(doc, ops);
    expect(moved.nodes.find((n) => n.id === 'p1')?.data).toEqual({ elevation: 8.5 });
    // The floor at +8 now sits inside the lower lift
    expect(moved.edges.find((e) => e.source === 'r2')?.target).toBe('l1');
  });

  it('dragging a free restraint changes its elevation; one tied to a level keeps the elevation of its level', () => {
    const ops = graphOf().dragOps([{ id: 'r1', position: { x: 240, y: at(2.1) } }], 0.5);
    expect(applyOps(doc, ops).nodes.find((n) => n.id === 'r1')?.data).toMatchObject({ elevation: 2.1 });
    const tied = graphOf().dragOps([{ id: 'r2', position: { x: 240, y: at(6) } }], 0.5);
    expect(tied.filter((op) => op.op !== 'moveNode')).toEqual([]);
    expect(applyOps(doc, tied).nodes.find((n) => n.id === 'r2')?.data).toMatchObject({ elevation: 8 });
  });

  it('a splice dragged past the next splice or the cap is refused with the reason', () => {
    expect(() => graphOf().dragOps([{ id: 'p1', position: { x: 30, y: at(13) } }], 0.5)).toThrow(StructuralEditError);
  });

  it('a lift dragged up or down only keeps its sideways place: its height is its span', () => {
    const ops = graphOf().dragOps([{ id: 'l1', position: { x: 12, y: at(10) } }], 0.5);
    expect(ops).toEqual([{ op: 'moveNode', id: 'l1', position: { x: 12, y: graphOf().drawnAt('l1')!.y } }]);
  });
});
