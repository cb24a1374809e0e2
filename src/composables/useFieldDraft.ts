// A properties form's draft: what is typed into each field, checked against the node kind's zod schema
// when the field is left, with a plain message when refused. Only valid, changed values are passed on.
import { reactive, toValue, watch, type MaybeRefOrGetter } from 'vue';
import type { z } from 'zod';
import { fieldErrors, readNumber } from '@/utils/formErrors.ts';
import type { FieldSpec } from '@/utils/nodeFields.ts';

export interface FieldDraftOptions {
  value: MaybeRefOrGetter<Record<string, unknown>>;
  schema: MaybeRefOrGetter<z.ZodType>;
  fields: MaybeRefOrGetter<FieldSpec[]>;
  onValid: (data: Record<string, unknown>) => void;
  /** The colleague whose edit brought the latest change of this node; null when it was not a colleague's. */
  changedBy?: MaybeRefOrGetter<string | null>;
  /** Told, in words naming who, when a colleague's change replaces what this person typed or had just set. */
  onOverwritten?: (message: string) => void;
}

/** A stored value as its field shows it: numbers to the field's decimal places when it has them. */
const shown = (v: unknown, places?: number): string =>
  v === undefined || v === null ? '' : typeof v === 'number' && places !== undefined ? v.toFixed(places) : String(v);

export function useFieldDraft(opts: FieldDraftOptions) {
  const draft = reactive<Record<string, string>>({});
  const errors = reactive<Record<string, string>>({});
  /** Values passed on and not yet reflected back, so one change is never sent twice. */
  const sent = new Map<string, unknown>();

  /** What this person last set in each field, kept until a colleague replaces it (sent is cleared each change). */
  const mine = new Map<string, unknown>();

  /** Tells the person when a colleague's change replaced their typing or the value they had just set. */
  function noticeOverwrites(value: Record<string, unknown>, old: Record<string, unknown>): void {
    const who = toValue(opts.changedBy);
    if (!who || !opts.onOverwritten) return;
    for (const f of toValue(opts.fields)) {
      if (value[f.key] === old[f.key]) continue;
      const typing = draft[f.key] !== shown(old[f.key], f.places) && draft[f.key].trim() !== '';
      const lost = mine.has(f.key) && mine.get(f.key) === old[f.key];
      if (!typing && !lost) continue;
      const yours = typing ? `what you typed (${draft[f.key]})` : `your ${shown(mine.get(f.key), f.places)}`;
      opts.onOverwritten(
        `${who} changed ${f.label} to ${shown(value[f.key], f.places)} while you were editing it; ${yours} was replaced`,
      );
      mine.delete(f.key);
    }
  }

  // A change from elsewhere (a colleague, undo) replaces the draft, except a field still showing a refusal.
  watch(
    () => toValue(opts.value),
    (value, old) => {
      if (old && value !== old) noticeOverwrites(value, old);
      sent.clear();
      for (const f of toValue(opts.fields)) if (!errors[f.key]) draft[f.key] = shown(value[f.key], f.places);
    },
    { immediate: true, deep: true },
  );

  /** Checks one field, as typed or chosen into its draft unless given; passes it on when valid and different, else
   *  shows why it was refused. */
  function commit(key: string, typed: unknown = draft[key]): boolean {
    const field = toValue(opts.fields).find((f) => f.key === key);
    if (!field) return false;
    const value = field.type === 'number' ? readNumber(typed as string) : typed;
    draft[key] = shown(typed);
    const current = toValue(opts.value);
    const parsed = toValue(opts.schema).safeParse({ ...current, [key]: value });
    if (!parsed.success) {
      const messages = fieldErrors(parsed.error, Object.fromEntries(toValue(opts.fields).map((f) => [f.key, f])));
      errors[key] = messages[key] ?? Object.values(messages)[0] ?? 'This value is not accepted';
      return false;
    }
    delete errors[key];
    if (current[key] !== value && sent.get(key) !== value) {
      sent.set(key, value);
      mine.set(key, value);
      opts.onValid({ [key]: value });
    }
    return true;
  }

  return { draft, errors, commit };
}
