import { z } from 'zod';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('0.0.0.0'),
  APP_URL: z.url().optional(),
  DATABASE_URL: z.string().min(1).default('./data/swapyard.db'),
  UPLOAD_DIR: z.string().min(1).default('./data/uploads'),
  /** where `npm run export:dump` writes the daily gzipped open-data files, served at /dumps/ */
  DUMP_DIR: z.string().min(1).default('./data/dumps'),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  GITHUB_CLIENT_ID: z.string().min(1).optional(),
  GITHUB_CLIENT_SECRET: z.string().min(1).optional(),
  AUTH_PROVIDER: z.enum(['github', 'fake']).optional(),
  /** requests to /auth/* per client address in 15 minutes */
  AUTH_RATE_LIMIT: z.coerce.number().int().min(1).default(300),
  /** per signed-in member and hour: new submissions and sends to review, and photo upload requests */
  SUBMISSION_RATE_LIMIT: z.coerce.number().int().min(1).default(60),
  UPLOAD_RATE_LIMIT: z.coerce.number().int().min(1).default(120),
  /** photos a member may keep unpublished (drafts, sent back, in review) and on fitted reports, in MB */
  STORAGE_QUOTA_MB: z.coerce.number().positive().default(200),
  /** a draft untouched this many days gets an e-mail; untouched DRAFT_NOTICE_DAYS later, it is removed */
  DRAFT_IDLE_DAYS: z.coerce.number().positive().default(90),
  DRAFT_NOTICE_DAYS: z.coerce.number().positive().default(14),
  /** flags per member and hour */
  FLAG_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  /** shop-link lookups of unknown or retired codes per client address in 15 minutes */
  LINK_MISS_LIMIT: z.coerce.number().int().min(1).default(30),
  SMTP_URL: z.string().min(1).optional(),
  MAIL_FROM: z.string().default('Swapyard <no-reply@swapyard.invalid>'),
  /** the longest the sender waits for the mail server to connect, greet or answer */
  SMTP_TIMEOUT_MS: z.coerce.number().int().min(100).max(120_000).default(10_000),
  /** tries before a message is marked failed; the wait after a failed try doubles from MAIL_RETRY_MS up to an hour */
  MAIL_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(50).default(10),
  MAIL_RETRY_MS: z.coerce.number().int().min(10).default(30_000),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SEED_DEMO: z.enum(['auto', 'never']).default('auto'),
  /** how long a write keeps retrying while another process holds the database, before a 503 */
  DB_BUSY_WAIT_MS: z.coerce.number().int().min(0).max(60_000).default(3000),
  /** how long a stop waits for requests in flight before cutting them off */
  STOP_TIMEOUT_MS: z.coerce.number().int().min(0).max(300_000).default(10_000),
  /** vite: dev server with hot reload; dist: the built client (default in production) */
  SERVE_CLIENT: z.enum(['vite', 'dist', 'none']).optional(),
  /** off: /sw.js is one that removes itself, so browsers drop the offline app (and tests run without one) */
  SERVICE_WORKER: z.enum(['on', 'off']).default('on'),
});

export type Config = {
  env: 'development' | 'production' | 'test';
  port: number;
  host: string;
  appUrl: string;
  databaseUrl: string;
  uploadDir: string;
  dumpDir: string;
  sessionSecret: string;
  auth: { mode: 'github' | 'fake'; clientId: string; clientSecret: string; rateLimit: number };
  rateLimits: { submissionsPerHour: number; uploadsPerHour: number; flagsPerHour: number; linkMissesPer15Min: number };
  storageQuotaBytes: number;
  draftExpiry: { idleDays: number; noticeDays: number };
  smtpUrl?: string;
  mailFrom: string;
  mailDelivery: { timeoutMs: number; maxAttempts: number; retryMs: number };
  logLevel: z.infer<typeof envSchema>['LOG_LEVEL'];
  seedDemo: boolean;
  dbBusyWaitMs: number;
  stopTimeoutMs: number;
  serveClient: 'vite' | 'dist' | 'none';
  serviceWorker: boolean;
};

export class ConfigError extends Error {}

/** Reads and checks the environment once at start. Throws ConfigError with every problem listed. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n  ${lines.join('\n  ')}`);
  }
  const e = parsed.data;
  const production = e.NODE_ENV === 'production';
  const hasRealIds = Boolean(e.GITHUB_CLIENT_ID && e.GITHUB_CLIENT_SECRET);
  const mode = e.AUTH_PROVIDER ?? (hasRealIds ? 'github' : 'fake');
  if (mode === 'github' && !hasRealIds) {
    throw new ConfigError('AUTH_PROVIDER=github needs GITHUB_CLIENT_ID and GITHUB_CLIENT_SECRET.');
  }
  if (production && !hasRealIds && e.AUTH_PROVIDER !== 'fake') {
    throw new ConfigError(
      'No GITHUB_CLIENT_ID/GITHUB_CLIENT_SECRET in production. Set them, or set AUTH_PROVIDER=fake to run the local demo sign-in on purpose.',
    );
  }
  if (production && !e.SESSION_SECRET) {
    throw new ConfigError('SESSION_SECRET is required in production (at least 32 characters).');
  }
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    host: e.HOST,
    appUrl: e.APP_URL ?? `http://localhost:${e.PORT}`,
    databaseUrl: e.DATABASE_URL,
    uploadDir: path.resolve(e.UPLOAD_DIR),
    dumpDir: path.resolve(e.DUMP_DIR),
    sessionSecret: e.SESSION_SECRET ?? developmentSecret(path.dirname(path.resolve(e.DATABASE_URL))),
    auth: {
      mode,
      clientId: mode === 'github' ? e.GITHUB_CLIENT_ID! : 'swapyard-local-client',
      clientSecret: mode === 'github' ? e.GITHUB_CLIENT_SECRET! : 'swapyard-local-secret',
      rateLimit: e.AUTH_RATE_LIMIT,
    },
    rateLimits: {
      submissionsPerHour: e.SUBMISSION_RATE_LIMIT,
      uploadsPerHour: e.UPLOAD_RATE_LIMIT,
      flagsPerHour: e.FLAG_RATE_LIMIT,
      linkMissesPer15Min: e.LINK_MISS_LIMIT,
    },
    storageQuotaBytes: Math.round(e.STORAGE_QUOTA_MB * 1024 * 1024),
    draftExpiry: { idleDays: e.DRAFT_IDLE_DAYS, noticeDays: e.DRAFT_NOTICE_DAYS },
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    mailDelivery: { timeoutMs: e.SMTP_TIMEOUT_MS, maxAttempts: e.MAIL_MAX_ATTEMPTS, retryMs: e.MAIL_RETRY_MS },
    logLevel: e.LOG_LEVEL,
    seedDemo: e.SEED_DEMO === 'auto',
    dbBusyWaitMs: e.DB_BUSY_WAIT_MS,
    stopTimeoutMs: e.STOP_TIMEOUT_MS,
    serveClient: e.SERVE_CLIENT ?? (production ? 'dist' : 'vite'),
    serviceWorker: e.SERVICE_WORKER === 'on',
  };
}

/** Outside production, a random secret is generated once and kept beside the database. */
function developmentSecret(dataDir: string): string {
  const file = path.join(dataDir, 'session-secret');
  try {
    return fs.readFileSync(file, 'utf8').trim();
  } catch {
    fs.mkdirSync(dataDir, { recursive: true });
    const secret = crypto.randomBytes(32).toString('hex');
    fs.writeFileSync(file, secret, { mode: 0o600 });
    return secret;
  }
}
