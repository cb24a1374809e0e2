// Sign-in, registration and the current user (docs/contracts.md §REST routes).
import type { z } from 'zod';
import type { AuthResponse, User, loginBodySchema, registerBodySchema } from '@shared/schema/api.ts';
import { apiFetch } from './http.ts';

export type LoginBody = z.output<typeof loginBodySchema>;
export type RegisterBody = z.output<typeof registerBodySchema>;

export const authApi = {
  login: (body: LoginBody) => apiFetch<AuthResponse>('POST', '/auth/login', body),
  register: (body: RegisterBody) => apiFetch<AuthResponse>('POST', '/auth/register', body),
  me: () => apiFetch<User>('GET', '/me'),
};
