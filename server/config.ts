/**
 * Server configuration: read from the environment once at boot, checked with zod.
 * A bad value stops the server with a message naming the variable, never a half-working start.
 */
import { dirname, join } from 'node:path';
import { z } from 'zod';

const Bool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'], { error: 'Use true or false' })
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const Port = z.coerce
  .number({ error: 'Use a port number' })
  .int('Use a whole port number')
  .min(0, 'Use a port from 0 to 65535')
  .max(65535, 'Use a port from 0 to 65535');

const Hours = z.coerce
  .number({ error: 'Use a number of hours' })
  .positive('Use more than 0 hours')
  .max(8760, 'Use at most 8760 hours (a year)');

const Count = (what: string) =>
  z.coerce
    .number({ error: `Use a number of ${what}` })
    .int()
    .min(1, `Allow at least 1 ${what}`);

const EnvSchema = z.object({
  PORT: Port.default(3000),
  // Loopback by default: a fresh clone is not reachable from the network until someone chooses so.
  HOST: z.string().trim().min(1, 'HOST may not be empty').default('127.0.0.1'),
  DATABASE_FILE: z.string().trim().min(1, 'DATABASE_FILE may not be empty').default('data/leadbench.sqlite'),
  SESSION_SECURE: Bool.default(false),
  /** Replaced by the two SESSION_*_HOURS variables; refused so an old setting is not silently ignored. */
  SESSION_DAYS: z
    .never({ error: 'SESSION_DAYS was replaced: use SESSION_ABSOLUTE_HOURS and SESSION_IDLE_HOURS' })
    .optional(),
  /** A session ends this many hours after sign-in, however busy. */
  SESSION_ABSOLUTE_HOURS: Hours.default(720),
  /** A session ends after this many hours without a request. */
  SESSION_IDLE_HOURS: Hours.default(168),
  NODE_ENV: z.string().optional(),
  /** Sign-up sends a confirmation link before the account can sign in. Default: on in production. */
  EMAIL_VERIFICATION: Bool.optional(),
  PUBLIC_ORIGIN: z
    .url({ protocol: /^https?$/, error: 'Use an origin like https://bench.example.org' })
    .optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  MAIL_HOST: z.string().trim().min(1).optional(),
  MAIL_PORT: Port.optional(),
  MAIL_FROM: z.string().trim().min(3).default('Leadbench <bench@leadbench.test>'),
  /** Demo accounts on an empty database. Default: on, except with NODE_ENV=production. */
  SEED_DEMO: Bool.optional(),
  /**
   * Reverse proxies in front of the app, as a hop count: the client address is taken that many entries
   * from the right of X-Forwarded-For, so entries a client adds itself are never believed.
   */
  TRUST_PROXY: z
    .string()
    .regex(/^(false|\d{1,2})$/, { error: 'Use a number of proxy hops (0 when there is no proxy)' })
    .default('0')
    .transform((v) => (v === 'false' ? 0 : Number(v))),
  /** Failed sign-ins per account, and per client address, in one 15-minute window. */
  SIGN_IN_FAILURES_PER_ACCOUNT: Count('failures').default(10),
  SIGN_IN_FAILURES_PER_ADDRESS: Count('failures').default(100),
  /** Sign-up and reset-mail requests allowed per client address in one 15-minute window. */
  RATE_LIMIT_MAX: z.coerce
    .number({ error: 'Use a number of attempts' })
    .int()
    .min(1, 'Allow at least 1 attempt')
    .default(20),
  /** Plan saves, renames and deletions allowed per account per minute. */
  PLAN_WRITES_PER_MINUTE: z.coerce
    .number({ error: 'Use a number of writes' })
    .int()
    .min(1, 'Allow at least 1 write')
    .default(60),
  /** Folder of the built client; the repository's dist/ when unset. */
  CLIENT_DIR: z.string().trim().min(1).optional(),
  /** Plans one account may keep (recently deleted ones not counted). */
  PLAN_QUOTA_COUNT: Count('plans').default(200),
  /** Bytes of plan documents and photos one account may keep. */
  PLAN_QUOTA_BYTES: Count('bytes').default(200 * 1024 * 1024),
  /** Sets in one plan: the engine's speed targets are met up to here (tests/bench/engine.bench.ts). */
  PLAN_MAX_SETS: Count('sets').max(200, 'The plan format holds at most 200 sets').default(60),
  /** Largest plan file accepted for import, in bytes. */
  PLAN_IMPORT_MAX_BYTES: Count('bytes').default(1024 * 1024),
  /** Largest photo accepted, in bytes. */
  PHOTO_MAX_BYTES: Count('bytes').default(10 * 1024 * 1024),
  /** Folder for photos; next to the database file when unset. */
  PHOTO_DIR: z.string().trim().min(1).optional(),
});

