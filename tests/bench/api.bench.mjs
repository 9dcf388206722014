#!/usr/bin/env node
// `npm run bench:api`: the API under load, on a throwaway PostgreSQL seeded with the demo plus
// 100,000 findings. Measures GET /api/findings?limit=50 as a manager (list rows, then whole findings
// with estimate=full; 100 connections, ~10 s each, with autocannon) and GET /api/health as a
// baseline in the same run (its object store a stub that answers at once), then prints requests/s,
// p50/p95/p99 latency, the ratios, the JSON bytes per finding and what a request costs besides the
// query; then the managers' overview and trends one at a time and under 10 connections, and the
// export of every finding with the server's memory. Leaves nothing behind. A benchmark, not a
// test: nothing is asserted about speed.
import { createHmac, createSecretKey } from 'node:crypto';
import { createRequire } from 'node:module';
import { spawn } from 'node:child_process';
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import autocannon from 'autocannon';
import { buildAll, migrateAndSeed, startServer, stopChild } from '../../scripts/lib/app.mjs';
import { freePort } from '../../scripts/lib/free-port.mjs';
import { handleFatal, say } from '../../scripts/lib/log.mjs';
import { ensurePostgresBinaries, LocalPostgres } from '../../scripts/lib/postgres.mjs';

const FINDINGS = 100_000;
const CONNECTIONS = 100;
const DURATION_S = Number(process.env.BENCH_DURATION_S ?? 10);
const JWT_SECRET = 'bench-secret-bench-secret-bench-secret-0123456789';
// Production refuses development defaults; the bench sends no mail and stores no photo.
const PRODUCTION_STAND_INS = {
  PUBLIC_URL: 'http://127.0.0.1',
  SMTP_HOST: '127.0.0.1',
  MAIL_FROM: 'Plummet bench <bench@plummet.test>',
  S3_BUCKET: 'plummet-bench',
  S3_ACCESS_KEY_ID: 'bench-access-key',
  S3_SECRET_ACCESS_KEY: 'bench-secret-key',
};

let pg;
let server;
let tmp;
let store;

async function cleanup() {
  await stopChild(server);
  server = undefined;
  await stopChild(store);
  store = undefined;
  if (pg) {
    pg.stop();
    pg = undefined;
  }
  if (tmp) rmSync(tmp, { recursive: true, force: true });
}

for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => void cleanup().finally(() => process.exit(130)));
}

/** 100,000 findings in one statement: copies of the demo organisation's findings, with varied states and due times. */
const BULK_FINDINGS_SQL = `
WITH t AS (
  SELECT row_number() OVER (ORDER BY f.id) - 1 AS n, f.*
  FROM findings f JOIN organisations o ON o.id = f.organisation_id AND o.slug = 'harrow-span'
), c AS (SELECT count(*) AS k FROM t)
INSERT INTO findings (id, organisation_id, inspection_id, scaffold_id, elevation, lift, bay, height_m, catalogue_item_id,
  item_name, mass_kg, shape, exposure, likelihood_answers, likelihood, estimate, severity, risk_score, risk_band, state,
  assignee_id, due_at, notes, made_safe_note, created_by, created_at, updated_at, version)
SELECT gen_random_uuid(), t.organisation_id, NULL, t.scaffold_id, t.elevation, t.lift, t.bay, t.height_m, t.catalogue_item_id,
  t.item_name, t.mass_kg, t.shape, t.exposure, t.likelihood_answers, t.likelihood, t.estimate, t.severity, t.risk_score, t.risk_band,
  (ARRAY['open', 'made-safe', 'fixed', 'verified']::finding_state[])[1 + g % 4],
  t.assignee_id, CASE WHEN g % 3 = 0 THEN now() + ((g % 240) - 120) * interval '1 hour' END,
  'Bench finding ' || g, NULL, t.created_by, now() - (g % 50000) * interval '1 minute', now(), 1
FROM generate_series(1, ${FINDINGS}) g CROSS JOIN c JOIN t ON t.n = g % c.k;
INSERT INTO fixes (id, organisation_id, finding_id, fixed_by, fixed_at)
SELECT gen_random_uuid(), f.organisation_id, f.id, f.created_by, f.created_at + (abs(hashtext(f.id::text)) % 96) * interval '1 hour'
FROM findings f WHERE f.state IN ('fixed', 'verified') AND f.notes LIKE 'Bench finding %';
INSERT INTO verifications (id, organisation_id, finding_id, verified_by, verified_at, outcome)
SELECT gen_random_uuid(), x.organisation_id, x.finding_id, x.fixed_by, x.fixed_at + interval '2 hours', 'verified'
FROM fixes x JOIN findings f ON f.id = x.finding_id WHERE f.state = 'verified' AND f.notes LIKE 'Bench finding %';`;

