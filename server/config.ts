import { resolve } from 'node:path';

/** Everything the server reads from its environment, resolved once at start. */
export interface ServerConfig {
  port: number;
  /** Where to serve the built client from; none for an API-only server. */
  distDir?: string;
  /** On PostgreSQL, `poolSize` connections at most per instance (`DATABASE_POOL_SIZE`, default 10 as in node-postgres). */
  db: { kind: 'sqlite'; file: string } | { kind: 'postgres'; url: string; poolSize: number };
  /** Create the demo accounts and project on first start. */
  seedDemo: boolean;
  /** The app's public origin: the one CORS origin, and the base of links in e-mails. */
  appOrigin: string;
  jwt: { secret: string; accessTtlSeconds: number; issuer: string };
  refreshTtlDays: number;
  resetTtlMinutes: number;
  invitationTtlDays: number;
  bcryptRounds: number;
  smtp: { host: string; port: number; user?: string; pass?: string; secure: boolean };
  mailFrom: string;
  /** Start the local SMTP sink in-process (and answer /api/mailroom). */
  smtpSink: boolean;
  upload: { maxBytes: number };
  rateLimit: { windowMs: number; login: number; reset: number };
  /** Express `trust proxy` (behind a load balancer), e.g. "1" or "loopback". */
  trustProxy: string | false;
}

export const DEFAULT_SMTP_HOST = '127.0.0.1';
export const DEFAULT_SMTP_PORT = 2525;
const DEV_JWT_SECRET = 'gluefield-development-secret-do-not-use-in-production';

type Env = Record<string, string | undefined>;

/**
 * Read the configuration. Development defaults are safe on one machine
 * (loopback SMTP sink, a database under ./data); in production
 * (NODE_ENV=production) a real JWT_SECRET is required.
 */
export function loadConfig(env: Env = process.env, cwd: string = process.cwd()): ServerConfig {
  const port = int(env, 'PORT', 8080);
  const production = env.NODE_ENV === 'production';
  const secret = env.JWT_SECRET ?? DEV_JWT_SECRET;
  if (production && secret === DEV_JWT_SECRET) throw new Error('JWT_SECRET must be set in production');
  if (secret.length < 32) throw new Error('JWT_SECRET must be at least 32 characters');
  const smtpHost = env.SMTP_HOST ?? DEFAULT_SMTP_HOST;
  const smtpPort = int(env, 'SMTP_PORT', DEFAULT_SMTP_PORT);
  const databaseUrl = env.DATABASE_URL;
  return {
    port,
    db: databaseUrl
      ? { kind: 'postgres', url: databaseUrl, poolSize: positive(env, 'DATABASE_POOL_SIZE', 10) }
      : { kind: 'sqlite', file: resolve(cwd, env.GLUEFIELD_DB ?? './data/gluefield.sqlite') },
    seedDemo: env.GLUEFIELD_SEED_DEMO !== '0',
    appOrigin: (env.APP_ORIGIN ?? `http://localhost:${port}`).replace(/\/+$/, ''),
    jwt: { secret, accessTtlSeconds: int(env, 'JWT_ACCESS_TTL_SECONDS', 15 * 60), issuer: 'gluefield' },
    refreshTtlDays: int(env, 'REFRESH_TTL_DAYS', 30),
    resetTtlMinutes: int(env, 'RESET_TTL_MINUTES', 60),
    invitationTtlDays: int(env, 'INVITATION_TTL_DAYS', 7),
    bcryptRounds: int(env, 'BCRYPT_ROUNDS', 11),
    smtp: {
      host: smtpHost,
      port: smtpPort,
      user: env.SMTP_USER,
      pass: env.SMTP_PASS,
      secure: env.SMTP_SECURE === '1',
    },
    mailFrom: env.MAIL_FROM ?? 'Gluefield <no-reply@gluefield.local>',
    smtpSink: env.SMTP_SINK ? env.SMTP_SINK === '1' : smtpHost === DEFAULT_SMTP_HOST && env.SMTP_PORT === undefined,
    upload: { maxBytes: int(env, 'UPLOAD_MAX_BYTES', 32 * 1024 * 1024) },
    rateLimit: {
      windowMs: int(env, 'RATE_LIMIT_WINDOW_MS', 15 * 60 * 1000),
      login: int(env, 'RATE_LIMIT_LOGIN', 20),
      reset: int(env, 'RATE_LIMIT_RESET', 5),
    },
    trustProxy: env.TRUST_PROXY ?? false,
  };
}

function int(env: Env, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isSafeInteger(value) || value < 0) throw new Error(`${name} must be a non-negative integer, not ${JSON.stringify(raw)}`);
  return value;
}

function positive(env: Env, name: string, fallback: number): number {
  const value = int(env, name, fallback);
  if (value === 0) throw new Error(`${name} must be at least 1`);
  return value;
}
