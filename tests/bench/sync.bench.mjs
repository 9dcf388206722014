#!/usr/bin/env node
// `npm run bench:sync`: sync on loopback with the real database. Times a push of 1,000 finding
// mutations (one transaction: estimates recomputed, audit and outcome rows written; the median of
// three rounds) and a pull of 10,000 changes (pages of 1,000, findings as rows and unpacked, as the
// phone pulls; then as records, as older phones pull, for comparison), against baselines measured
// in the same run on the same database: a raw batched INSERT of the same 1,000 rows and a raw
// SELECT of the same 10,000 rows.
// A throwaway PostgreSQL in a temp dir; leaves nothing behind. Nothing about speed is asserted.
import { createHmac, randomUUID } from 'node:crypto';
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { unpackPullPage } from '@plummet/shared';
import pg from 'pg';
import { buildAll, migrateAndSeed, startServer, stopChild } from '../../scripts/lib/app.mjs';
import { freePort } from '../../scripts/lib/free-port.mjs';
import { handleFatal, say } from '../../scripts/lib/log.mjs';
import { ensurePostgresBinaries, LocalPostgres } from '../../scripts/lib/postgres.mjs';

const PUSH = 1000;
const PUSH_ROUNDS = 3;
const PULL = 10_000;
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

let postgres;
let server;
let tmp;

async function cleanup() {
  await stopChild(server);
  server = undefined;
  if (postgres) {
    postgres.stop();
    postgres = undefined;
  }
  if (tmp) rmSync(tmp, { recursive: true, force: true });
}

for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => void cleanup().finally(() => process.exit(130)));
}

function accessToken(claims) {
  const b64 = (o) => Buffer.from(JSON.stringify(o)).toString('base64url');
  const now = Math.floor(Date.now() / 1000);
  const unsigned = `${b64({ alg: 'HS256', typ: 'JWT' })}.${b64({ ...claims, iat: now, exp: now + 3600 })}`;
  return `${unsigned}.${createHmac('sha256', JWT_SECRET).update(unsigned).digest('base64url')}`;
}

const LIKELIHOOD = { securing: 'loose', edgeDistance: 'at-edge', activity: 'light', wind: 'calm', footTraffic: 'frequent' };

function findingBody(scaffoldId, n) {
  return {
    id: randomUUID(),
    scaffoldId,
    elevation: 'North',
    lift: 1 + (n % 6),
    bay: 1 + (n % 12),
    heightM: 2 + (n % 10),
    item: { name: `Bench item ${n}`, massKg: 0.5 + (n % 20) / 10, shape: { kind: 'box', lengthM: 0.2, widthM: 0.1, heightM: 0.05 } },
    exposure: 'public',
    likelihoodAnswers: LIKELIHOOD,
    notes: `Bench finding ${n}`,
  };
}

const ms = (t0) => Number(process.hrtime.bigint() - t0) / 1e6;
const fmt = (n, digits = 1) => n.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });

