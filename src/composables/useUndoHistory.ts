// The local undo and redo stacks of one editing session. Each entry holds the ops that reverse an edit;
// the store sends them as a new edit, so colleagues see an undo like any other change.
import { computed, shallowRef } from 'vue';
import type { Op } from '@shared/schema/ops.ts';

export interface HistoryEntry {
  label: string;
  ops: Op[];
}

/** Enough steps for a working session without holding every document that ever existed. */
export const HISTORY_LIMIT = 100;

export function useUndoHistory() {
  const undoStack = shallowRef<HistoryEntry[]>([]);
  const redoStack = shallowRef<HistoryEntry[]>([]);

  // An entry with no ops could never be undone (the store sends nothing for it) and would stay on top,
  // blocking every older step: such entries are never kept, and any already held are skipped.
  /** A fresh edit: it can be undone, and nothing can be redone past it. */
  function record(entry: HistoryEntry): void {
    redoStack.value = [];
    if (entry.ops.length) undoStack.value = [...undoStack.value, entry].slice(-HISTORY_LIMIT);
  }
  function pushUndo(entry: HistoryEntry): void {
    if (entry.ops.length) undoStack.value = [...undoStack.value, entry].slice(-HISTORY_LIMIT);
  }
  function pushRedo(entry: HistoryEntry): void {
    if (entry.ops.length) redoStack.value = [...redoStack.value, entry];
  }
  function popFrom(stack: typeof undoStack): HistoryEntry | undefined {
    const entries = stack.value.filter((e) => e.ops.length > 0);
    const entry = entries.at(-1);
    stack.value = entries.slice(0, -1);
    return entry;
  }
  const popUndo = () => popFrom(undoStack);
  const popRedo = () => popFrom(redoStack);
  /** Drops an entry whose edit the server refused: there is nothing to undo. */
  function forget(entry: HistoryEntry): void {
    undoStack.value = undoStack.value.filter((e) => e !== entry);
    redoStack.value = redoStack.value.filter((e) => e !== entry);
  }
  function clear(): void {
    undoStack.value = [];
    redoStack.value = [];
  }

  return {
    canUndo: computed(() => undoStack.value.length > 0),
    canRedo: computed(() => redoStack.value.length > 0),
    undoLabel: computed(() => undoStack.value.at(-1)?.label ?? null),
    redoLabel: computed(() => redoStack.value.at(-1)?.label ?? null),
    record,
    pushUndo,
    pushRedo,
    popUndo,
    popRedo,
    forget,
    clear,
  };
}
