/**
 * Random requests against every operation the OpenAPI document lists: random bodies (shaped after
 * the operation's body schema, or any JSON, or broken JSON), random query values, path ids that
 * look like uuids and ids that are junk, sent anonymously and as each role. The server must never
 * answer 5xx, every 4xx carries a `code`, and a refused request leaves the database as it was
 * (row counts and a hash of every table's rows; the rate-limit table counts refusals by design).
 *
 * FUZZ_RUNS sets the requests per operation (default 6), FUZZ_SEED replays a run.
 */
import fc from 'fast-check';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type RunningServer, startBuiltServer } from '../support/server.js';

const RUNS = Number(process.env.FUZZ_RUNS ?? 6);
const SEED = Number(process.env.FUZZ_SEED ?? Date.now() % 2_147_483_647);
/** Tables that legitimately change on a refused request: attempts are counted there. */
const CHANGING_TABLES = new Set(['rate_limits']);
const ROLES = ['admin', 'manager', 'inspector', 'foreman'] as const;
type Who = (typeof ROLES)[number] | 'anonymous';

interface Schema {
  $ref?: string;
  type?: string | string[];
  properties?: Record<string, Schema>;
  items?: Schema;
  enum?: unknown[];
  anyOf?: Schema[];
  oneOf?: Schema[];
}
interface Operation {
  parameters?: { name: string; in: 'path' | 'query' | 'header'; schema?: Schema }[];
  requestBody?: { content?: Record<string, { schema?: Schema }> };
}
interface Doc {
  paths: Record<string, Record<string, Operation>>;
  components?: { schemas?: Record<string, Schema> };
}

const JUNK = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.constantFrom('', ' ', '0', '-1', '1e309', 'NaN', 'null', 'true', '[]', '{}', '../../etc/passwd', '%00', '\u0000', '😀', "' OR 1=1 --", '<script>x</script>', 'a'.repeat(3000)),
  fc.constantFrom('00000000-0000-0000-0000-000000000000', 'zzzzzzzz-zzzz-zzzz-zzzz-zzzzzzzzzzzz', 'ffffffff-ffff-ffff-ffff-ffffffffffff'),
  fc.integer().map(String),
  fc.uuid(),
);
const ID = fc.oneof({ weight: 3, arbitrary: fc.uuid() }, { weight: 2, arbitrary: JUNK });
const VALUE = fc.oneof(
  JUNK,
  fc.uuid(),
  fc.integer(),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
  fc.array(JUNK, { maxLength: 3 }),
  fc.jsonValue({ maxDepth: 2 }),
  fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
);

function resolveSchema(doc: Doc, schema: Schema | undefined): Schema | undefined {
  if (schema?.$ref) return doc.components?.schemas?.[schema.$ref.split('/').pop() ?? ''];
  return schema;
}

/** A value shaped like the schema, with random contents: enough to get past the outer checks sometimes. */
function shaped(doc: Doc, schema: Schema | undefined, depth = 0): fc.Arbitrary<unknown> {
  const s = resolveSchema(doc, schema);
  if (!s || depth > 3) return VALUE;
  const choices = s.anyOf ?? s.oneOf;
  if (choices?.length) return fc.oneof(...choices.map((c) => shaped(doc, c, depth + 1)));
  if (s.enum?.length) return fc.oneof(fc.constantFrom(...s.enum), VALUE);
  if (s.properties) {
    const fields = Object.fromEntries(Object.entries(s.properties).map(([k, v]) => [k, fc.oneof(shaped(doc, v, depth + 1), VALUE)]));
    return fc.record(fields, { requiredKeys: [] });
  }
  if (s.items) return fc.array(shaped(doc, s.items, depth + 1), { maxLength: 3 });
  return VALUE;
}

interface Request {
  who: Who;
  path: string;
  query: [string, string][];
  body: { kind: 'none' } | { kind: 'json'; value: unknown } | { kind: 'broken' };
}

function requests(doc: Doc, path: string, op: Operation): fc.Arbitrary<Request> {
  const params = op.parameters ?? [];
  const inPath = params.filter((p) => p.in === 'path').map((p) => p.name);
  const inQuery = params.filter((p) => p.in === 'query').map((p) => p.name);
  const json = op.requestBody?.content?.['application/json']?.schema;
  const pathValues = fc.tuple(...inPath.map(() => ID));
  const query = fc.array(fc.tuple(inQuery.length ? fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...inQuery) }, { weight: 1, arbitrary: fc.string({ maxLength: 8 }) }) : fc.string({ maxLength: 8 }), fc.oneof(JUNK, fc.integer().map(String))), { maxLength: 4 });
  const body = fc.oneof(
    { weight: 1, arbitrary: fc.constant({ kind: 'none' as const }) },
    { weight: json ? 4 : 1, arbitrary: shaped(doc, json).map((value) => ({ kind: 'json' as const, value })) },
    { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 2 }).map((value) => ({ kind: 'json' as const, value })) },
    { weight: 1, arbitrary: fc.constant({ kind: 'broken' as const }) },
  );
  return fc.record({
    who: fc.constantFrom<Who>('anonymous', ...ROLES),
    path: pathValues.map((values) => values.reduce<string>((p, v, i) => p.replace(`{${inPath[i]}}`, encodeURIComponent(v)), path)),
    query,
    body,
  });
}

