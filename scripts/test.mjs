#!/usr/bin/env node
// `npm test`: sets up its own throwaway PostgreSQL cluster and fakes on loopback, type-checks
// every workspace, builds, then runs vitest across all workspaces (unit, integration against the
// real database, end-to-end in Debian's Chromium). Leaves nothing running; exit code says it all.
import { chmodSync, existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildAll, migrateAndSeed } from './lib/app.mjs';
import { ensureDependencies } from './lib/deps.mjs';
import { freePort } from './lib/free-port.mjs';
import { handleFatal, say } from './lib/log.mjs';
import { ROOT } from './lib/paths.mjs';
import { ensurePostgresBinaries, LocalPostgres } from './lib/postgres.mjs';
import { aptInstall, run } from './lib/run.mjs';

const CHROMIUM = '/usr/bin/chromium';
const started = Date.now();
const vitestArgs = process.argv.slice(2);
let pg;
let fakes;
let tmp;

async function cleanup() {
  await fakes?.close();
  pg?.stop();
  if (tmp) rmSync(tmp, { recursive: true, force: true });
}

for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    void cleanup().finally(() => process.exit(130));
  });
}

async function main() {
  await ensureDependencies(ROOT);
  if (!existsSync(CHROMIUM)) {
    say('Chromium not found; installing Debian package chromium for the end-to-end tests…');
    await aptInstall(['chromium'], 'Chromium is needed for the end-to-end tests');
  }
  if (!existsSync('/usr/bin/pdftoppm') || !existsSync('/usr/bin/pdftotext')) {
    say('poppler-utils not found; installing it to read and render report PDFs in the tests…');
    await aptInstall(['poppler-utils'], 'pdftotext and pdftoppm are needed for the report tests');
  }
  const bin = await ensurePostgresBinaries();

  tmp = mkdtempSync(join(tmpdir(), 'plummet-test-'));
  chmodSync(tmp, 0o755); // the postgres user must reach the cluster folder inside
  pg = new LocalPostgres({ bin, dir: join(tmp, 'pg'), port: await freePort(), durable: false });
  await pg.init();
  await pg.start();
  say(`throwaway PostgreSQL on 127.0.0.1:${pg.port}`);

  const { startFakes } = await import('./lib/fakes.mjs');
  const bucket = 'plummet-photos';
  fakes = await startFakes({ mailDir: join(tmp, 'mail'), s3Dir: join(tmp, 's3'), smtpPort: 0, s3Port: 0, bucket });

  if (process.env.TEST_SKIP_BUILD === '1') {
    // A quicker loop while working on tests that need neither the type-check nor the built PWA.
    say('TEST_SKIP_BUILD=1: skipping the type-check and the PWA build (end-to-end tests use the last one)');
    await buildAll({ web: false });
  } else {
    say('type-checking every workspace…');
    await run('npm', ['run', '--silent', 'typecheck'], { cwd: ROOT, label: 'type-check' });
    say('building…');
    await buildAll();
  }

  const template = 'plummet_template';
  await pg.ensureDatabase(template);
  // Tests run the server as the application role (row-level security binds it) and migrate,
  // seed and inspect as the owner, like a deployment.
  const appUser = process.env.PG_APP_USER ?? 'plummet_app';
  const appPassword = process.env.PG_APP_PASSWORD ?? '';
  pg.ensureApplicationRole(appUser, appPassword);
  const env = {
    ...process.env,
    NODE_ENV: 'test',
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
    DATABASE_URL: pg.urlAs(appUser, appPassword, template),
    MIGRATION_DATABASE_URL: pg.url(template),
    PG_TEST_BASE_URL: pg.url(''),
    PG_TEST_APP_BASE_URL: pg.urlAs(appUser, appPassword, ''),
    PG_TEST_TEMPLATE: template,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(fakes.smtpPort),
    MAIL_DIR: join(tmp, 'mail'),
    // No digest schedule in tests: a tick at a quarter hour would add digests to other tests' mail.
    DIGEST_CRON: '',
    S3_ENDPOINT: fakes.s3Endpoint,
    S3_BUCKET: bucket,
    CHROMIUM_PATH: CHROMIUM,
    TEST_ARTIFACTS_DIR: join(ROOT, 'test-artifacts'),
  };
  await migrateAndSeed(env, { migrateOnly: true });

  say('running vitest across all workspaces…');
  // Tests make their own databases from the template (server/test/test-db.ts), never use it directly.
  const testEnv = { ...env };
  delete testEnv.DATABASE_URL;
  delete testEnv.MIGRATION_DATABASE_URL;
  await run('npx', ['vitest', 'run', ...vitestArgs], { cwd: ROOT, env: testEnv, label: 'vitest' });
  say(`all tests passed in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}

main()
  .catch(handleFatal)
  .finally(async () => {
    await cleanup();
  });
