// Signed JWTs (docs/access.md). Session tokens expire after 12 hours and carry the user's session
// version, so signing out everywhere or changing the password ends every older token at once.
// Verification tokens prove the owner of an address followed the link we mailed to it. Each kind has its
// own audience, so one can never be used as the other.
import jwt from 'jsonwebtoken';
import { z } from 'zod';
import { unauthenticated, unprocessable } from '../errors.ts';

export const TOKEN_LIFETIME = '12h';
export const VERIFY_LIFETIME = '48h';
const SESSION = 'stanchion-session';
const VERIFY = 'stanchion-verify-email';

const sessionClaimsSchema = z.object({ sub: z.string().regex(/^\d+$/), tv: z.number().int().min(0), exp: z.number() });
const verifyClaimsSchema = z.object({ sub: z.string().regex(/^\d+$/), email: z.string().max(254) });

export interface SessionClaims {
  userId: number;
  /** The user's session version when the token was made (users.token_version). */
  tokenVersion: number;
  /** When the token stops being accepted, ms since the epoch. */
  expiresAt: number;
}

/** lifetimeSeconds: shorter sessions for tests of expiry; TOKEN_LIFETIME otherwise. */
export function signToken(secret: string, userId: number, tokenVersion = 0, lifetimeSeconds?: number): string {
  const expiresIn = lifetimeSeconds ?? TOKEN_LIFETIME;
  return jwt.sign({ tv: tokenVersion }, secret, {
    subject: String(userId),
    expiresIn,
    algorithm: 'HS256',
    audience: SESSION,
  });
}

/** The claims of a valid session token; a bad, expired or foreign token is a 401. */
export function verifySession(secret: string, token: string): SessionClaims {
  let payload: unknown;
  try {
    payload = jwt.verify(token, secret, { algorithms: ['HS256'], audience: SESSION });
  } catch (e) {
    const expired = e instanceof jwt.TokenExpiredError;
    throw unauthenticated(expired ? 'Your session has expired; sign in again' : 'Invalid session token');
  }
  const claims = sessionClaimsSchema.safeParse(payload);
  if (!claims.success) throw unauthenticated('Invalid session token');
  return { userId: Number(claims.data.sub), tokenVersion: claims.data.tv, expiresAt: claims.data.exp * 1000 };
}

/** The user id in a valid session token. */
export function verifyToken(secret: string, token: string): number {
  return verifySession(secret, token).userId;
}

export function signVerification(secret: string, userId: number, email: string): string {
  return jwt.sign({ email }, secret, {
    subject: String(userId),
    expiresIn: VERIFY_LIFETIME,
    algorithm: 'HS256',
    audience: VERIFY,
  });
}

/** The account and address a verification link was made for; an old or altered link is a 422. */
export function readVerification(secret: string, token: string): { userId: number; email: string } {
  let payload: unknown;
  try {
    payload = jwt.verify(token, secret, { algorithms: ['HS256'], audience: VERIFY });
  } catch (e) {
    const expired = e instanceof jwt.TokenExpiredError;
    throw unprocessable(
      expired
        ? 'This verification link has expired; sign in and ask for a new one'
        : 'This verification link is not valid',
    );
  }
  const claims = verifyClaimsSchema.safeParse(payload);
  if (!claims.success) throw unprocessable('This verification link is not valid');
  return { userId: Number(claims.data.sub), email: claims.data.email };
}
