// Session tokens: signed JWTs that expire after 12 hours.
import jwt from 'jsonwebtoken';
import { z } from 'zod';
import { unauthenticated } from '../errors.ts';

export const TOKEN_LIFETIME = '12h';
const claimsSchema = z.object({ sub: z.string().regex(/^\d+$/) });

export function signToken(secret: string, userId: number): string {
  return jwt.sign({}, secret, { subject: String(userId), expiresIn: TOKEN_LIFETIME, algorithm: 'HS256' });
}

/** The user id in a valid token; a bad, expired or foreign token is a 401. */
export function verifyToken(secret: string, token: string): number {
  let payload: unknown;
  try {
    payload = jwt.verify(token, secret, { algorithms: ['HS256'] });
  } catch (e) {
    const expired = e instanceof jwt.TokenExpiredError;
    throw unauthenticated(expired ? 'Your session has expired; sign in again' : 'Invalid session token');
  }
  const claims = claimsSchema.safeParse(payload);
  if (!claims.success) throw unauthenticated('Invalid session token');
  return Number(claims.data.sub);
}
