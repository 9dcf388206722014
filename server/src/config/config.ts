import { z } from 'zod';

const isProduction = process.env.NODE_ENV === 'production';

/** Everything the server reads from its environment, validated once at start. */
export const ConfigSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  PUBLIC_URL: z.string().url().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  DATABASE_URL: z.string().startsWith('postgres'),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(200).default(20),
  MIGRATIONS_DIR: z.string().optional(),
  WEB_DIST: z.string().optional(),
  JWT_SECRET: isProduction
    ? z.string().min(32, 'JWT_SECRET must be at least 32 characters in production')
    : z.string().min(16).default('plummet-development-secret-not-for-production'),
  ACCESS_TOKEN_TTL_S: z.coerce.number().int().min(30).max(86_400).default(900),
  REFRESH_TOKEN_TTL_S: z.coerce.number().int().min(3600).default(30 * 86_400),
  INVITE_TOKEN_TTL_S: z.coerce.number().int().min(60).default(7 * 86_400),
  PASSWORD_RESET_TOKEN_TTL_S: z.coerce.number().int().min(60).default(3600),
  /** Fixed-window rate limits (counted in PostgreSQL, shared by every replica). */
  SIGN_IN_ACCOUNT_LIMIT: z.coerce.number().int().min(1).default(5),
  SIGN_IN_ADDRESS_LIMIT: z.coerce.number().int().min(1).default(30),
  SIGN_IN_WINDOW_S: z.coerce.number().int().min(1).default(900),
  PASSWORD_RESET_EMAIL_LIMIT: z.coerce.number().int().min(1).default(3),
  PASSWORD_RESET_ADDRESS_LIMIT: z.coerce.number().int().min(1).default(10),
  PASSWORD_RESET_WINDOW_S: z.coerce.number().int().min(1).default(3600),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
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
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().default('us-east-1'),
  S3_BUCKET: z.string().min(3).default('plummet-photos'),
  S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
  S3_FORCE_PATH_STYLE: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  MAX_JSON_BODY: z.string().default('1mb'),
  MAX_UPLOAD_BYTES: z.coerce.number().int().min(1024).default(15 * 1024 * 1024),
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
  return parsed.data;
}
