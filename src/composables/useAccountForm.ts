// The sign-in and registration forms: check the fields with the API's own schema, send, and on
// success go on to the page that was asked for. One concern: the life of an account form.
import { computed, reactive, ref } from 'vue';
import { useRoute, useRouter } from 'vue-router';
import type { ZodType } from 'zod';
import { describeError } from '@/stores/notify.ts';
import { fieldErrors, type FieldInfo } from '@/utils/formErrors.ts';
import { redirectTarget } from '@/router/redirect.ts';

/** labels: the form's fields (each starts empty in `values`) and how an error names them.
 *  after: 'redirect' goes on to the page asked for; 'stay' leaves the page to show what happened. */
export function useAccountForm<T>(
  schema: ZodType<T>,
  labels: Record<string, FieldInfo>,
  send: (body: T) => Promise<unknown>,
  after: 'redirect' | 'stay' = 'redirect',
) {
  const route = useRoute();
  const router = useRouter();
  const errors = ref<Record<string, string>>({});
  const failure = ref('');
  const busy = ref(false);
  const values = reactive<Record<string, string>>(Object.fromEntries(Object.keys(labels).map((k) => [k, ''])));

  async function submit(): Promise<void> {
    failure.value = '';
    const parsed = schema.safeParse(values);
    if (!parsed.success) {
      errors.value = fieldErrors(parsed.error, labels, values);
      return;
    }
    errors.value = {};
    busy.value = true;
    try {
      await send(parsed.data);
      if (after === 'redirect') await router.replace(redirectTarget(route.query.redirect));
    } catch (e) {
      failure.value = describeError(e);
    } finally {
      busy.value = false;
    }
  }

  /** The page's query (the redirect), carried over where the page links to the other account form. */
  const query = computed(() => route.query);
  return { values, errors, failure, busy, submit, query };
}