/** Row counts and a hash of every table's rows (sorted), except the tables that count refusals. */
async function fingerprint(db: pg.Client, tables: string[]): Promise<Record<string, string>> {
  const sql = tables.map((t) => `select '${t}' as t, count(*)::int as n, coalesce(md5(string_agg(x::text, '|' order by x::text)), '') as h from "${t}" x`).join(' union all ');
  const rows = (await db.query<{ t: string; n: number; h: string }>(sql)).rows;
  return Object.fromEntries(rows.map((r) => [r.t, `${r.n}:${r.h}`]));
}

describe('random requests over every route of the OpenAPI document', () => {
  let server: RunningServer;
  let db: pg.Client;
  let doc: Doc;
  let tables: string[];
  const tokens = new Map<Who, string>();

  beforeAll(async () => {
    server = await startBuiltServer({ env: { MAIL_WORKERS: 'false' } });
    db = new pg.Client({ connectionString: server.db.url });
    await db.connect();
    doc = (await (await fetch(`${server.url}/api/docs/openapi.json`)).json()) as Doc;
    tables = (
      await db.query<{ name: string }>("select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1")
    ).rows
      .map((r) => r.name)
      .filter((t) => !CHANGING_TABLES.has(t));
    for (const role of ROLES) {
      const res = await fetch(`${server.url}/api/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: `${role}@demo.test`, password: 'plummet-demo' }) });
      tokens.set(role, ((await res.json()) as { accessToken: string }).accessToken);
    }
  });
  afterAll(async () => {
    await db?.end();
    await server?.dispose();
  });

  it('never answers 5xx, gives every 4xx a code, and leaves the database unchanged when it refuses', async () => {
    const problems: string[] = [];
    let operations = 0;
    let sent = 0;
    let before = await fingerprint(db, tables);
    for (const [path, item] of Object.entries(doc.paths)) {
      for (const [method, op] of Object.entries(item)) {
        if (!['get', 'post', 'put', 'patch', 'delete'].includes(method)) continue;
        operations++;
        const samples = fc.sample(requests(doc, path, op), { numRuns: RUNS, seed: SEED + operations });
        for (const r of samples) {
          const url = `${server.url}${r.path}${r.query.length ? `?${new URLSearchParams(r.query).toString()}` : ''}`;
          const headers: Record<string, string> = { Accept: 'application/json' };
          const token = tokens.get(r.who);
          if (token) headers.Authorization = `Bearer ${token}`;
          let body: string | undefined;
          if (r.body.kind !== 'none' && method !== 'get') {
            headers['Content-Type'] = 'application/json';
            body = r.body.kind === 'broken' ? '{"broken": ' : JSON.stringify(r.body.value ?? null);
          }
          const res = await fetch(url, { method: method.toUpperCase(), headers, body, redirect: 'manual' });
          const text = await res.text();
          sent++;
          const what = `${method.toUpperCase()} ${path} as ${r.who} → ${res.status} (${url.slice(server.url.length, 160)}${body ? ` body ${body.slice(0, 200)}` : ''})`;
          if (res.status >= 500) problems.push(`${what}: ${text.slice(0, 200)}`);
          if (res.status >= 400 && res.status < 500) {
            let code: unknown;
            try {
              code = (JSON.parse(text) as { code?: unknown }).code;
            } catch {
              /* not JSON */
            }
            if (typeof code !== 'string' || code === '') problems.push(`${what}: a 4xx without a code: ${text.slice(0, 200)}`);
          }
          const after = await fingerprint(db, tables);
          if (res.status >= 400) {
            const changed = Object.keys(after).filter((t) => after[t] !== before[t]);
            if (changed.length) problems.push(`${what}: refused, yet changed ${changed.join(', ')}`);
          }
          before = after;
        }
      }
    }
    expect(operations).toBeGreaterThan(30);
    expect(sent).toBe(operations * RUNS);
    expect(problems, `seed ${SEED} (FUZZ_SEED=${SEED} replays it)`).toEqual([]);
  }, 110_000);
});
