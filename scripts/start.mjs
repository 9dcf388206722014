#!/usr/bin/env node
// `npm start`: installs what is missing, starts PostgreSQL and the local fakes, migrates,
// seeds the demo, builds and serves Plummet on one port. Ctrl-C stops everything it started.
// The first steps use only Node's built-ins: node_modules may not exist yet.
import { join } from 'node:path';
import { buildChanged, migrateAndSeed, startServer, stopChild } from './lib/app.mjs';
import { ensureDependencies } from './lib/deps.mjs';
import { fail, handleFatal, say } from './lib/log.mjs';
import { DATA_DIR, ROOT } from './lib/paths.mjs';
import { ensurePostgresBinaries, LocalPostgres, portInUse } from './lib/postgres.mjs';

const started = Date.now();
const PORT = Number(process.env.PORT ?? 3000);
const PG_PORT = Number(process.env.PG_PORT ?? 54329);
const SMTP_PORT = Number(process.env.SMTP_PORT ?? 2525);
const S3_PORT = Number(process.env.S3_PORT ?? 4569);
const BUCKET = process.env.S3_BUCKET ?? 'plummet-photos';

let pg;
let fakes;
let server;
let stopping = false;

async function stopAll(code = 0) {
  if (stopping) return;
  stopping = true;
  await stopChild(server);
  await fakes?.close();
  pg?.stop();
  say('stopped');
  process.exit(code);
}
process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

async function main() {
  if (await portInUse(PORT)) fail(`port ${PORT} on 127.0.0.1 is already in use; stop what uses it or set PORT.`);
  await ensureDependencies(ROOT);

  const bin = await ensurePostgresBinaries();
  pg = new LocalPostgres({ bin, dir: join(DATA_DIR, 'pg'), port: PG_PORT });
  if (await pg.init()) say(`created a PostgreSQL cluster in ${pg.dir}`);
  await pg.start();
  await pg.ensureDatabase('plummet');
  // The server runs as the application role (row-level security binds it); migrations and the
  // demo seed run as the cluster's owner (PG_APP_USER and PG_APP_PASSWORD name the former).
  const appUser = process.env.PG_APP_USER ?? 'plummet_app';
  const appPassword = process.env.PG_APP_PASSWORD ?? '';
  pg.ensureApplicationRole(appUser, appPassword);
  say(`PostgreSQL on 127.0.0.1:${PG_PORT} (server as ${appUser}, migrations as ${pg.user})`);

  // NODE_ENV is set explicitly: the server treats an unset NODE_ENV as production.
  const nodeEnv = process.env.NODE_ENV ?? 'development';
  const production = nodeEnv === 'production';
  if (!production) {
    const { startFakes } = await import('./lib/fakes.mjs');
    fakes = await startFakes({
      mailDir: join(DATA_DIR, 'mail'),
      s3Dir: join(DATA_DIR, 's3'),
      smtpPort: SMTP_PORT,
      s3Port: S3_PORT,
      bucket: BUCKET,
    });
    say(`mail fake on 127.0.0.1:${fakes.smtpPort} (messages in ${join(DATA_DIR, 'mail')}), object store on ${fakes.s3Endpoint}`);
  } else {
    say('NODE_ENV=production: no local fakes; SMTP_*, S3_*, JWT_SECRET and PUBLIC_URL come from the environment');
  }

  const built = await buildChanged();
  say(built.length ? `built ${built.join(', ')}` : 'nothing changed since the last build: builds skipped');

  const env = {
    ...process.env,
    NODE_ENV: nodeEnv,
    HOST: '127.0.0.1',
    PORT: String(PORT),
    DATABASE_URL: pg.urlAs(appUser, appPassword, 'plummet'),
    MIGRATION_DATABASE_URL: pg.url('plummet'),
    ...(production
      ? {}
      : {
          SMTP_HOST: '127.0.0.1',
          SMTP_PORT: String(fakes.smtpPort),
          MAIL_DIR: join(DATA_DIR, 'mail'),
          S3_ENDPOINT: fakes.s3Endpoint,
          S3_BUCKET: BUCKET,
          PUBLIC_URL: process.env.PUBLIC_URL ?? `http://127.0.0.1:${PORT}`,
        }),
  };
  if (production) say('NODE_ENV=production: migrating only; the demo data is never seeded in production');
  await migrateAndSeed(env, { migrateOnly: production }).catch((e) => fail(e.message));
  await startServer(env, { onSpawn: (child) => (server = child) });
  server.on('exit', (code) => {
    if (!stopping) {
      say(`the server stopped (exit ${code})`);
      void stopAll(1);
    }
  });

  say(`ready in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  console.log(`\n  Plummet is running at http://127.0.0.1:${PORT}   (API under /api, docs at /api/docs)\n`);
  if (!production) {
    const { DEMO_USERS, DEMO_PASSWORD } = await import(join(ROOT, 'server/dist/seed/demo-data.js'));
    console.log(`  Demo sign-ins (password: ${DEMO_PASSWORD}):`);
    for (const u of DEMO_USERS) console.log(`    ${u.email.padEnd(22)} ${u.role}`);
    console.log(`\n  Captured e-mail: ${join(DATA_DIR, 'mail')}/*.eml`);
  }
  console.log('  Ctrl-C stops everything.\n');
}

main().catch(async (error) => {
  handleFatal(error);
  await stopAll(1);
});
