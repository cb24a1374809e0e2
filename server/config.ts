// Server configuration, read once from the environment with safe defaults.
import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';

export interface Config {
  port: number;
  dataDir: string;
  databaseUrl: string | null;
  /** PostgreSQL schema to work in (created when missing); null uses the connection's default. */
  databaseSchema: string | null;
  /** Redis for Socket.IO's adapter: processes share live rooms (docs/live-protocol.md §Several processes). */
  redisUrl: string | null;
  /** Prefix of every Redis key and channel this deployment uses. */
  redisPrefix: string;
  jwtSecret: string;
  smtpUrl: string | null;
  mailFrom: string;
  /** The durable mail outbox (docs/faults.md): SMTP time bounds, retries with back-off, how often it looks. */
  mail: { timeoutMs: number; retryBaseMs: number; maxAttempts: number; pollMs: number; leaseMs: number };
  logLevel: string;
  bcryptRounds: number;
  /** Login attempts allowed per IP address in each window. */
  loginRateLimit: { windowMs: number; max: number };
  /** Rate limits of sign-up and of every route that sends e-mail (docs/access.md). */
  limits: Limits;
  /**
   * Where the people who receive our e-mails open Stanchion (links in verification, invitation and
   * revision e-mails). Configured, never taken from a request header.
   */
  publicUrl: string;
  /** Days a pending invitation can be taken up. */
  invitationDays: number;
  /** Express 'trust proxy' setting; null leaves it off. */
  trustProxy: string | number | boolean | null;
  production: boolean;
  version: string;
  /** Built client served by the API process. */
  distDir: string;
}

/** At most `max` in each window of `windowMs`. */
export interface Limit {
  windowMs: number;
  max: number;
}

export interface Limits {
  /** Registrations per client (IP) address. */
  registerPerClient: Limit;
  /** Registrations (and so verification or "you already have an account" e-mails) per e-mail address. */
  registerPerAddress: Limit;
  /** E-mail-sending actions per signed-in user: invitations, verification links, revision mail. */
  mailPerUser: Limit;
  /** Invitation e-mails per building. */
  invitesPerBuilding: Limit;
  /** Invitation and verification e-mails per recipient address. */
  mailPerRecipient: Limit;
  /** Password-strength checks per client address (the check costs a few milliseconds of CPU). */
  strengthPerClient: Limit;
}

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
export const DEFAULT_LIMITS: Limits = {
  registerPerClient: { windowMs: HOUR, max: 10 },
  registerPerAddress: { windowMs: HOUR, max: 3 },
  mailPerUser: { windowMs: HOUR, max: 30 },
  invitesPerBuilding: { windowMs: DAY, max: 20 },
  mailPerRecipient: { windowMs: DAY, max: 5 },
  strengthPerClient: { windowMs: 60_000, max: 60 },
};

/** A public URL: http or https only (a javascript: or data: link in an e-mail would be an attack). */
export const publicUrlSchema = z
  .string()
  .url('PUBLIC_URL must be an absolute URL')
  .refine(
    (u) => URL.canParse(u) && /^https?:$/.test(new URL(u).protocol),
    'PUBLIC_URL must start with http:// or https://',
  )
  .transform((u) => u.replace(/\/+$/, ''));

const intFromEnv = (fallback: number, min: number, max: number) =>
  z.coerce.number().int().min(min).max(max).default(fallback);

