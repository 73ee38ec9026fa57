import { availableParallelism } from 'node:os';
import { dirname } from 'node:path';
import type { SignInLimits } from './accounts/auth-setup';
import { DEFAULT_ENGINE_MODULE } from './compute/supervisor';

export interface AppConfig {
  /** SQLite file (DUBITO_DB); created with its folder on first start. */
  dbFile: string;
  /** Where attachments are stored by hash (DUBITO_DATA_DIR, default: the folder of the database). */
  dataDir: string;
  /** Base of the links in e-mails (DUBITO_PUBLIC_URL). */
  publicUrl: string;
  /** Origins besides the request's own host that may send state-changing requests (DUBITO_ALLOWED_ORIGINS, comma-separated). */
  allowedOrigins: string[];
  /** SMTP server (SMTP_URL); unset: an in-process fake server on loopback fills the outbox. */
  smtpUrl?: string;
  mailFrom: string;
  /** Cookie signing secret (DUBITO_SESSION_SECRET); unset: generated once and kept in the database. */
  sessionSecret?: string;
  cookieSecure: boolean;
  sessionMaxAgeMs: number;
  trustProxy: boolean | number;
  /** Upper bound on Monte Carlo trials per saved version (DUBITO_TRIALS_CAP, default 10⁶: the default trials of a budget). */
  trialsCap: number;
  computeWorkers: number;
  /** Deadline of a computation, a report or a diff, counted from when it is accepted (DUBITO_COMPUTE_TIMEOUT_MS). */
  computeTimeoutMs: number;
  /** Jobs waiting for a worker; more answer 503 (DUBITO_COMPUTE_QUEUE). */
  computeQueueLength: number;
  /** Jobs of one user running or waiting; more answer 429 (DUBITO_COMPUTE_JOBS_PER_USER). */
  computeJobsPerUser: number;
  /** V8 heap of each compute worker in MiB (DUBITO_WORKER_HEAP_MB). */
  workerHeapMb: number;
  /** Largest stored version (document and result text) a report is built from. */
  reportMaxBytes: number;
  /** Largest pair of stored versions a diff compares. */
  diffMaxBytes: number;
  /** URL of the module exporting computeBudget. */
  engineModule: string;
  signIn: SignInLimits;
  jsonLimitBytes: number;
  importMaxBytes: number;
  observationsMaxBytes: number;
  attachmentMaxBytes: number;
  invitationHours: number;
  resetHours: number;
  /** Built client to serve, with the SPA fallback (start.ts sets it to dist/). */
  staticDir?: string;
  log: (msg: string, err?: unknown) => void;
}

const MB = 1024 * 1024;

function int(v: string | undefined, fallback: number): number {
  const n = v === undefined || v === '' ? NaN : Number(v);
  return Number.isInteger(n) && n > 0 ? n : fallback;
}

function defaultLog(msg: string, err?: unknown): void {
  if (err === undefined) console.log(`[dubito] ${msg}`);
  else console.error(`[dubito] ${msg}:`, err);
}

