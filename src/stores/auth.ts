// Who is signed in. The token lives in localStorage (http.ts); any 401 from the API signs out.
import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import type { AuthResponse, LoginBody, RegisterBody, RegisterResponse, User } from '@shared/schema/api.ts';
import * as authApi from '@/api/auth.ts';
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

  /** Registration starts no session: the address is verified through the mailed link first. */
  async function register(body: RegisterBody): Promise<RegisterResponse> {
    return authApi.register(body);
  }

  /** Follows a verification link; a signed-in user's account shows as verified at once. */
  async function verify(linkToken: string): Promise<User> {
    const verified = await authApi.verifyEmail(linkToken);
    if (user.value && user.value.id === verified.id) user.value = { ...user.value, emailVerified: true };
    return verified;
  }

  /** Loads the user behind a stored token once; a 401 signs out through onUnauthorised. */
  async function loadUser(): Promise<void> {
    if (!token.value || user.value) return;
    user.value = await authApi.getMe();
  }

  /** Forgets the session here only (the server has ended it already, or refused it). */
  function endLocalSession(): void {
    setToken(null);
    token.value = null;
    user.value = null;
  }

  /** Signs out everywhere: the server ends every session of the account, then this one is forgotten. */
  async function signOut(): Promise<void> {
    try {
      if (token.value) await authApi.logout();
    } finally {
      endLocalSession();
    }
  }

  onUnauthorised(() => {
    if (token.value) endLocalSession();
  });

  return { token, user, isSignedIn, signIn, register, verify, loadUser, signOut, endLocalSession };
});
