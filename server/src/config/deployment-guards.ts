import type { AppConfig } from './config.js';

/**
 * The secret written in the code for local use. Anyone can read it, so it is accepted only on a
 * server nobody else can reach (loopback) that was explicitly started for development or tests.
 */
export const DEVELOPMENT_JWT_SECRET = 'plummet-development-secret-not-for-production';

/** Shortest JWT_SECRET accepted outside development: 32 random bytes (e.g. `openssl rand -base64 48`). */
export const MIN_JWT_SECRET_LENGTH = 32;
/** A secret of 32+ characters drawn from so few symbols was typed, not generated. */
const MIN_DISTINCT_SECRET_CHARACTERS = 12;

/** Development defaults of the local fakes, never accepted in production. */
const FAKE_S3_KEY = 'S3RVER';

export function isLoopbackHost(host: string): boolean {
  return host === 'localhost' || host === '::1' || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(host);
}

/** Development and test modes must be asked for explicitly; an unset NODE_ENV is production. */
export function isDevelopmentMode(config: Pick<AppConfig, 'NODE_ENV'>): boolean {
  return config.NODE_ENV === 'development' || config.NODE_ENV === 'test';
}

/**
 * What the schema alone cannot say: combinations of settings that would let a stranger sign
 * tokens, or a production server silently fall back to development stand-ins.
 * Returns one readable line per problem (empty when the configuration may start).
 */
export function deploymentProblems(config: AppConfig, env: NodeJS.ProcessEnv): string[] {
  const problems: string[] = [];
  const devMode = isDevelopmentMode(config);
  const loopback = isLoopbackHost(config.HOST);
  const secret = env.JWT_SECRET;

  if (!secret || secret === DEVELOPMENT_JWT_SECRET) {
    if (!devMode || !loopback) {
      problems.push(
        `JWT_SECRET: set a secret of at least ${MIN_JWT_SECRET_LENGTH} random bytes (e.g. \`openssl rand -base64 48\`); ` +
          'the development secret is accepted only with NODE_ENV=development or test and HOST on loopback',
      );
    }
  } else if (!devMode && (secret.length < MIN_JWT_SECRET_LENGTH || new Set(secret).size < MIN_DISTINCT_SECRET_CHARACTERS)) {
    problems.push(`JWT_SECRET: must be at least ${MIN_JWT_SECRET_LENGTH} random characters (e.g. \`openssl rand -base64 48\`)`);
  }

  if (config.NODE_ENV === 'production') {
    if (!env.MIGRATION_DATABASE_URL) {
      problems.push('MIGRATION_DATABASE_URL: required in production (the owner of the tables migrates; DATABASE_URL is the application role)');
    } else if (databaseRole(env.MIGRATION_DATABASE_URL) === databaseRole(config.DATABASE_URL)) {
      problems.push('MIGRATION_DATABASE_URL: must name another role than DATABASE_URL (the application role may not own the tables)');
    }
    if (!env.PUBLIC_URL) problems.push('PUBLIC_URL: required in production (the address written into e-mailed links)');
    for (const name of ['SMTP_HOST', 'MAIL_FROM', 'S3_BUCKET', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'] as const) {
      if (!env[name]) problems.push(`${name}: required in production (no development default is used)`);
    }
    if (env.S3_ACCESS_KEY_ID === FAKE_S3_KEY || env.S3_SECRET_ACCESS_KEY === FAKE_S3_KEY) {
      problems.push('S3_ACCESS_KEY_ID / S3_SECRET_ACCESS_KEY: the local fake\'s keys are refused in production');
    }
  }
  return problems;
}

/** The role a PostgreSQL URL signs in as ('' when it names none and the driver's default applies). */
export function databaseRole(url: string): string {
  try {
    return decodeURIComponent(new URL(url).username);
  } catch {
    return '';
  }
}