/** Configuration from the environment, with explicit overrides (tests pass theirs). */
export function loadConfig(env: NodeJS.ProcessEnv = process.env, overrides: Partial<AppConfig> = {}): AppConfig {
  const dbFile = overrides.dbFile ?? env.DUBITO_DB ?? 'data/dubito.sqlite';
  const port = int(env.PORT, 3000);
  const production = env.NODE_ENV === 'production';
  const base: AppConfig = {
    dbFile,
    dataDir: env.DUBITO_DATA_DIR ?? dirname(dbFile),
    publicUrl: (env.DUBITO_PUBLIC_URL ?? `http://localhost:${port}`).replace(/\/+$/, ''),
    allowedOrigins: (env.DUBITO_ALLOWED_ORIGINS ?? '')
      .split(',')
      .map((s) => s.trim())
      .filter(Boolean),
    smtpUrl: env.SMTP_URL || undefined,
    mailFrom: env.DUBITO_MAIL_FROM ?? 'Dubito <dubito@localhost>',
    sessionSecret: env.DUBITO_SESSION_SECRET || undefined,
    cookieSecure: env.DUBITO_COOKIE_SECURE ? env.DUBITO_COOKIE_SECURE === '1' : production,
    sessionMaxAgeMs: int(env.DUBITO_SESSION_HOURS, 12) * 60 * 60 * 1000,
    trustProxy: env.DUBITO_TRUST_PROXY ? (/^\d+$/.test(env.DUBITO_TRUST_PROXY) ? Number(env.DUBITO_TRUST_PROXY) : env.DUBITO_TRUST_PROXY === 'true') : false,
    trialsCap: int(env.DUBITO_TRIALS_CAP, 1_000_000),
    computeWorkers: int(env.DUBITO_COMPUTE_WORKERS, Math.max(1, Math.min(2, availableParallelism() - 1))),
    computeTimeoutMs: int(env.DUBITO_COMPUTE_TIMEOUT_MS, 120_000),
    computeQueueLength: int(env.DUBITO_COMPUTE_QUEUE, 8),
    computeJobsPerUser: int(env.DUBITO_COMPUTE_JOBS_PER_USER, 2),
    workerHeapMb: int(env.DUBITO_WORKER_HEAP_MB, 512),
    reportMaxBytes: 8 * MB,
    diffMaxBytes: 16 * MB,
    engineModule: DEFAULT_ENGINE_MODULE,
    signIn: {
      windowMs: 15 * 60 * 1000,
      perAddress: int(env.DUBITO_SIGNIN_PER_ADDRESS, 30),
      freeFailures: int(env.DUBITO_SIGNIN_FREE_FAILURES, 5),
      firstDelayMs: int(env.DUBITO_SIGNIN_DELAY_SECONDS, 2) * 1000,
      maxDelayMs: int(env.DUBITO_SIGNIN_MAX_DELAY_SECONDS, 15 * 60) * 1000,
    },
    jsonLimitBytes: 8 * MB,
    importMaxBytes: 8 * MB,
    observationsMaxBytes: 2 * MB,
    attachmentMaxBytes: 10 * MB,
    invitationHours: 72,
    resetHours: 2,
    log: defaultLog,
  };
  return { ...base, ...overrides };
}

/** Why a sign-in over plain HTTP is refused when session cookies are Secure (the browser would drop the cookie). */
export const PLAIN_HTTP_SIGN_IN =
  'this sign-in came over plain HTTP, but the session cookie is marked Secure (DUBITO_COOKIE_SECURE, on with NODE_ENV=production) ' +
  'and a browser keeps it only over HTTPS, so you would be signed out at once. Open Dubito at its https:// address; ' +
  'behind a TLS-terminating proxy, set DUBITO_TRUST_PROXY so the server believes the proxy’s X-Forwarded-Proto: https';

/** The configuration cannot work; the message says what to set. */
export class StartRefused extends Error {}

/**
 * Why this configuration cannot sign anybody in, or null. The server itself speaks plain HTTP:
 * with Secure cookies it needs a TLS-terminating proxy in front and DUBITO_TRUST_PROXY to see
 * that the browser's connection was HTTPS.
 */
export function startProblem(c: Pick<AppConfig, 'cookieSecure' | 'trustProxy'>): string | null {
  if (!c.cookieSecure || c.trustProxy !== false) return null;
  return (
    'secure session cookies are on (NODE_ENV=production or DUBITO_COOKIE_SECURE=1) but DUBITO_TRUST_PROXY is off. ' +
    'Dubito serves plain HTTP; browsers keep a Secure cookie only over HTTPS, so every sign-in would answer 200 and sign nobody in. ' +
    'Put a TLS-terminating reverse proxy in front (HTTPS) and set DUBITO_TRUST_PROXY=1 (the number of proxies) so the server sees X-Forwarded-Proto: https; ' +
    'or, on a closed test network without TLS only, set DUBITO_COOKIE_SECURE=0'
  );
}
