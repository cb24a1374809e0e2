// Route guards: who may see which page. The server enforces every right; this only keeps people
// out of pages that would answer 401 anyway.
import { watch } from 'vue';
import type { Router } from 'vue-router';
import { useAuthStore } from '@/stores/auth.ts';
import { useNotifyStore } from '@/stores/notify.ts';

export function installAuthGuard(router: Router): void {
  const auth = useAuthStore();
  const notify = useNotifyStore();

  router.beforeEach(async (to) => {
    // An unreachable server is reported; the page then shows its own error state.
    if (auth.isSignedIn) await auth.loadUser().catch((e: unknown) => notify.error(e, 'Could not load your account'));
    if (!to.meta.public && !auth.isSignedIn) {
      return { name: 'sign-in', query: to.fullPath === '/' ? {} : { redirect: to.fullPath } };
    }
    if (to.meta.guestOnly && auth.isSignedIn) return { name: 'buildings' };
    return true;
  });

  // Signed out elsewhere (a 401, another tab): leave the protected page at once.
  watch(
    () => auth.isSignedIn,
    (signedIn) => {
      const current = router.currentRoute.value;
      if (!signedIn && !current.meta.public) {
        void router.replace({ name: 'sign-in', query: { redirect: current.fullPath } });
      }
    },
  );
}
