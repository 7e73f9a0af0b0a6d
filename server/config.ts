import { randomBytes } from 'node:crypto';
import * as z from 'zod';

const Env = z.object({
  DATABASE_URL: z.string().url('DATABASE_URL must be a postgres:// URL'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  PUBLIC_URL: z.string().url().optional(),
  SMTP_URL: z.string().url('SMTP_URL must look like smtp://host:port').optional(),
  MAIL_FROM: z.string().default('Parallax <parallax@localhost>'),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  SESSION_IDLE_MINUTES: z.coerce.number().positive().default(30),
  COOKIE_SECURE: z.enum(['0', '1']).default('0'),
  SIGN_IN_RATE_LIMIT: z.coerce.number().int().positive().default(30),
  PASSWORD_RESET_RATE_LIMIT: z.coerce.number().int().positive().default(20),
  CLIENT_DIR: z.string().optional(),
  ANALYSIS_STALE_SECONDS: z.coerce.number().int().min(2).max(3600).default(30),
  ANALYSIS_THREADS: z.coerce.number().int().min(1).max(64).optional(),
  READ_CACHE_MB: z.coerce.number().min(0).max(4096).default(64),
});

export type Config = {
  databaseUrl: string;
  port: number;
  host: string;
  publicUrl: string;
  smtpUrl: string | undefined;
  mailFrom: string;
  sessionSecret: string;
  sessionIdleMs: number;
  cookieSecure: boolean;
  signInRateLimit: number;
  /** Requests for a password link one address may make per hour (each e-mail gets 3 an hour whatever this is). */
  passwordResetRateLimit: number;
  clientDir: string | undefined;
  /** A running analysis without a heartbeat for this long lost its process and is re-queued (once). */
  analysisStaleSeconds: number;
  /** Analyses one process runs at once (worker threads); default one per core but one. */
  analysisThreads: number | undefined;
  /** Bytes of answers the read cache may keep (server/http/read-cache.ts); 0 turns it off. */
  readCacheBytes: number;
};

/** Reads the environment once; a bad value stops start-up with a message naming the variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  // An empty variable counts as unset.
  const parsed = Env.safeParse(Object.fromEntries(Object.entries(env).filter(([, v]) => v !== '')));
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`configuration error: ${lines.join('; ')}`);
  }
  const e = parsed.data;
  return {
    databaseUrl: e.DATABASE_URL,
    port: e.PORT,
    host: e.HOST,
    publicUrl: (e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`).replace(/\/$/, ''),
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    sessionSecret: e.SESSION_SECRET ?? randomBytes(32).toString('hex'),
    sessionIdleMs: e.SESSION_IDLE_MINUTES * 60_000,
    cookieSecure: e.COOKIE_SECURE === '1',
    signInRateLimit: e.SIGN_IN_RATE_LIMIT,
    passwordResetRateLimit: e.PASSWORD_RESET_RATE_LIMIT,
    clientDir: e.CLIENT_DIR,
    analysisStaleSeconds: e.ANALYSIS_STALE_SECONDS,
    analysisThreads: e.ANALYSIS_THREADS,
    readCacheBytes: Math.floor(e.READ_CACHE_MB * 1024 * 1024),
  };
}
