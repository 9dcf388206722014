#!/usr/bin/env node
// `npm run bench:lighthouse`: Lighthouse 12 (mobile preset: simulated slow 4G and a 4× slower CPU)
// against the production build served by the real server, on a throwaway PostgreSQL seeded with
// the demo. Audits /sign-in as a first visit, then signs in as the inspector in the same Chromium
// and audits the signed-in home. Prints the four category scores and FCP, LCP, TBT, CLS. A
// benchmark, not a test: nothing is asserted. Leaves nothing behind.
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import lighthouse from 'lighthouse';
import { chromium } from 'playwright-core';
import { buildChanged, migrateAndSeed, startServer, stopChild } from '../../scripts/lib/app.mjs';
import { freePort } from '../../scripts/lib/free-port.mjs';
import { handleFatal, say } from '../../scripts/lib/log.mjs';
import { ensurePostgresBinaries, LocalPostgres } from '../../scripts/lib/postgres.mjs';

const CHROME_PATH = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const DEMO_EMAIL = 'inspector@demo.test';
const DEMO_PASSWORD = 'plummet-demo';
const JWT_SECRET = 'lighthouse-secret-lighthouse-secret-0123456789';

let pg;
let server;
let browser;
let tmp;

async function cleanup() {
  await browser?.close().catch(() => {});
  browser = undefined;
  await stopChild(server);
  server = undefined;
  pg?.stop();
  pg = undefined;
  if (tmp) rmSync(tmp, { recursive: true, force: true });
}
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => void cleanup().finally(() => process.exit(130)));

async function audit(url, port, { keepStorage }) {
  const result = await lighthouse(
    url,
    { port, output: 'json', logLevel: 'error', disableStorageReset: keepStorage },
    { extends: 'lighthouse:default', settings: { formFactor: 'mobile', onlyCategories: ['performance', 'accessibility', 'best-practices', 'seo'] } },
  );
  const { categories, audits } = result.lhr;
  const score = (id) => Math.round((categories[id]?.score ?? 0) * 100);
  const ms = (id) => `${((audits[id]?.numericValue ?? NaN) / 1000).toFixed(2)} s`;
  const worst = Object.values(audits)
    .filter((a) => a.details?.type === 'opportunity' && (a.details.overallSavingsMs ?? 0) > 0)
    .sort((a, b) => b.details.overallSavingsMs - a.details.overallSavingsMs)
    .slice(0, 3)
    .map((a) => `${a.id} (${Math.round(a.details.overallSavingsMs)} ms)`);
  return {
    line:
      `performance ${score('performance')}  accessibility ${score('accessibility')}  best practices ${score('best-practices')}  SEO ${score('seo')}` +
      `   FCP ${ms('first-contentful-paint')}  LCP ${ms('largest-contentful-paint')}  TBT ${Math.round(audits['total-blocking-time'].numericValue)} ms  CLS ${audits['cumulative-layout-shift'].numericValue.toFixed(3)}`,
    worst,
    finalUrl: result.lhr.finalDisplayedUrl,
  };
}

async function main() {
  const built = await buildChanged();
  say(built.length ? `built ${built.join(', ')}` : 'builds up to date');
  tmp = mkdtempSync(join(tmpdir(), 'plummet-lighthouse-'));
  chmodSync(tmp, 0o755);
  pg = new LocalPostgres({ bin: await ensurePostgresBinaries(), dir: join(tmp, 'pg'), port: await freePort(), durable: false });
  await pg.init();
  await pg.start();
  await pg.ensureDatabase('plummet_lighthouse');
  pg.ensureApplicationRole('plummet_app');
  const env = { ...process.env, NODE_ENV: 'development', DATABASE_URL: pg.urlAs('plummet_app', '', 'plummet_lighthouse'), MIGRATION_DATABASE_URL: pg.url('plummet_lighthouse'), LOG_LEVEL: 'warn', HOST: '127.0.0.1', JWT_SECRET };
  await migrateAndSeed(env);
  const port = await freePort();
  server = await startServer({ ...env, NODE_ENV: 'production', PORT: String(port) }, { stdio: ['ignore', 'ignore', 'inherit'] });
  const base = `http://127.0.0.1:${port}`;

  const debugPort = await freePort();
  browser = await chromium.launch({
    executablePath: CHROME_PATH,
    headless: true,
    args: [`--remote-debugging-port=${debugPort}`, '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });

  say('auditing /sign-in (first visit)…');
  const signIn = await audit(`${base}/sign-in`, debugPort, { keepStorage: false });

  // Sign in through the page so the session sits in the browser's storage, as on a phone.
  const context = browser.contexts()[0] ?? (await browser.newContext());
  const page = await context.newPage();
  await page.goto(`${base}/sign-in`);
  await page.getByTestId('sign-in-email').locator('input').fill(DEMO_EMAIL);
  await page.getByTestId('sign-in-password').locator('input').fill(DEMO_PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 30_000 });
  await page.close();

  say('auditing / signed in…');
  const home = await audit(`${base}/`, debugPort, { keepStorage: true });

  console.log('');
  console.log(`Lighthouse 12 mobile preset, production build, Chromium ${browser.version()} (node ${process.version})`);
  console.log(`/sign-in           ${signIn.line}`);
  console.log(`/ (signed in)      ${home.line}${home.finalUrl.includes('/sign-in') ? '   (ended on the sign-in page!)' : ''}`);
  for (const [name, r] of [['/sign-in', signIn], ['/', home]]) if (r.worst.length) console.log(`  biggest savings on ${name}: ${r.worst.join(', ')}`);
}

main()
  .catch(handleFatal)
  .finally(cleanup);
