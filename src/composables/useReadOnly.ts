// Whether the form controls of an editor can be changed: the editor decides it once (from the person's role, or
// because it only shows a record) and every control inside reads it, so no field is handed the setting by hand.
import { computed, inject, provide, toValue, type ComputedRef, type InjectionKey, type MaybeRefOrGetter } from 'vue';

const READ_ONLY: InjectionKey<ComputedRef<boolean>> = Symbol('editor is read-only');

/** Makes the controls inside this component read-only while `source` is true. The nearest editor decides, so a
 *  form mounted on its own, or inside another editor, follows what it was told itself. */
export function provideReadOnly(source: MaybeRefOrGetter<boolean>): void {
  provide(
    READ_ONLY,
    computed(() => toValue(source)),
  );
}

/** Whether a control is read-only: its own `readonly` where a caller gave one (a field locked for its own reason, or
 *  one left open on purpose), else its editor's; editable inside no editor. */
export function useReadOnly(own?: MaybeRefOrGetter<boolean | undefined>): ComputedRef<boolean> {
  const editor = inject(READ_ONLY, null);
  return computed(() => toValue(own) ?? editor?.value ?? false);
}
