// Accounts: register, sign in, who am I (issue 2).
import type { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { loginBodySchema, registerBodySchema, type AuthResponse } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { HttpError } from '../errors.ts';
import { currentUser, requireAuth } from '../middleware/auth.ts';
import { signInLimitStore } from '../middleware/signInLimitStore.ts';
import { parseBody } from '../middleware/validate.ts';
import { signToken } from '../services/tokens.ts';
import { registerUser, verifyLogin } from '../services/users.ts';

export function registerAuthRoutes(router: Router, ctx: ServerContext): void {
  const { redis } = ctx;
  const loginLimiter = rateLimit({
    // Counted in Redis when processes share it, so a second process is not a second allowance.
    ...(redis ? { store: signInLimitStore(redis, `${ctx.config.redisPrefix}#login:`) } : {}),
    windowMs: ctx.config.loginRateLimit.windowMs,
    limit: ctx.config.loginRateLimit.max,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new HttpError(429, 'rate_limited', 'Too many sign-in attempts; wait a minute and try again')),
  });

  router.post('/auth/register', async (req, res) => {
    const input = parseBody(registerBodySchema, req);
    const user = await registerUser(ctx.db, input, ctx.config.bcryptRounds);
    const out: AuthResponse = { token: signToken(ctx.config.jwtSecret, user.id), user };
    res.status(201).json(out);
  });

  router.post('/auth/login', loginLimiter, async (req, res) => {
    const { email, password } = parseBody(loginBodySchema, req);
    const user = await verifyLogin(ctx.db, email, password, ctx.config.bcryptRounds);
    const out: AuthResponse = { token: signToken(ctx.config.jwtSecret, user.id), user };
    res.json(out);
  });

  router.get('/me', requireAuth(ctx), (req, res) => {
    res.json(currentUser(req));
  });
}