const envSchema = z.object({
  PORT: intFromEnv(3000, 0, 65535),
  DATA_DIR: z.string().min(1).default('./data'),
  DATABASE_URL: z.string().min(1).optional(),
  DATABASE_SCHEMA: z
    .string()
    .regex(/^[a-z_][a-z0-9_]{0,62}$/, 'DATABASE_SCHEMA must be a plain lower-case identifier')
    .optional(),
  REDIS_URL: z.string().min(1).optional(),
  REDIS_PREFIX: z.string().min(1).max(100).default('stanchion'),
  JWT_SECRET: z.string().min(16, 'JWT_SECRET must be at least 16 characters').optional(),
  SMTP_URL: z.string().min(1).optional(),
  MAIL_FROM: z.string().min(3).default('Stanchion <no-reply@stanchion.test>'),
  MAIL_TIMEOUT_MS: intFromEnv(15_000, 100, 600_000),
  MAIL_RETRY_BASE_MS: intFromEnv(30_000, 10, 3_600_000),
  MAIL_MAX_ATTEMPTS: intFromEnv(8, 1, 100),
  MAIL_POLL_MS: intFromEnv(2000, 10, 600_000),
  /** How long a claimed send is held before another process may take it (default: 4 × timeout + 2 min). */
  MAIL_LEASE_MS: z.coerce.number().int().min(1000).max(86_400_000).optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  // bcrypt cost 10 in production; tests lower it to 4 to stay fast.
  BCRYPT_ROUNDS: intFromEnv(10, 4, 15),
  LOGIN_RATE_LIMIT: intFromEnv(20, 1, 100_000),
  LOGIN_RATE_WINDOW_MS: intFromEnv(60_000, 1000, 86_400_000),
  TRUST_PROXY: z.string().optional(),
  PUBLIC_URL: publicUrlSchema.optional(),
  INVITATION_DAYS: intFromEnv(14, 1, 365),
  REGISTER_RATE_LIMIT: intFromEnv(DEFAULT_LIMITS.registerPerClient.max, 1, 100_000),
  MAIL_RATE_LIMIT: intFromEnv(DEFAULT_LIMITS.mailPerUser.max, 1, 100_000),
  NODE_ENV: z.string().optional(),
});

export type ConfigOverrides = Partial<Omit<Config, 'jwtSecret'>> & { jwtSecret?: string };

/** Reads the secret from DATA_DIR, generating it once (mode 600) when neither env nor file has one. */
export function loadOrCreateJwtSecret(dataDir: string): string {
  const file = resolve(dataDir, 'jwt-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, secret, { mode: 0o600, flag: 'wx' });
  chmodSync(file, 0o600);
  return secret;
}

function parseTrustProxy(value: string | undefined): Config['trustProxy'] {
  if (value === undefined || value === '') return null;
  if (value === 'true') return true;
  if (value === 'false') return false;
  const n = Number(value);
  return Number.isInteger(n) ? n : value;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env, overrides: ConfigOverrides = {}): Config {
  const e = envSchema.parse(env);
  const dataDir = resolve(overrides.dataDir ?? e.DATA_DIR);
  const version = overrides.version ?? readVersion();
  const { jwtSecret, ...rest } = overrides;
  return {
    port: e.PORT,
    databaseUrl: e.DATABASE_URL ?? null,
    databaseSchema: e.DATABASE_SCHEMA ?? null,
    redisUrl: e.REDIS_URL ?? null,
    redisPrefix: e.REDIS_PREFIX,
    smtpUrl: e.SMTP_URL ?? null,
    mailFrom: e.MAIL_FROM,
    mail: {
      timeoutMs: e.MAIL_TIMEOUT_MS,
      retryBaseMs: e.MAIL_RETRY_BASE_MS,
      maxAttempts: e.MAIL_MAX_ATTEMPTS,
      pollMs: e.MAIL_POLL_MS,
      leaseMs: e.MAIL_LEASE_MS ?? 4 * e.MAIL_TIMEOUT_MS + 120_000,
    },
    logLevel: e.LOG_LEVEL,
    bcryptRounds: e.BCRYPT_ROUNDS,
    loginRateLimit: { windowMs: e.LOGIN_RATE_WINDOW_MS, max: e.LOGIN_RATE_LIMIT },
    trustProxy: parseTrustProxy(e.TRUST_PROXY),
    limits: {
      ...DEFAULT_LIMITS,
      registerPerClient: { ...DEFAULT_LIMITS.registerPerClient, max: e.REGISTER_RATE_LIMIT },
      mailPerUser: { ...DEFAULT_LIMITS.mailPerUser, max: e.MAIL_RATE_LIMIT },
    },
    publicUrl: e.PUBLIC_URL ?? `http://localhost:${overrides.port || e.PORT}`,
    invitationDays: e.INVITATION_DAYS,
    production: e.NODE_ENV === 'production',
    distDir: fileURLToPath(new URL('../dist', import.meta.url)),
    ...rest,
    dataDir,
    version,
    jwtSecret: jwtSecret ?? e.JWT_SECRET ?? loadOrCreateJwtSecret(dataDir),
  };
}

function readVersion(): string {
  const pkg = z
    .object({ version: z.string() })
    .safeParse(JSON.parse(readFileSync(fileURLToPath(new URL('../package.json', import.meta.url)), 'utf8')));
  return pkg.success ? pkg.data.version : '0.0.0';
}
