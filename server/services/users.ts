// Accounts: registration, sign-in and look-up. Passwords are bcrypt hashes.
import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import { conflict, unauthenticated } from '../errors.ts';
import { now } from '../db.ts';
import { acceptInvitations } from './members.ts';
import { recordAudit } from './audit.ts';

interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
  is_admin: boolean | number;
}

export const toUser = (row: Pick<UserRow, 'id' | 'email' | 'name' | 'is_admin'>): User => ({
  id: row.id,
  email: row.email,
  name: row.name,
  isAdmin: Boolean(row.is_admin),
});

export async function findUserById(db: Knex, id: number): Promise<User | null> {
  const row = await db<UserRow>('users').where({ id }).first();
  return row ? toUser(row) : null;
}

export async function findUserByEmail(db: Knex, email: string): Promise<User | null> {
  const row = await db<UserRow>('users').where({ email }).first();
  return row ? toUser(row) : null;
}

export interface NewUser {
  email: string;
  password: string;
  name: string;
  isAdmin?: boolean;
}

/** Creates the account and turns pending invitations for its address into memberships. */
export async function registerUser(db: Knex, input: NewUser, rounds: number): Promise<User> {
  const hash = await bcrypt.hash(input.password, rounds);
  return db.transaction(async (trx) => {
    const taken = await trx('users').where({ email: input.email }).first('id');
    if (taken) throw conflict('An account with this e-mail address already exists');
    const [row] = await trx('users')
      .insert({ email: input.email, name: input.name, password_hash: hash, is_admin: input.isAdmin ?? false, created_at: now() })
      .returning<{ id: number }[]>('id');
    await acceptInvitations(trx, row.id, input.email);
    await recordAudit(trx, { userId: row.id, action: 'user.register', detail: { email: input.email } });
    return { id: row.id, email: input.email, name: input.name, isAdmin: input.isAdmin ?? false };
  });
}

// Compared against when the address is unknown, at the same cost as real hashes, so both failures
// take the same time and the reply cannot tell an unknown address from a wrong password.
const dummyHashes = new Map<number, string>();
function dummyHash(rounds: number): string {
  let hash = dummyHashes.get(rounds);
  if (!hash) dummyHashes.set(rounds, (hash = bcrypt.hashSync('no-such-account-placeholder', rounds)));
  return hash;
}
export const WRONG_CREDENTIALS = 'E-mail address or password is wrong';

export async function verifyLogin(db: Knex, email: string, password: string, rounds: number): Promise<User> {
  const row = await db<UserRow>('users').where({ email }).first();
  const ok = await bcrypt.compare(password, row?.password_hash ?? dummyHash(rounds));
  if (!row || !ok) throw unauthenticated(WRONG_CREDENTIALS);
  return toUser(row);
}
