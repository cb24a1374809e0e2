// Keyboard shortcuts of the stack editor. Keys typed into a form field are left to the field.
import { onBeforeUnmount, onMounted, toValue, type MaybeRefOrGetter } from 'vue';

export interface StackShortcuts {
  undo: () => void;
  redo: () => void;
  copy: () => void;
  paste: () => void;
  remove: () => void;
  selectAll: () => void;
  clearSelection: () => void;
}

function typingInField(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  return target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName);
}

/** Ctrl/⌘+Z undo, Ctrl/⌘+Shift+Z or Ctrl+Y redo, Ctrl/⌘+C/V copy/paste, Delete/Backspace, Ctrl/⌘+A, Escape. */
export function shortcutFor(
  e: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey'>,
): keyof StackShortcuts | null {
  const mod = e.ctrlKey || e.metaKey;
  const key = e.key.toLowerCase();
  if (mod && key === 'z') return e.shiftKey ? 'redo' : 'undo';
  if (mod && key === 'y') return 'redo';
  if (mod && key === 'c') return 'copy';
  if (mod && key === 'v') return 'paste';
  if (mod && key === 'a') return 'selectAll';
  if (!mod && (key === 'delete' || key === 'backspace')) return 'remove';
  if (key === 'escape') return 'clearSelection';
  return null;
}

export function useStackShortcuts(actions: StackShortcuts, enabled: MaybeRefOrGetter<boolean>): void {
  const onKey = (e: KeyboardEvent) => {
    if (!toValue(enabled) || typingInField(e.target)) return;
    const action = shortcutFor(e);
    if (!action) return;
    e.preventDefault();
    actions[action]();
  };
  onMounted(() => window.addEventListener('keydown', onKey));
  onBeforeUnmount(() => window.removeEventListener('keydown', onKey));
}
