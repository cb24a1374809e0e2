// Who is signed in. The token lives in localStorage (http.ts); any 401 from the API signs out.
import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import type { AuthResponse, User } from '@shared/schema/api.ts';
import { authApi, type LoginBody, type RegisterBody } from '@/api/auth.ts';
import { getToken, onUnauthorised, setToken } from '@/api/http.ts';

export const useAuthStore = defineStore('auth', () => {
  const token = ref<string | null>(getToken());
  const user = ref<User | null>(null);
  const isSignedIn = computed(() => token.value !== null);

  function startSession(res: AuthResponse): void {
    setToken(res.token);
    token.value = res.token;
    user.value = res.user;
  }

  async function signIn(body: LoginBody): Promise<void> {
    startSession(await authApi.login(body));
  }

  async function register(body: RegisterBody): Promise<void> {
    startSession(await authApi.register(body));
  }

  /** Loads the user behind a stored token once; a 401 signs out through onUnauthorised. */
  async function loadUser(): Promise<void> {
    if (!token.value || user.value) return;
    user.value = await authApi.me();
  }

  function signOut(): void {
    setToken(null);
    token.value = null;
    user.value = null;
  }

  onUnauthorised(() => {
    if (token.value) signOut();
  });

  return { token, user, isSignedIn, signIn, register, loadUser, signOut };
});
