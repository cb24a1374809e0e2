// Accounts: registration, verification of the address, sign-in, sessions and look-up (docs/access.md).
// Passwords are bcrypt hashes, computed on a worker thread.
import type { Knex } from 'knex';
import { MAX_PASSWORD_BYTES, type User } from '../../shared/schema/api.ts';
import { conflict, unauthenticated, unprocessable } from '../errors.ts';
import { now } from '../db.ts';
import { acceptInvitations } from './members.ts';
import { recordAudit } from './audit.ts';
import type { SessionClaims } from './tokens.ts';
import { compareOffThread, hashOffThread } from '../offThread/passwords.ts';

interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
  is_admin: boolean | number;
  token_version: number | string;
  email_verified_at: unknown;
}

export const toUser = (row: Pick<UserRow, 'id' | 'email' | 'name' | 'is_admin' | 'email_verified_at'>): User => ({
  id: row.id,
  email: row.email,
  name: row.name,
  isAdmin: Boolean(row.is_admin),
  emailVerified: row.email_verified_at !== null && row.email_verified_at !== undefined,
});

export async function findUserById(db: Knex, id: number): Promise<User | null> {
  const row = await db<UserRow>('users').where({ id }).first();
  return row ? toUser(row) : null;
}

export async function findUserByEmail(db: Knex, email: string): Promise<User | null> {
  const row = await db<UserRow>('users').where({ email }).first();
  return row ? toUser(row) : null;
}

/** The user a session token speaks for, while the account exists and the session version still matches. */
export async function userForSession(db: Knex, claims: SessionClaims): Promise<User & { tokenVersion: number }> {
  const row = await db<UserRow>('users').where({ id: claims.userId }).first();
  if (!row) throw unauthenticated('This account no longer exists');
  const tokenVersion = Number(row.token_version);
  if (tokenVersion !== claims.tokenVersion)
    throw unauthenticated('This session has ended (signed out or password changed); sign in again');
  return { ...toUser(row), tokenVersion };
}

export async function tokenVersionOf(db: Knex, userId: number): Promise<number> {
  const row = await db<UserRow>('users').where({ id: userId }).first('token_version');
  if (!row) throw unauthenticated('This account no longer exists');
  return Number(row.token_version);
}

/** Ends every session of the user (sign out everywhere): older tokens are refused from now on. */
export async function endSessions(db: Knex, userId: number, action = 'user.sign-out'): Promise<number> {
  return db.transaction(async (trx) => {
    await trx('users').where({ id: userId }).increment('token_version', 1);
    await recordAudit(trx, { userId, action });
    return tokenVersionOf(trx, userId);
  });
}

export interface NewUser {
  email: string;
  password: string;
  name: string;
  isAdmin?: boolean;
}

// On a worker thread: a burst of registrations or sign-ins never holds the event loop (offThread/passwords.ts).
export const hashPassword = (password: string, rounds: number): Promise<string> => hashOffThread(password, rounds);
const comparePassword = (password: string, hash: string): Promise<boolean> => compareOffThread(password, hash);

/**
 * Creates the account. Unverified by default: invitations wait until the owner follows the verification
 * link (verifyEmail). The demo seed and scripts create verified accounts.
 */
export async function registerUser(
  db: Knex,
  input: NewUser,
  rounds: number,
  opts: {
    verified?: boolean;
    hash?: string;
    /** Runs in the account's own transaction (the verification mail is queued there, so it is never lost). */
    andThen?: (trx: Knex.Transaction, user: User) => Promise<void>;
  } = {},
): Promise<User> {
  const hash = opts.hash ?? (await hashPassword(input.password, rounds));
  return db.transaction(async (trx) => {
    const taken = await trx('users').where({ email: input.email }).first('id');
    if (taken) throw conflict('An account with this e-mail address already exists');
    const verifiedAt = opts.verified ? now() : null;
    const [row] = await trx('users')
      .insert({
        email: input.email,
        name: input.name,
        password_hash: hash,
        is_admin: input.isAdmin ?? false,
        email_verified_at: verifiedAt,
        created_at: now(),
      })
      .returning<{ id: number }[]>('id');
    if (opts.verified) await acceptInvitations(trx, row.id, input.email);
    await recordAudit(trx, { userId: row.id, action: 'user.register', detail: { email: input.email } });
    const user: User = {
      id: row.id,
      email: input.email,
      name: input.name,
      isAdmin: input.isAdmin ?? false,
      emailVerified: Boolean(opts.verified),
    };
    await opts.andThen?.(trx, user);
    return user;
  });
}

/** Marks the address verified (the link's address must still be the account's) and takes up its invitations. */
export async function verifyEmail(db: Knex, userId: number, email: string): Promise<User> {
  return db.transaction(async (trx) => {
    const row = await trx<UserRow>('users').where({ id: userId }).first();
    if (!row || row.email !== email) throw unprocessable('This verification link is not valid');
    if (row.email_verified_at === null || row.email_verified_at === undefined) {
      await trx('users').where({ id: userId }).update({ email_verified_at: now() });
      await recordAudit(trx, { userId, action: 'user.verify', detail: { email } });
    }
    await acceptInvitations(trx, userId, email);
    return { ...toUser(row), emailVerified: true };
  });
}

// Compared against when the address is unknown, at the same cost as real hashes, so both failures
// take the same time and the reply cannot tell an unknown address from a wrong password.
const dummyHashes = new Map<number, Promise<string>>();
export function dummyHash(rounds: number): Promise<string> {
  let hash = dummyHashes.get(rounds);
  if (!hash) dummyHashes.set(rounds, (hash = hashPassword('no-such-account-placeholder', rounds)));
  return hash;
}
export const WRONG_CREDENTIALS = 'E-mail address or password is wrong';

export async function verifyLogin(
  db: Knex,
  email: string,
  password: string,
  rounds: number,
): Promise<User & { tokenVersion: number }> {
  const row = await db<UserRow>('users').where({ email }).first();
  const ok = await comparePassword(password, row?.password_hash ?? (await dummyHash(rounds)));
  // bcrypt reads 72 bytes: a longer attempt would match on its first 72 alone. Never a stored password.
  const tooLong = Buffer.byteLength(password, 'utf8') > MAX_PASSWORD_BYTES;
  if (!row || !ok || tooLong) throw unauthenticated(WRONG_CREDENTIALS);
  return { ...toUser(row), tokenVersion: Number(row.token_version) };
}

/** Checks the current password, stores the new one and ends every other session. */
export async function changePassword(
  db: Knex,
  userId: number,
  current: string,
  next: string,
  rounds: number,
): Promise<number> {
  const row = await db<UserRow>('users').where({ id: userId }).first();
  if (!row) throw unauthenticated('This account no longer exists');
  const currentOk =
    (await comparePassword(current, row.password_hash)) && Buffer.byteLength(current, 'utf8') <= MAX_PASSWORD_BYTES;
  if (!currentOk) throw unprocessable('The current password is wrong', { field: 'currentPassword' });
  const hash = await hashPassword(next, rounds);
  await db('users').where({ id: userId }).update({ password_hash: hash });
  return endSessions(db, userId, 'user.password');
}