async function main() {
  say('building shared and server…');
  await buildAll({ web: false });
  const bin = await ensurePostgresBinaries();
  tmp = mkdtempSync(join(tmpdir(), 'plummet-sync-bench-'));
  chmodSync(tmp, 0o755);
  postgres = new LocalPostgres({ bin, dir: join(tmp, 'pg'), port: await freePort(), durable: false });
  await postgres.init();
  await postgres.start();
  await postgres.ensureDatabase('plummet_bench');
  // Measured as deployed: the server as the application role, under row-level security.
  postgres.ensureApplicationRole('plummet_app');
  const env = { ...process.env, NODE_ENV: 'development', DATABASE_URL: postgres.urlAs('plummet_app', '', 'plummet_bench'), MIGRATION_DATABASE_URL: postgres.url('plummet_bench'), JWT_SECRET, LOG_LEVEL: 'warn', HOST: '127.0.0.1' };
  await migrateAndSeed(env);
  const port = await freePort();
  server = await startServer({ ...env, NODE_ENV: 'production', ...PRODUCTION_STAND_INS, PORT: String(port), MAX_JSON_BODY: '5mb' }, { stdio: ['ignore', 'ignore', 'inherit'] });
  const base = `http://127.0.0.1:${port}/api`;

  const db = new pg.Client({ connectionString: postgres.url('plummet_bench') });
  await db.connect();
  const q1 = async (text, values) => (await db.query(text, values)).rows[0];
  const who = await q1("SELECT u.id AS user_id, m.organisation_id AS org FROM users u JOIN memberships m ON m.user_id = u.id WHERE u.email = 'inspector@demo.test'");
  const scaffold = await q1("SELECT s.id FROM scaffolds s WHERE s.organisation_id = $1 AND s.reference = 'QL-A'", [who.org]);
  const headers = { authorization: `Bearer ${accessToken({ sub: who.user_id, org: who.org, role: 'inspector' })}`, 'content-type': 'application/json' };
  const push = async (clientId, mutations) => {
    const res = await fetch(`${base}/sync/push`, { method: 'POST', headers, body: JSON.stringify({ clientId, mutations }) });
    const body = await res.json();
    if (res.status !== 200) throw new Error(`push answered ${res.status}: ${JSON.stringify(body).slice(0, 300)}`);
    return body;
  };
  const mutationsOf = (bodies) => bodies.map((b, i) => ({ id: i + 1, entity: 'finding', entityId: b.id, action: 'create', baseVersion: 0, payload: b }));

  say('warming up…');
  await push(randomUUID(), mutationsOf(Array.from({ length: 50 }, (_, n) => findingBody(scaffold.id, n))));

  // Baseline: the same 1,000 rows (new ids), as stored, in one batched INSERT.
  const copy = `INSERT INTO findings (id, organisation_id, inspection_id, scaffold_id, elevation, lift, bay, height_m, catalogue_item_id, item_name, mass_kg, shape,
      exposure, likelihood_answers, likelihood, estimate, estimate_row, severity, risk_score, risk_band, state, assignee_id, due_at, notes, made_safe_note, created_by)
    SELECT gen_random_uuid(), (r).organisation_id, (r).inspection_id, (r).scaffold_id, (r).elevation, (r).lift, (r).bay, (r).height_m, (r).catalogue_item_id,
      (r).item_name, (r).mass_kg, (r).shape, (r).exposure, (r).likelihood_answers, (r).likelihood, (r).estimate, (r).estimate_row, (r).severity, (r).risk_score, (r).risk_band,
      (r).state, (r).assignee_id, (r).due_at, (r).notes, (r).made_safe_note, (r).created_by
    FROM json_populate_recordset(null::findings, $1::json) r`;
  // This machine's speed drifts between runs: three rounds, each a push then the raw INSERT of the
  // rows it stored, and the median of each counts.
  const pushRuns = [];
  const insertRuns = [];
  for (let round = 1; round <= PUSH_ROUNDS; round++) {
    say(`pushing ${PUSH} mutations in one batch (round ${round} of ${PUSH_ROUNDS})…`);
    const bodies = Array.from({ length: PUSH }, (_, n) => findingBody(scaffold.id, n));
    let t0 = process.hrtime.bigint();
    const pushed = await push(randomUUID(), mutationsOf(bodies));
    pushRuns.push(ms(t0));
    const applied = pushed.results.filter((r) => r.outcome === 'applied').length;
    if (applied !== PUSH) throw new Error(`only ${applied} of ${PUSH} mutations applied`);
    const stored = (await db.query('SELECT * FROM findings WHERE id = ANY($1::uuid[])', [bodies.map((b) => b.id)])).rows;
    const rowsJson = JSON.stringify(stored.map(({ sync_xid: _x, ...row }) => row));
    t0 = process.hrtime.bigint();
    await db.query('BEGIN');
    await db.query(copy, [rowsJson]);
    await db.query('COMMIT');
    insertRuns.push(ms(t0));
  }
  const median = (runs) => [...runs].sort((a, b) => a - b)[runs.length >> 1];
  const pushMs = median(pushRuns);
  const insertMs = median(insertRuns);

  // Top the feed up to 10,000 findings after a cursor taken now, then pull them all.
  const cursorRow = await q1(
    `SELECT sync_xid::text || '.' || sync_seq AS c FROM findings WHERE organisation_id = $1 ORDER BY sync_xid DESC, sync_seq DESC LIMIT 1`,
    [who.org],
  );
  await db.query(
    `WITH t AS (SELECT * FROM findings WHERE organisation_id = $1 LIMIT 1)
     INSERT INTO findings (id, organisation_id, scaffold_id, elevation, lift, bay, height_m, item_name, mass_kg, shape, exposure, likelihood_answers,
       likelihood, estimate, estimate_row, severity, risk_score, risk_band, notes, created_by)
     SELECT gen_random_uuid(), t.organisation_id, t.scaffold_id, t.elevation, t.lift, t.bay, t.height_m, t.item_name, t.mass_kg, t.shape, t.exposure,
       t.likelihood_answers, t.likelihood, t.estimate, t.estimate_row, t.severity, t.risk_score, t.risk_band, 'Pull bench ' || g, t.created_by
     FROM generate_series(1, ${PULL}) g CROSS JOIN t`,
    [who.org],
  );
  await db.query('ANALYZE findings');

  /** The whole feed after the cursor, page by page, as a phone pulls it in `format`; rows unpacked as the phone unpacks them. */
  const pullAll = async (format) => {
    const t = process.hrtime.bigint();
    let cursor = cursorRow.c;
    let changes = 0;
    let pages = 0;
    let bytes = 0;
    for (;;) {
      const res = await fetch(`${base}/sync/pull?limit=1000&format=${format}&cursor=${cursor}`, { headers });
      const text = await res.text();
      if (res.status !== 200) throw new Error(`pull answered ${res.status}: ${text.slice(0, 300)}`);
      bytes += Buffer.byteLength(text);
      const page = unpackPullPage(JSON.parse(text));
      changes += page.changes.length;
      pages += 1;
      cursor = page.cursor;
      if (!page.hasMore) break;
    }
    if (changes !== PULL) throw new Error(`pulled ${changes} changes as ${format}, expected ${PULL}`);
    return { ms: ms(t), pages, bytes };
  };
  // As the phone pulls (mobile-web/src/sync/sync-transport.ts): findings as rows. Then the same feed
  // as records, as phones from before rows pull it, for comparison.
  // The first read of fresh rows pays for fetching them into PostgreSQL's cache: one pull warms it,
  // then each format is timed twice, alternately, and the faster of its two counts.
  say(`pulling ${PULL} changes in pages of 1,000…`);
  await pullAll('records');
  const timed = { rows: [], records: [] };
  for (let round = 0; round < 2; round++) for (const format of ['rows', 'records']) timed[format].push(await pullAll(format));
  const fastest = (runs) => runs.reduce((a, b) => (b.ms < a.ms ? b : a));
  const rows = fastest(timed.rows);
  const records = fastest(timed.records);

  // Baseline: the same 10,000 rows read raw: every column but the pull's own estimate_row (a copy of
  // the estimate), so the baseline stays the one earlier runs measured.
  const columns = (
    await db.query(`SELECT string_agg(quote_ident(attname), ', ' ORDER BY attnum) AS list FROM pg_attribute
      WHERE attrelid = 'findings'::regclass AND attnum > 0 AND NOT attisdropped AND attname <> 'estimate_row'`)
  ).rows[0].list;
  const t0 = process.hrtime.bigint();
  const raw = await db.query(`SELECT ${columns} FROM findings WHERE organisation_id = $1 AND notes LIKE 'Pull bench %'`, [who.org]);
  const selectMs = ms(t0);
  await db.end();

  console.log('');
  console.log(`Sync benchmark (loopback, one server process, node ${process.version})`);
  console.log(`push ${PUSH} mutations (one batch):   ${fmt(pushMs).padStart(8)} ms   raw batched INSERT of the same rows: ${fmt(insertMs).padStart(7)} ms   ratio ${fmt(pushMs / insertMs, 1)} ×   goal ≤ 700 ms`);
  console.log(`  median of ${PUSH_ROUNDS} rounds; push ${pushRuns.map((t) => fmt(t, 0)).join(' / ')} ms, INSERT ${insertRuns.map((t) => fmt(t, 0)).join(' / ')} ms`);
  console.log(
    `pull ${PULL} changes (${rows.pages} pages):    ${fmt(rows.ms).padStart(8)} ms   raw SELECT of the same ${raw.rowCount} rows:     ${fmt(selectMs).padStart(7)} ms   ratio ${fmt(rows.ms / selectMs, 1)} ×   goal ≤ 500 ms`,
  );
  const size = (r) => `${fmt(r.bytes / 1024 / 1024, 1)} MB of JSON before compression, ${fmt(r.bytes / PULL, 0)} bytes a change`;
  console.log(`  findings as rows (the phone):      ${size(rows)}`);
  console.log(`  as records (older phones):         ${fmt(records.ms).padStart(8)} ms, ${size(records)}; rows take ${fmt(rows.ms / records.ms, 2)} × the time`);
}

main()
  .catch(handleFatal)
  .finally(cleanup);
