// The outcome of loading what a page shows, in the one shape LoadState draws (v-bind it): loading, ready, or
// failed with why and, for one thing asked for by id, whether it is simply not there.
import { reactive } from 'vue';
import { describeError, isNotFound } from '@/stores/notify.ts';

export type LoadState = 'idle' | 'loading' | 'ready' | 'error';

export interface LoadOutcome {
  state: LoadState;
  error: string;
  /** What was asked for does not exist or is not shared with this person: asking again cannot help. */
  missing: boolean;
}

/** `canBeMissing`: a 404 means the thing is not there (a building, a stack), not a failure that may pass. */
export function useLoad({ canBeMissing = false }: { canBeMissing?: boolean } = {}) {
  const outcome = reactive<LoadOutcome>({ state: 'idle', error: '', missing: false });

  function failed(e: unknown, missing = canBeMissing && isNotFound(e)): void {
    outcome.error = describeError(e);
    outcome.missing = missing;
    outcome.state = 'error';
  }

  /** Runs `work` and records how it went; a failure is recorded, not thrown. */
  async function run(work: () => Promise<void>): Promise<void> {
    outcome.state = 'loading';
    try {
      await work();
      outcome.state = 'ready';
    } catch (e) {
      failed(e);
    }
  }

  function reset(): void {
    Object.assign(outcome, { state: 'idle', error: '', missing: false });
  }

  return { outcome, run, failed, reset };
}
