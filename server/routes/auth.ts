// Accounts: register, verify the address, sign in and out, change the password, who am I (docs/access.md).
import type { Router } from 'express';
import type { Knex } from 'knex';
import {
  changePasswordBodySchema,
  loginBodySchema,
  passwordStrengthBodySchema,
  registerBodySchema,
  verifyEmailBodySchema,
  type AuthResponse,
  type RegisterResponse,
} from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { conflict, HttpError } from '../errors.ts';
import { currentUser, requireAuth } from '../middleware/auth.ts';
import { byBodyEmail, byClient, byUser, limiter } from '../middleware/rateLimits.ts';
import { parseBody } from '../middleware/validate.ts';
import { enqueueMail } from '../mail/mailQueue.ts';
import { accountExistsMessage, verificationMessage } from '../mail/messages.ts';
import { assertStrongPassword, rate } from '../services/passwordStrength.ts';
import { readVerification, signToken, signVerification } from '../services/tokens.ts';
import {
  changePassword,
  endSessions,
  findUserByEmail,
  hashPassword,
  registerUser,
  verifyEmail,
  verifyLogin,
} from '../services/users.ts';
import type { User } from '../../shared/schema/api.ts';

export function registerAuthRoutes(router: Router, ctx: ServerContext): void {
  const { config } = ctx;
  const { limits } = config;
  // Counted per client address (req.ip: the proxy's client with TRUST_PROXY set, docs/access.md). Only
  // failed attempts count, and the window ends: the right password is never locked out for longer.
  const loginLimiter = limiter(ctx, 'login', config.loginRateLimit, byClient, 'Too many failed sign-in attempts', {
    onlyFailures: true,
  });
  const registerLimits = [
    limiter(
      ctx,
      'register-client',
      limits.registerPerClient,
      byClient,
      'Too many registrations from this network address',
    ),
    limiter(
      ctx,
      'register-address',
      limits.registerPerAddress,
      byBodyEmail,
      'Too many registrations for this e-mail address',
    ),
  ];
  const verificationLimits = [
    limiter(ctx, 'mail-user', limits.mailPerUser, byUser, 'Too many e-mails sent from this account'),
    limiter(
      ctx,
      'verify-recipient',
      limits.mailPerRecipient,
      (req) => (req.user ? req.user.email : null),
      'Too many e-mails to this address',
    ),
  ];
  const strengthLimit = limiter(ctx, 'strength', limits.strengthPerClient, byClient, 'Too many password checks');
  const link = (path: string) => `${config.publicUrl}${path}`;
  // Account mail goes through the durable queue (docs/faults.md) like every other mail: a mail server
  // that hangs or is down never holds a registration, and the sender retries.
  const queueVerification = (db: Knex, user: Pick<User, 'id' | 'email'>) =>
    enqueueMail(db, [
      {
        kind: 'account',
        message: verificationMessage({
          to: user.email,
          link: link(
            `/verify-email?token=${encodeURIComponent(signVerification(config.jwtSecret, user.id, user.email))}`,
          ),
        }),
      },
    ]);

  // The same answer whether or not the address has an account: a new one gets a verification link, an
  // existing one a note that it already has an account. No token until the address is verified.
  router.post('/auth/register', ...registerLimits, async (req, res) => {
    const input = parseBody(registerBodySchema, req);
    await assertStrongPassword(input.password, [input.email, input.name]);
    const hash = await hashPassword(input.password, config.bcryptRounds);
    let created: User | null = null;
    if (!(await findUserByEmail(ctx.db, input.email))) {
      try {
        created = await registerUser(ctx.db, input, config.bcryptRounds, { hash, andThen: queueVerification });
      } catch (e) {
        // Registered by a parallel request a moment ago: answered as an existing account.
        if (!(e instanceof HttpError && e.status === 409)) throw e;
      }
    }
    if (!created)
      await enqueueMail(ctx.db, [
        { kind: 'account', message: accountExistsMessage({ to: input.email, signInLink: link('/sign-in') }) },
      ]);
    ctx.outbox.kick();
    const out: RegisterResponse = { status: 'verification-sent', email: input.email };
    res.status(202).json(out);
  });

  router.post('/auth/verify', async (req, res) => {
    const { token } = parseBody(verifyEmailBodySchema, req);
    const { userId, email } = readVerification(config.jwtSecret, token);
    res.json(await verifyEmail(ctx.db, userId, email));
  });

  router.post('/auth/verify/resend', requireAuth(ctx), ...verificationLimits, async (req, res) => {
    const user = currentUser(req);
    if (user.emailVerified) throw conflict('This address is already verified');
    await queueVerification(ctx.db, user);
    ctx.outbox.kick();
    res.status(202).json({ status: 'verification-sent', email: user.email } satisfies RegisterResponse);
  });

  router.post('/auth/login', loginLimiter, async (req, res) => {
    const { email, password } = parseBody(loginBodySchema, req);
    const { tokenVersion, ...user } = await verifyLogin(ctx.db, email, password, config.bcryptRounds);
    const out: AuthResponse = { token: signToken(config.jwtSecret, user.id, tokenVersion), user };
    res.json(out);
  });

  // Ends every session of the account (this one and those on other devices); open sockets are closed.
  router.post('/auth/logout', requireAuth(ctx), async (req, res) => {
    const user = currentUser(req);
    await endSessions(ctx.db, user.id);
    await ctx.broadcaster.sessionsEnded({ userId: user.id });
    res.status(204).end();
  });

  router.post('/auth/password', requireAuth(ctx), async (req, res) => {
    const user = currentUser(req);
    const { currentPassword, newPassword } = parseBody(changePasswordBodySchema, req);
    await assertStrongPassword(newPassword, [user.email, user.name], 'newPassword');
    const tokenVersion = await changePassword(ctx.db, user.id, currentPassword, newPassword, config.bcryptRounds);
    await ctx.broadcaster.sessionsEnded({ userId: user.id });
    const out: AuthResponse = { token: signToken(config.jwtSecret, user.id, tokenVersion), user };
    res.json(out);
  });

  // The client asks here rather than bundling the estimator's dictionaries.
  router.post('/auth/password-strength', strengthLimit, async (req, res) => {
    const { password, email, name } = parseBody(passwordStrengthBodySchema, req);
    res.json(await rate(password, [email ?? '', name ?? '']));
  });

  router.get('/me', requireAuth(ctx), (req, res) => {
    res.json(currentUser(req));
  });
}
