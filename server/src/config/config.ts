import { z } from 'zod';
import { DEVELOPMENT_JWT_SECRET, deploymentProblems } from './deployment-guards.js';

/** Everything the server reads from its environment, validated once at start. */
export const ConfigSchema = z.object({
  /** Unset means production: development and test modes are asked for explicitly (`npm start` does). */
  NODE_ENV: z.enum(['development', 'test', 'production']).default('production'),
  HOST: z.string().default('127.0.0.1'),
  /**
   * Which proxies' X-Forwarded-For is believed for the client address (rate limits): Express's
   * `trust proxy`: `loopback` (default), `false`, `true`, a hop count, or a comma list of
   * addresses/subnets, e.g. `10.0.0.0/8`. See DEVELOPERS.md.
   */
  TRUST_PROXY: z
    .string()
    .default('loopback')
    .transform((v): boolean | number | string => (v === 'true' ? true : v === 'false' ? false : /^\d+$/.test(v) ? Number(v) : v)),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  PUBLIC_URL: z.string().url().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /**
   * The application role's connection: not the owner of the tables, no BYPASSRLS, so PostgreSQL's
   * row-level security keeps each organisation's rows apart (docs/operations.md).
   */
  DATABASE_URL: z.string().startsWith('postgres'),
  /**
   * The owner's connection, used only to apply migrations at start and grant the application role
   * (the role of DATABASE_URL) its rights. Unset: DATABASE_URL migrates too (one role; production refuses).
   */
  MIGRATION_DATABASE_URL: z.string().startsWith('postgres').optional(),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(200).default(20),
  /** PostgreSQL ends any statement running longer, and any transaction left idle longer (ms). */
  DATABASE_STATEMENT_TIMEOUT_MS: z.coerce.number().int().min(100).default(15_000),
  DATABASE_IDLE_IN_TRANSACTION_TIMEOUT_MS: z.coerce.number().int().min(100).default(10_000),
  MIGRATIONS_DIR: z.string().optional(),
  WEB_DIST: z.string().optional(),
  /** Checked further by deploymentProblems: the default is accepted on loopback in development only. */
  JWT_SECRET: z.string().min(16).default(DEVELOPMENT_JWT_SECRET),
  ACCESS_TOKEN_TTL_S: z.coerce.number().int().min(30).max(86_400).default(900),
  /** How long each process may trust its memory of a user's session version (see SessionStateCache). */
  SESSION_CHECK_CACHE_MS: z.coerce.number().int().min(0).max(5_000).default(2_000),
  /** Absolute lifetime of a session: refreshing never extends it past this. */
  REFRESH_TOKEN_TTL_S: z.coerce.number().int().min(3600).default(30 * 86_400),
  INVITE_TOKEN_TTL_S: z.coerce.number().int().min(60).default(7 * 86_400),
  PASSWORD_RESET_TOKEN_TTL_S: z.coerce.number().int().min(60).default(3600),
  /** Limits counted in PostgreSQL, shared by every replica. Failed sign-ins of one account before delays start: */
  SIGN_IN_ACCOUNT_LIMIT: z.coerce.number().int().min(1).default(5),
  /** The first delay after those; each further failure doubles it, up to SIGN_IN_DELAY_MAX_S. */
  SIGN_IN_DELAY_BASE_S: z.coerce.number().min(0.1).default(2),
  SIGN_IN_DELAY_MAX_S: z.coerce.number().min(1).default(300),
  SIGN_IN_ADDRESS_LIMIT: z.coerce.number().int().min(1).default(30),
  SIGN_IN_WINDOW_S: z.coerce.number().int().min(1).default(900),
  PASSWORD_RESET_EMAIL_LIMIT: z.coerce.number().int().min(1).default(3),
  PASSWORD_RESET_ADDRESS_LIMIT: z.coerce.number().int().min(1).default(10),
  PASSWORD_RESET_WINDOW_S: z.coerce.number().int().min(1).default(3600),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  /** SMTP connect/greeting and socket inactivity limits (ms). */
  SMTP_CONNECT_TIMEOUT_MS: z.coerce.number().int().min(100).default(5_000),
  SMTP_SOCKET_TIMEOUT_MS: z.coerce.number().int().min(100).default(10_000),
  MAIL_FROM: z.string().default('Plummet <no-reply@plummet.test>'),
  MAIL_DIR: z.string().optional(),
  /** Run the mail job workers in this process (every replica may; pg-boss hands each job to one). */
  MAIL_WORKERS: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  /** Retries of a mail job before it ends failed (visible to admins at /api/mail-jobs/failed). */
  MAIL_RETRY_LIMIT: z.coerce.number().int().min(0).max(20).default(6),
  /** First retry delay of a mail job; pg-boss doubles it on each retry. */
  MAIL_RETRY_DELAY_S: z.coerce.number().int().min(1).max(3600).default(10),
  /** How often an idle worker looks for new mail jobs (pg-boss minimum 0.5 s). */
  MAIL_POLL_S: z.coerce.number().min(0.5).max(60).default(2),
  /**
   * pg-boss cron of the daily digest's tick (every 15 min: a digest hour is met within 15 min in
   * every time zone, half-hour ones included). Empty: this process schedules nothing (the tests
   * run the tick by hand with a chosen clock).
   */
  DIGEST_CRON: z.string().default('*/15 * * * *'),
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().default('us-east-1'),
  S3_BUCKET: z.string().min(3).default('plummet-photos'),
  S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
  /** Per S3 request: connecting, and the whole request (ms); a stalled store fails fast with 503. */
  S3_CONNECT_TIMEOUT_MS: z.coerce.number().int().min(100).default(3_000),
  S3_REQUEST_TIMEOUT_MS: z.coerce.number().int().min(100).default(15_000),
  S3_FORCE_PATH_STYLE: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  /**
   * Applied sync mutations are kept this long (days, at least 30) to recognise a repeated push:
   * it is the longest a phone may stay offline and still have its queued changes applied once.
   */
  SYNC_MUTATION_RETENTION_DAYS: z.coerce.number().int().min(30).default(45),
  MAX_JSON_BODY: z.string().default('1mb'),
  MAX_UPLOAD_BYTES: z.coerce.number().int().min(1024).default(15 * 1024 * 1024),
  /** Uploads one process reads and decodes at once; more answer 503 UPLOADS_BUSY with Retry-After. */
  MAX_CONCURRENT_UPLOADS: z.coerce.number().int().min(1).max(64).default(4),
});

export type AppConfig = z.infer<typeof ConfigSchema>;

export const APP_CONFIG = Symbol('APP_CONFIG');

/** Parses the environment; throws one readable line per bad variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = ConfigSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n  ${lines.join('\n  ')}`);
  }
  const problems = deploymentProblems(parsed.data, env);
  if (problems.length > 0) throw new Error(`Refusing to start:\n  ${problems.join('\n  ')}`);
  return parsed.data;
}
