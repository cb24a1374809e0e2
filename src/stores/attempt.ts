// How store actions report failure: through the one notifier, with the state put back, answering whether the
// work succeeded so a form can stay open.
import type { useNotifyStore } from './notify.ts';

export async function attempt(
  notify: ReturnType<typeof useNotifyStore>,
  context: string,
  work: () => Promise<unknown>,
  rollback?: () => void,
): Promise<boolean> {
  try {
    await work();
    return true;
  } catch (e) {
    rollback?.();
    notify.error(e, context);
    return false;
  }
}