/**
 * The state autovacuum leaves a table in soon after a bulk insert (statistics, visibility map), so
 * index-only scans are measured as they run in steady use. One statement per call: VACUUM cannot
 * run inside the transaction psql wraps several statements in.
 */
const SETTLE_SQL = ['VACUUM (ANALYZE) findings', 'VACUUM (ANALYZE) fixes', 'VACUUM (ANALYZE) verifications'];

/** An HS256 access token like the server's own (claims sub, org, role), valid for an hour. */
function accessToken(claims) {
  const b64 = (o) => Buffer.from(JSON.stringify(o)).toString('base64url');
  const now = Math.floor(Date.now() / 1000);
  const unsigned = `${b64({ alg: 'HS256', typ: 'JWT' })}.${b64({ ...claims, iat: now, exp: now + 3600 })}`;
  return `${unsigned}.${createHmac('sha256', JWT_SECRET).update(unsigned).digest('base64url')}`;
}

function percentile(sorted, p) {
  return sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : NaN;
}

/** Runs autocannon and keeps every response time, so p95 is exact rather than the nearest reported bucket. */
function load(url, headers, durationS, connections = CONNECTIONS) {
  return new Promise((resolve, reject) => {
    const latencies = [];
    const instance = autocannon({ url, connections, duration: durationS, headers }, (error, result) => {
      if (error) return reject(error);
      latencies.sort((a, b) => a - b);
      resolve({
        requestsPerS: result.requests.total / (result.duration || durationS),
        non2xx: result.non2xx,
        errors: result.errors + result.timeouts,
        p50: percentile(latencies, 50),
        p95: percentile(latencies, 95),
        p99: percentile(latencies, 99),
        bytesPerResponse: result.requests.total ? result.throughput.total / result.requests.total : 0,
      });
    });
    instance.on('response', (_client, _status, _bytes, responseTime) => latencies.push(responseTime));
  });
}

/** One request at a time, `n` times: the latency a manager opening the screen sees. */
async function sequential(url, headers, n) {
  const times = [];
  for (let i = 0; i < n; i++) {
    const started = performance.now();
    const res = await fetch(url, { headers });
    await res.arrayBuffer();
    if (res.status !== 200) throw new Error(`${url} answered ${res.status}`);
    times.push(performance.now() - started);
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), max: times[times.length - 1] };
}

/** Peak and current resident memory of a process, KiB, from /proc (Linux). */
function memoryKiB(pid) {
  try {
    const status = readFileSync(`/proc/${pid}/status`, 'utf8');
    const field = (name) => Number(status.match(new RegExp(`${name}:\\s+(\\d+)`))?.[1] ?? NaN);
    return { peak: field('VmHWM'), now: field('VmRSS') };
  } catch {
    return { peak: NaN, now: NaN };
  }
}

/** Downloads the whole export, reading it as a stream, and reports rows, bytes, time and the server's RSS around it. */
async function exportRun(url, headers, pid) {
  const before = memoryKiB(pid);
  const started = performance.now();
  const res = await fetch(url, { headers });
  if (res.status !== 200) throw new Error(`${url} answered ${res.status}`);
  let bytes = 0;
  let lines = 0;
  let peakDuring = before.now;
  const sampler = setInterval(() => (peakDuring = Math.max(peakDuring, memoryKiB(pid).now)), 20);
  for await (const chunk of res.body) {
    bytes += chunk.length;
    for (const b of chunk) if (b === 10) lines++;
  }
  clearInterval(sampler);
  const after = memoryKiB(pid);
  return { rows: lines - 1, bytes, seconds: (performance.now() - started) / 1000, rssBeforeKiB: before.now, rssPeakDuringKiB: Math.max(peakDuring, after.now), vmHwmKiB: after.peak };
}

/** Microseconds per call of `fn`, run for about `ms` after a short warm-up (single thread, this process). */
function microsPerCall(fn, ms = 400) {
  for (let i = 0; i < 200; i++) fn();
  let calls = 0;
  const started = performance.now();
  while (performance.now() - started < ms) {
    for (let i = 0; i < 50; i++) fn();
    calls += 50;
  }
  return ((performance.now() - started) * 1000) / calls;
}

/**
 * What a list request does besides the query, each measured on its own in this process: checking
 * the access token (with the secret as a string, as jsonwebtoken rebuilds a key from it each call,
 * and as a key object made once, as the server does), writing the page as JSON, and parsing it
 * with the shared schema as the phone does (rows, then whole findings).
 */
