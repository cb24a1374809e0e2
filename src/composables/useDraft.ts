// A building-model editor's draft that is saved as a whole (grid, build-ups): a copy of the stored value to
// edit, what stops it being saved (the first problem the request's schema finds) and the save.
import { computed, reactive, ref, watch, type Ref } from 'vue';
import type { z } from 'zod';
import { firstProblem } from '@/utils/drafts.ts';

/** What the editor's save bar shows and does. */
export interface DraftSaving {
  /** Why the draft cannot be saved as it is; empty when it can. */
  readonly problem: string;
  save: () => Promise<unknown>;
}

export interface DraftOptions<Stored, Edited, Body> {
  /** The stored value: copied into the draft now and again whenever it changes. */
  stored: () => Stored;
  /** A fresh copy of the stored value in the form the editor's fields change. */
  edit: (stored: Stored) => Edited;
  /** The request body the draft stands for, when it is not the draft itself. */
  body?: (draft: Edited) => unknown;
  schema: z.ZodType<Body>;
  /** The list name a problem's words leave out (`firstProblem`). */
  list: string;
  save: (body: Body) => Promise<unknown>;
}

export function useDraft<Stored, Edited, Body>(opts: DraftOptions<Stored, Edited, Body>) {
  const draft = ref(opts.edit(opts.stored())) as Ref<Edited>;
  watch(opts.stored, (stored) => (draft.value = opts.edit(stored)));

  const body = () => (opts.body ? opts.body(draft.value) : draft.value);
  const problem = computed(() => {
    const parsed = opts.schema.safeParse(body());
    return parsed.success ? '' : firstProblem(parsed.error, opts.list);
  });
  const save = () => opts.save(opts.schema.parse(body()));

  const saving: DraftSaving = reactive({ problem, save });
  return { draft, saving };
}