export interface Config {
  port: number;
  host: string;
  databaseFile: string;
  sessionSecure: boolean;
  sessionAbsoluteHours: number;
  sessionIdleHours: number;
  production: boolean;
  emailVerification: boolean;
  signInThrottle: { windowMs: number; perAccount: number; perAddress: number };
  /** Scheme, host and port browsers use to reach the app; state-changing requests must come from it. */
  publicOrigin: string;
  logLevel: z.infer<typeof EnvSchema>['LOG_LEVEL'];
  /** When null the server starts its own fake SMTP server and keeps the messages in memory. */
  mail: { host: string; port: number } | null;
  mailFrom: string;
  seedDemo: boolean;
  authRateLimit: { windowMs: number; limit: number };
  planWritesPerMinute: number;
  /** Express "trust proxy" hop count: client addresses (for limits and logs) from X-Forwarded-For. */
  trustProxy: number;
  /** Folder of the built client, when not the default dist/. */
  clientDir?: string;
  plans: { maxPlans: number; maxBytes: number; maxSets: number; importMaxBytes: number };
  photos: { maxBytes: number; dir: string };
}

export class ConfigError extends Error {}

export function loadConfig(env: Record<string, string | undefined> = process.env): Config {
  // Treat empty strings like unset variables so `PORT= npm start` behaves as expected.
  const present = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ''));
  const parsed = EnvSchema.safeParse(present);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.') || '(env)'}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const production = e.NODE_ENV === 'production';
  const origin = e.PUBLIC_ORIGIN ? new URL(e.PUBLIC_ORIGIN).origin : `http://localhost:${e.PORT}`;
  return {
    port: e.PORT,
    host: e.HOST,
    databaseFile: e.DATABASE_FILE,
    sessionSecure: e.SESSION_SECURE,
    sessionAbsoluteHours: e.SESSION_ABSOLUTE_HOURS,
    sessionIdleHours: Math.min(e.SESSION_IDLE_HOURS, e.SESSION_ABSOLUTE_HOURS),
    production,
    emailVerification: e.EMAIL_VERIFICATION ?? production,
    signInThrottle: {
      windowMs: 15 * 60_000,
      perAccount: e.SIGN_IN_FAILURES_PER_ACCOUNT,
      perAddress: e.SIGN_IN_FAILURES_PER_ADDRESS,
    },
    publicOrigin: origin,
    logLevel: e.LOG_LEVEL,
    mail: e.MAIL_HOST ? { host: e.MAIL_HOST, port: e.MAIL_PORT ?? 25 } : null,
    mailFrom: e.MAIL_FROM,
    seedDemo: e.SEED_DEMO ?? !production,
    authRateLimit: { windowMs: 15 * 60_000, limit: e.RATE_LIMIT_MAX },
    planWritesPerMinute: e.PLAN_WRITES_PER_MINUTE,
    trustProxy: e.TRUST_PROXY,
    clientDir: e.CLIENT_DIR,
    plans: {
      maxPlans: e.PLAN_QUOTA_COUNT,
      maxBytes: e.PLAN_QUOTA_BYTES,
      maxSets: e.PLAN_MAX_SETS,
      importMaxBytes: e.PLAN_IMPORT_MAX_BYTES,
    },
    photos: { maxBytes: e.PHOTO_MAX_BYTES, dir: e.PHOTO_DIR ?? join(dirname(e.DATABASE_FILE), 'photos') },
  };
}