async function requestPieces(token, rowsText, wholeText) {
  const jwt = createRequire(import.meta.url)('jsonwebtoken');
  const key = createSecretKey(Buffer.from(JWT_SECRET));
  const shared = await import('../../shared/dist/index.js');
  const rows = JSON.parse(rowsText);
  const whole = JSON.parse(wholeText);
  return {
    verifyString: microsPerCall(() => jwt.verify(token, JWT_SECRET, { algorithms: ['HS256'] })),
    verifyKey: microsPerCall(() => jwt.verify(token, key, { algorithms: ['HS256'] })),
    stringifyRows: microsPerCall(() => JSON.stringify(rows)),
    stringifyWhole: microsPerCall(() => JSON.stringify(whole)),
    parseRows: microsPerCall(() => shared.FindingListResponseSchema.parse(rows)),
    parseWhole: microsPerCall(() => shared.FindingFullListResponseSchema.parse(whole)),
  };
}

const fmt = (n, digits = 1) => n.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });

async function main() {
  say('building shared and server…');
  await buildAll({ web: false });
  const bin = await ensurePostgresBinaries();
  tmp = mkdtempSync(join(tmpdir(), 'plummet-bench-'));
  // PostgreSQL runs as its own user when we are root: it must be able to reach its folder.
  chmodSync(tmp, 0o755);
  pg = new LocalPostgres({ bin, dir: join(tmp, 'pg'), port: await freePort(), durable: false });
  await pg.init();
  await pg.start();
  await pg.ensureDatabase('plummet_bench');
  say(`throwaway PostgreSQL on 127.0.0.1:${pg.port}`);
  // Measured as deployed: the server as the application role, under row-level security.
  pg.ensureApplicationRole('plummet_app');

  const env = {
    ...process.env,
    NODE_ENV: 'development',
    DATABASE_URL: pg.urlAs('plummet_app', '', 'plummet_bench'),
    MIGRATION_DATABASE_URL: pg.url('plummet_bench'),
    JWT_SECRET,
    LOG_LEVEL: 'warn',
    HOST: '127.0.0.1',
  };
  await migrateAndSeed(env);
  const started = Date.now();
  pg.psql(BULK_FINDINGS_SQL, 'plummet_bench');
  for (const statement of SETTLE_SQL) pg.psql(statement, 'plummet_bench');
  const count = pg.psql('SELECT count(*) FROM findings', 'plummet_bench');
  say(`seeded ${Number(count).toLocaleString('en-GB')} findings in ${((Date.now() - started) / 1000).toFixed(1)} s`);

  const [userId, orgId] = pg
    .psql(
      "SELECT u.id || '|' || m.organisation_id FROM users u JOIN memberships m ON m.user_id = u.id WHERE u.email = 'manager@demo.test'",
      'plummet_bench',
    )
    .split('|');
  const token = accessToken({ sub: userId, org: orgId, role: 'manager' });

  // An object store that answers every request at once: /api/health checks the store, and one that
  // is unreachable (DNS to AWS, retries) would make the baseline measure the network, not the server.
  const storePort = await freePort();
  // In a process of its own, so the load generator in this process never slows its answers.
  store = spawn(
    process.execPath,
    ['-e', `require('node:http').createServer((q, s) => s.writeHead(200, { 'content-length': '0' }).end()).listen(${storePort}, '127.0.0.1')`],
    { stdio: 'ignore' },
  );
  const port = await freePort();
  server = await startServer(
    { ...env, NODE_ENV: 'production', ...PRODUCTION_STAND_INS, S3_ENDPOINT: `http://127.0.0.1:${storePort}`, PORT: String(port) },
    // A busy machine can take well over the default 30 s to start the server.
    { stdio: ['ignore', 'ignore', 'inherit'], timeoutMs: 180_000 },
  );
  let healthBody;
  for (let attempt = 0; attempt < 20 && healthBody?.status !== 'ok'; attempt++) {
    if (attempt) await new Promise((resolve) => setTimeout(resolve, 500));
    healthBody = await (await fetch(`http://127.0.0.1:${port}/api/health`)).json();
  }
  if (healthBody.status !== 'ok') throw new Error(`GET /api/health answered ${JSON.stringify(healthBody)}`);
  const base = `http://127.0.0.1:${port}/api`;
  const headers = { authorization: `Bearer ${token}` };

  const probe = await fetch(`${base}/findings?limit=50`, { headers });
  const pageText = await probe.text();
  const page = JSON.parse(pageText);
  if (probe.status !== 200 || page.items?.length !== 50) throw new Error(`GET /api/findings?limit=50 answered ${probe.status}: ${pageText.slice(0, 200)}`);
  // Bytes of the JSON body per finding (no headers, not compressed): the rows alone, then whole findings.
  const wholeText = await (await fetch(`${base}/findings?limit=50&estimate=full`, { headers })).text();
  const bodyBytes = { rows: Buffer.byteLength(pageText) / 50, whole: Buffer.byteLength(wholeText) / 50 };
  const plan = pg.psql(
    `EXPLAIN SELECT * FROM findings WHERE organisation_id = '${orgId}' ORDER BY risk_score DESC, id DESC LIMIT 51`,
    'plummet_bench',
  );
  say(`query plan of the page: ${plan.split('\n').map((l) => l.trim()).slice(0, 2).join(' / ')}`);

  say('warming up (2 s each)…');
  await load(`${base}/findings?limit=50`, headers, 2);
  await load(`${base}/health`, {}, 2);

  say(`GET /api/findings?limit=50 as a manager: ${CONNECTIONS} connections for ${DURATION_S} s…`);
  const findings = await load(`${base}/findings?limit=50`, headers, DURATION_S);
  say(`GET /api/findings?limit=50&estimate=full (whole findings, for comparison): ${CONNECTIONS} connections for ${DURATION_S} s…`);
  const whole = await load(`${base}/findings?limit=50&estimate=full`, headers, DURATION_S);
  say(`GET /api/health (baseline): ${CONNECTIONS} connections for ${DURATION_S} s…`);
  const health = await load(`${base}/health`, {}, DURATION_S);

  say('managers\' screens: 30 sequential requests each, then 10 connections for the same duration…');
  const overviewSeq = await sequential(`${base}/overview`, headers, 30);
  const trendsSeq = await sequential(`${base}/trends`, headers, 30);
  const healthSeq = await sequential(`${base}/health`, {}, 30);
  const overviewLoad = await load(`${base}/overview`, headers, DURATION_S, 10);
  const trendsLoad = await load(`${base}/trends`, headers, DURATION_S, 10);
  const pieces = await requestPieces(token, pageText, wholeText);
  say('GET /api/findings/export.csv of every finding…');
  const exported = await exportRun(`${base}/findings/export.csv`, headers, server.pid);

  const row = (name, r) =>
    `${name.padEnd(30)} ${fmt(r.requestsPerS, 0).padStart(9)} req/s   p50 ${fmt(r.p50).padStart(7)} ms   p95 ${fmt(r.p95).padStart(7)} ms   p99 ${fmt(r.p99).padStart(7)} ms   ${fmt(r.bytesPerResponse / 1024)} KiB/response   non-2xx ${r.non2xx}, errors ${r.errors}`;
  console.log('');
  console.log(`API benchmark: ${Number(count).toLocaleString('en-GB')} findings, ${CONNECTIONS} connections, ${DURATION_S} s per route, one server process (node ${process.version})`);
  console.log(row('GET /api/findings?limit=50', findings));
  console.log(row('  …&estimate=full', whole));
  console.log(row('GET /api/health (baseline)', health));
  console.log(
    `ratio findings / health: ${fmt(findings.requestsPerS / health.requestsPerS, 3)} × the requests/s, ${fmt(findings.p95 / health.p95, 2)} × the p95 latency ` +
      `(whole findings: ${fmt(whole.requestsPerS / health.requestsPerS, 3)} ×)`,
  );
  console.log(`JSON body per finding: ${fmt(bodyBytes.rows, 0)} bytes as list rows, ${fmt(bodyBytes.whole, 0)} bytes whole (estimate=full)`);
  console.log(
    `per request, besides the query (µs, this process): token check ${fmt(pieces.verifyString)} with a string secret, ${fmt(pieces.verifyKey)} with a key object; ` +
      `JSON of a page ${fmt(pieces.stringifyRows)} as rows, ${fmt(pieces.stringifyWhole)} whole; schema parse of a page ${fmt(pieces.parseRows)} as rows, ${fmt(pieces.parseWhole)} whole`,
  );
  const seq = (name, r) => `${name.padEnd(30)} one at a time: p50 ${fmt(r.p50).padStart(7)} ms   p95 ${fmt(r.p95).padStart(7)} ms   max ${fmt(r.max).padStart(7)} ms`;
  console.log('');
  console.log(seq('GET /api/overview', overviewSeq));
  console.log(seq('GET /api/trends', trendsSeq));
  console.log(seq('GET /api/health (baseline)', healthSeq));
  console.log(row('GET /api/overview (10 conn.)', overviewLoad));
  console.log(row('GET /api/trends (10 conn.)', trendsLoad));
  console.log(`ratio overview / health p50: ${fmt(overviewSeq.p50 / healthSeq.p50, 1)} ×; trends / health p50: ${fmt(trendsSeq.p50 / healthSeq.p50, 1)} ×`);
  console.log(
    `GET /api/findings/export.csv: ${exported.rows.toLocaleString('en-GB')} rows, ${fmt(exported.bytes / 1048576)} MiB in ${fmt(exported.seconds, 2)} s; ` +
      `server RSS ${fmt(exported.rssBeforeKiB / 1024)} MiB before, ${fmt(exported.rssPeakDuringKiB / 1024)} MiB peak while streaming (VmHWM since start ${fmt(exported.vmHwmKiB / 1024)} MiB)`,
  );
}

main()
  .catch(handleFatal)
  .finally(cleanup);
