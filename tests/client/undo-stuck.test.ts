// Undo after moving a node that was added from the palette: such a node has no stored position (it is
// drawn where the layout puts it), and its move used to leave an undo entry with no ops, which undo could
// never apply and which then blocked every older step.
import { describe, expect, it } from 'vitest';
import { applyOps } from '@shared/ops/applyOps.ts';
import { addNodeOps } from '@/components/graph/newNode.ts';
import { layoutByElevation } from '@/utils/layoutByElevation.ts';
import { drawnWhereLaidOut, inverseOps } from '@/utils/inverseOps.ts';
import { useUndoHistory } from '@/composables/useUndoHistory.ts';
import { buildStack } from '../engine/stack-builder.ts';

const start = buildStack({ lifts: [{ top: 4 }, { top: 8 }], floors: [{ elevation: 4, Gk: 100, Qk: 40 }] });

describe('undo after moving a node added from the palette', () => {
  it('moves the node back to where the layout drew it, and the older step (adding it) is undone next', () => {
    const history = useUndoHistory();
    const added = addNodeOps(start, 'splice', null);
    const withSplice = applyOps(start, added.ops);
    history.record({ label: 'Add splice', ops: inverseOps(start, added.ops, applyOps, drawnWhereLaidOut(start)) });

    const drawn = layoutByElevation(withSplice).get(added.id);
    expect(drawn).toBeDefined();
    expect(withSplice.nodes.find((n) => n.id === added.id)?.position).toBeUndefined();
    const move = [{ op: 'moveNode' as const, id: added.id, position: { x: 300, y: -50 } }];
    const moved = applyOps(withSplice, move);
    history.record({ label: 'Move node', ops: inverseOps(withSplice, move, applyOps, drawnWhereLaidOut(withSplice)) });

    const undoMove = history.popUndo();
    expect(undoMove?.label).toBe('Move node');
    const back = applyOps(moved, undoMove?.ops ?? []);
    expect(back.nodes.find((n) => n.id === added.id)?.position).toEqual(drawn);

    const undoAdd = history.popUndo();
    expect(undoAdd?.label).toBe('Add splice');
    const original = applyOps(back, undoAdd?.ops ?? []);
    expect(original.nodes.map((n) => n.id).sort()).toEqual(start.nodes.map((n) => n.id).sort());
    expect(history.canUndo.value).toBe(false);
  });

  it('never keeps an entry with no ops, so it cannot block the steps before it', () => {
    const history = useUndoHistory();
    const older = { label: 'Older step', ops: [{ op: 'removeNode' as const, id: 'x' }] };
    history.record(older);
    history.record({ label: 'Empty', ops: [] });
    history.pushUndo({ label: 'Empty again', ops: [] });
    expect(history.undoLabel.value).toBe('Older step');
    expect(history.popUndo()).toBe(older);
    expect(history.canUndo.value).toBe(false);
  });
});
