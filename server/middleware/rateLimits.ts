// Rate limits of sign-up and of every route that sends e-mail (docs/access.md). Each is counted in Redis
// when processes share it (as the sign-in limit is), so a second process is never a second allowance;
// keys are the client address (behind a proxy only with TRUST_PROXY set), the signed-in user, the
// building or the recipient address.
import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Limit } from '../config.ts';
import type { ServerContext } from '../context.ts';
import { HttpError } from '../errors.ts';
import { signInLimitStore } from './signInLimitStore.ts';

/** What a limit is counted by; null skips the limit for this request (e.g. no address in the body). */
export type LimitKey = (req: Request) => string | null;

export const byClient: LimitKey = (req) => ipKeyGenerator(req.ip ?? 'unknown');
export const byUser: LimitKey = (req) => (req.user ? String(req.user.id) : null);
export const byBuilding: LimitKey = (req) => (typeof req.params.id === 'string' ? req.params.id : null);
/** The e-mail address in the body, normalised as emailSchema does; malformed bodies are refused later. */
export const byBodyEmail: LimitKey = (req) => {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' && email.trim() !== '' ? email.trim().toLowerCase().slice(0, 254) : null;
};

const made = new WeakMap<ServerContext, Map<string, RequestHandler>>();

/** One limiter per name and server: routes naming the same limit share its count (so they must share its key). */
export function limiter(
  ctx: ServerContext,
  name: string,
  limit: Limit,
  key: LimitKey,
  message: string,
  opts: { onlyFailures?: boolean } = {},
): RequestHandler {
  const mine = made.get(ctx) ?? new Map<string, RequestHandler>();
  made.set(ctx, mine);
  const known = mine.get(name);
  if (known) return known;
  const handler = makeLimiter(ctx, name, limit, key, message, opts);
  mine.set(name, handler);
  return handler;
}

function makeLimiter(
  ctx: ServerContext,
  name: string,
  limit: Limit,
  key: LimitKey,
  message: string,
  opts: { onlyFailures?: boolean },
): RequestHandler {
  const { redis } = ctx;
  const minutes = Math.max(1, Math.round(limit.windowMs / 60_000));
  return rateLimit({
    // Fails safe while Redis is away: a 503 at once, never a crash or a long wait (docs/faults.md).
    ...(redis
      ? {
          store: signInLimitStore(
            redis,
            `${ctx.config.redisPrefix}#${name}:`,
            name === 'login' ? 'Sign-in' : 'This action',
          ),
        }
      : {}),
    windowMs: limit.windowMs,
    limit: limit.max,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: opts.onlyFailures ?? false,
    skip: (req) => key(req) === null,
    keyGenerator: (req) => key(req) ?? '',
    handler: (_req, _res, next) =>
      next(
        new HttpError(429, 'rate_limited', `${message}; try again within ${minutes} minute${minutes === 1 ? '' : 's'}`),
      ),
  });
}
