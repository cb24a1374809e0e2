// Sign-in, registration, verification of the address, sign-out and the current user (docs/contracts.md §REST routes,
// docs/access.md).
import type {
  AuthResponse,
  LoginBody,
  PasswordStrength,
  PasswordStrengthBody,
  RegisterBody,
  RegisterResponse,
  User,
} from '@shared/schema/api.ts';
import {
  authResponseSchema,
  passwordStrengthSchema,
  registerResponseSchema,
  userSchema,
} from '@shared/schema/replies.ts';
import { http } from './http.ts';

export async function login(body: LoginBody): Promise<AuthResponse> {
  return authResponseSchema.parse(await http.post('/auth/login', body));
}

/** No session: the answer only says a link is on its way (the same for a known address). */
export async function register(body: RegisterBody): Promise<RegisterResponse> {
  return registerResponseSchema.parse(await http.post('/auth/register', body));
}

export async function verifyEmail(token: string): Promise<User> {
  return userSchema.parse(await http.post('/auth/verify', { token }));
}

export async function resendVerification(): Promise<RegisterResponse> {
  return registerResponseSchema.parse(await http.post('/auth/verify/resend'));
}

/** Ends every session of the account, on every device. */
export async function logout(): Promise<void> {
  await http.post('/auth/logout');
}

export async function passwordStrength(body: PasswordStrengthBody): Promise<PasswordStrength> {
  return passwordStrengthSchema.parse(await http.post('/auth/password-strength', body));
}

export async function getMe(): Promise<User> {
  return userSchema.parse(await http.get('/me'));
}
