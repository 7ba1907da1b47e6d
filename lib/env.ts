import { z } from 'zod';

// Every setting the app reads, in one validated place: a missing or malformed one fails loudly here,
// naming the variable, not deep in a request. Scripts, tests and next.config read their own.

/** An interval or timeout in ms from a variable: a number at least `least`, else the default (an unset or odd value never breaks start-up). */
const ms = (fallback: number, least: number) =>
  z.preprocess((v) => {
    const n = Number(v);
    return v !== undefined && v !== '' && Number.isFinite(n) && n >= least ? n : fallback;
  }, z.number());

/** "off" or "0" switches a background job off; anything else leaves it on. */
const onUnlessOff = z
  .string()
  .optional()
  .transform((v) => v !== 'off' && v !== '0');

const flag = z
  .enum(['true', 'false', '1', '0', ''])
  .default('false')
  .transform((v) => v === 'true' || v === '1');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),

  // Database
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().positive().default(3406),
  DB_NAME: z.string().min(1).default('scribeline'),
  DB_USER: z.string().min(1).default('scribeline'),
  DB_PASSWORD: z.string().default('scribeline-local'),
  DB_POOL_MAX: z.coerce.number().int().positive().default(10),
  /** Read replicas, "host:port" comma separated (DEVELOPERS.md, "Several servers"); empty: everything on DB_HOST. */
  DB_REPLICAS: z.string().default(''),
  /** A replica further behind than this (seconds) is skipped and reads go to the primary. */
  DB_REPLICA_MAX_LAG_S: z.coerce.number().min(0).default(10),
  /** After a request wrote, that browser reads from the primary for this long (seconds). */
  DB_PRIMARY_AFTER_WRITE_S: z.coerce.number().int().min(1).default(15),
  DB_REPLICA_CHECK_MS: ms(1_000, 100),

  // Sign-in and signed links; the app's public address (links in e-mail, the allowed origin)
  NEXTAUTH_SECRET: z.string().min(16).optional(),
  NEXTAUTH_URL: z.string().url().optional(),
  /** Addresses or CIDR ranges (comma or space separated) of the proxies in front of the app. */
  TRUSTED_PROXIES: z.string().default(''),

  // Outgoing mail
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  SMTP_SECURE: flag,
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default('Scribeline <no-reply@scribeline.test>'),
  MAIL_WORKER: onUnlessOff,
  MAIL_WORKER_INTERVAL_MS: ms(5_000, 250),
  /** The local mail service's HTTP API, read by the dev mailbox page. */
  MAILBOX_URL: z.string().url().default('http://127.0.0.1:2580'),
  /** The dev mailbox exists only when this is "1" (and then only for admins). */
  SCRIBELINE_DEV_MAILBOX: z
    .string()
    .optional()
    .transform((v) => v === '1'),

  // The upload service (the SDK reads these too; the app reads them to check callbacks and for health)
  UPLOADTHING_TOKEN: z.string().optional(),
  UPLOADTHING_INGEST_URL: z.string().url().optional(),
  UPLOADTHING_API_URL: z.string().url().default('https://api.uploadthing.com'),
  UPLOADTHING_UFS_HOST: z.string().min(1).default('ufs.sh'),

  // Background jobs and stopping
  FILE_CLEANUP: onUnlessOff,
  FILE_CLEANUP_INTERVAL_MS: ms(60_000, 250),
  UPLOAD_SWEEP_INTERVAL_MS: ms(3_600_000, 1_000),
  /** Stored files without a row are removed once older than this. */
  UPLOAD_SWEEP_AGE_MS: ms(3_600_000, 1_000),
  STOP_TIMEOUT_MS: ms(25_000, 1),
});

export type Env = z.infer<typeof envSchema>;

const KEYS = Object.keys(envSchema.shape) as (keyof Env)[];
let cached: { key: string; value: Env } | undefined;

/**
 * The settings, parsed once and again only when a variable changed (tests point SMTP_PORT or the upload
 * service elsewhere while running).
 */
export function env(): Env {
  const key = KEYS.map((k) => process.env[k] ?? '\u0000').join('\u0001');
  if (cached?.key === key) return cached.value;
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`Bad environment settings:\n${lines.join('\n')}`);
  }
  cached = { key, value: parsed.data };
  return parsed.data;
}

/** The secret that signs sessions and links; refuses to work without one. */
export function signingSecret(what: string): string {
  const s = env().NEXTAUTH_SECRET;
  if (!s) throw new Error(`NEXTAUTH_SECRET is not set: ${what} cannot be signed.`);
  return s;
}
