// Sizing (docs/analysis-rules.md §Sizing): asks the server for a preview of the lightest passing sections of a stack
// or a building, keeps which lifts the engineer ticks, and accepts them through the normal edit path:
// the open stack's serial edit queue (live and undoable), or per stack over REST for a building.
import { computed, ref, shallowRef } from 'vue';
import { defineStore } from 'pinia';
import type { SizingRequest, StackSizingPreview } from '@shared/schema/sizing.ts';
import { proposeForBuilding, proposeForStack } from '@/api/sizing.ts';
import { applyStackOps } from '@/api/stacks.ts';
import { acceptOps, allSelectable, massTotals, previewRows } from '@/utils/sizingRows.ts';
import type { LoadState } from './buildings.ts';
import { describeError, useNotifyStore } from './notify.ts';
import { useStackStore } from './stack.ts';

export interface SizingScope {
  kind: 'stack' | 'building';
  id: number;
}

export const useSizingStore = defineStore('sizing', () => {
  const notify = useNotifyStore();
  const scope = ref<SizingScope | null>(null);
  const state = ref<LoadState>('idle');
  const error = ref('');
  const previews = shallowRef<StackSizingPreview[]>([]);
  const chosen = ref<Set<string>>(new Set());
  const applying = ref(false);
  let lastRequest: SizingRequest | null = null;

  const rows = computed(() => previewRows(previews.value));
  const totals = computed(() => massTotals(previews.value, chosen.value));
  const chosenCount = computed(() => chosen.value.size);

  function reset(): void {
    state.value = 'idle';
    error.value = '';
    previews.value = [];
    chosen.value = new Set();
  }

  async function propose(target: SizingScope, request: SizingRequest): Promise<void> {
    scope.value = target;
    lastRequest = request;
    state.value = 'loading';
    error.value = '';
    try {
      if (target.kind === 'stack') {
        previews.value = [await proposeForStack(target.id, request)];
      } else {
        previews.value = (await proposeForBuilding(target.id, request)).stacks;
      }
      chosen.value = allSelectable(previews.value);
      state.value = 'ready';
    } catch (e) {
      error.value = describeError(e);
      state.value = 'error';
    }
  }

  function choose(key: string, on: boolean): void {
    const next = new Set(chosen.value);
    if (on) next.add(key);
    else next.delete(key);
    chosen.value = next;
  }

  function chooseAll(on: boolean): void {
    chosen.value = on ? allSelectable(previews.value) : new Set();
  }

  /** The open stack takes the edit through its queue: one undoable step, shown at once to everyone. false when that stack is not open. */
  function acceptOnOpenStack(preview: StackSizingPreview): boolean {
    const stack = useStackStore();
    if (stack.stackId !== preview.stackId) return false;
    const ops = acceptOps(preview, chosen.value);
    return (
      ops.length > 0 &&
      stack.edit(ops, ops.length === 1 ? 'Apply the proposed section' : `Apply ${ops.length} proposed sections`)
    );
  }

  /** Each stack of a building on the version the preview was made on; a stack changed since is refused and reported. */
  async function acceptOverRest(previewsToApply: readonly StackSizingPreview[]): Promise<number> {
    let applied = 0;
    for (const preview of previewsToApply) {
      const ops = acceptOps(preview, chosen.value);
      if (ops.length === 0) continue;
      try {
        await applyStackOps(preview.stackId, preview.version, ops);
        applied++;
      } catch (e) {
        notify.error(e, `Stack ${preview.name} was not changed`);
      }
    }
    return applied;
  }

  /** true when every ticked lift was accepted. */
  async function accept(): Promise<boolean> {
    if (!scope.value || chosen.value.size === 0) return false;
    applying.value = true;
    try {
      if (scope.value.kind === 'stack' && previews.value.length === 1 && acceptOnOpenStack(previews.value[0])) {
        notify.success('Proposed sections applied; undo reverses them');
        return true;
      }
      const withChanges = previews.value.filter((p) => acceptOps(p, chosen.value).length > 0);
      const applied = await acceptOverRest(withChanges);
      if (applied > 0) notify.success(`Proposed sections applied to ${applied} of ${withChanges.length} stacks`);
      if (applied === withChanges.length) return true;
      // Some stacks changed since the preview: show a fresh one for what is left to decide.
      if (lastRequest) await propose(scope.value, lastRequest);
      return false;
    } finally {
      applying.value = false;
    }
  }

  return {
    scope,
    state,
    error,
    previews,
    chosen,
    applying,
    rows,
    totals,
    chosenCount,
    reset,
    propose,
    choose,
    chooseAll,
    accept,
  };
});
