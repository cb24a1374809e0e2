// Sign-in, registration, verification of the address, sign-out and the current user (docs/contracts.md §REST routes,
// docs/access.md).
import type { z } from 'zod';
import type {
  AuthResponse,
  PasswordStrength,
  RegisterResponse,
  User,
  loginBodySchema,
  registerBodySchema,
} from '@shared/schema/api.ts';
import { apiFetch } from './http.ts';

export type LoginBody = z.output<typeof loginBodySchema>;
export type RegisterBody = z.output<typeof registerBodySchema>;

export const authApi = {
  login: (body: LoginBody) => apiFetch<AuthResponse>('POST', '/auth/login', body),
  /** No session: the answer only says a link is on its way (the same for a known address). */
  register: (body: RegisterBody) => apiFetch<RegisterResponse>('POST', '/auth/register', body),
  verify: (token: string) => apiFetch<User>('POST', '/auth/verify', { token }),
  resendVerification: () => apiFetch<RegisterResponse>('POST', '/auth/verify/resend'),
  /** Ends every session of the account, on every device. */
  logout: () => apiFetch<void>('POST', '/auth/logout'),
  passwordStrength: (body: { password: string; email?: string; name?: string }) =>
    apiFetch<PasswordStrength>('POST', '/auth/password-strength', body),
  me: () => apiFetch<User>('GET', '/me'),
};
