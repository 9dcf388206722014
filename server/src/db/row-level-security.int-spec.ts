/**
 * Organisation isolation enforced by PostgreSQL itself: connected as the application role (what
 * the server uses), nothing of any organisation is visible or writable until `app.org_id` is set,
 * and with organisation A set no row of organisation B shows in any table. Tables are taken from
 * the catalogue, so a new table holding organisation data cannot be forgotten: it fails here
 * until it has row-level security and a line below saying how its rows belong to an organisation.
 */
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn } from '../../test/sign-in.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

/** Tables that hold no organisation's data, deliberately outside row-level security. */
const OUTSIDE_ROW_SECURITY = new Set(['rate_limits']);

/** How a row of each table without an organisation_id column belongs to an organisation ($1). */
const BELONGS_TO: Record<string, string> = {
  organisations: 'id = $1',
  site_managers: 'EXISTS (SELECT 1 FROM sites s WHERE s.id = site_managers.site_id AND s.organisation_id = $1)',
  users: 'EXISTS (SELECT 1 FROM memberships m WHERE m.user_id = users.id AND m.organisation_id = $1)',
  sync_client_versions: 'EXISTS (SELECT 1 FROM sync_clients c WHERE c.id = sync_client_versions.client_id AND c.organisation_id = $1)',
};

let t: TestApp;
let owner: pg.Client;
let app: pg.Client;
let orgA: string;
let orgB: string;
let allTables: string[];
let orgColumnTables: Set<string>;

function belongsTo(table: string): string {
  if (orgColumnTables.has(table)) return 'organisation_id = $1';
  const rule = BELONGS_TO[table];
  if (!rule) throw new Error(`${table}: say in BELONGS_TO how its rows belong to an organisation, or list it in OUTSIDE_ROW_SECURITY`);
  return rule;
}

async function ownerCount(table: string, where = 'true', params: unknown[] = []): Promise<number> {
  const { rows } = await owner.query<{ n: number }>(`SELECT count(*)::int AS n FROM ${table} WHERE ${where}`, params);
  return rows[0].n;
}

/** Runs `work` on the application role's connection inside a transaction, with `app.org_id` set when given. */
async function asApp<T>(organisationId: string | null, work: (c: pg.Client) => Promise<T>): Promise<T> {
  await app.query('BEGIN');
  try {
    if (organisationId) await app.query(`SELECT set_config('app.org_id', $1, true)`, [organisationId]);
    return await work(app);
  } finally {
    await app.query('ROLLBACK');
  }
}

/** One row of the table as JSON (an organisation's row where the table has both kinds). */
async function sampleRow(table: string, organisationId?: string): Promise<Record<string, unknown> | null> {
  const where = organisationId ? `WHERE ${belongsTo(table)}` : orgColumnTables.has(table) ? 'WHERE organisation_id IS NOT NULL' : '';
  const { rows } = await owner.query<{ row: Record<string, unknown> }>(
    `SELECT to_jsonb(x) AS row FROM ${table} x ${where.replaceAll(`${table}.`, 'x.')} LIMIT 1`,
    organisationId ? [organisationId] : [],
  );
  return rows[0]?.row ?? null;
}

/**
 * Copies one of `from`'s rows into `to` for every organisation_id table where `to` has none, with
 * fresh values in its unique columns, so that B has a row to hide in as many tables as A.
 */
async function giveRowsTo(to: string, from: string): Promise<void> {
  for (const table of orgColumnTables) {
    if ((await ownerCount(table, 'organisation_id = $1', [to])) > 0) continue;
    const row = await sampleRow(table, from);
    if (!row) continue;
    const { rows: unique } = await owner.query<{ name: string; type: string }>(
      `SELECT DISTINCT a.attname AS name, format_type(a.atttypid, a.atttypmod) AS type
       FROM pg_index i JOIN pg_attribute a ON a.attrelid = i.indrelid AND a.attnum = ANY (i.indkey)
       WHERE i.indrelid = $1::regclass AND i.indisunique AND a.attname <> 'organisation_id'`,
      [table],
    );
    const fresh: Record<string, unknown> = { ...row, organisation_id: to };
    for (const { name, type } of unique) {
      if (type === 'uuid') fresh[name] = crypto.randomUUID();
      else if (type === 'text') fresh[name] = `copy-${crypto.randomUUID()}`;
      else if (type === 'date') fresh[name] = '2099-12-31';
      else if (/int|numeric/.test(type)) fresh[name] = Number(row[name] ?? 0) + 1_000_000;
    }
    // Test rows only: foreign keys and triggers are left out (a fresh unique column may be one).
    await owner.query(`SET session_replication_role = replica`);
    await owner.query(`INSERT INTO ${table} SELECT * FROM jsonb_populate_record(NULL::${table}, $1::jsonb)`, [JSON.stringify(fresh)]);
    await owner.query(`SET session_replication_role = DEFAULT`);
  }
}

beforeAll(async () => {
  t = await startTestApp();
  owner = new pg.Client({ connectionString: t.db.url });
  app = new pg.Client({ connectionString: t.db.appUrl });
  await owner.connect();
  await app.connect();
  const orgs = await owner.query<{ id: string; slug: string }>(`SELECT id::text, slug FROM organisations ORDER BY slug`);
  orgA = orgs.rows.find((o) => o.slug === 'harrow-span')!.id;
  orgB = orgs.rows.find((o) => o.slug === 'other-build')!.id;
  // Sessions and e-mailed links in both organisations, through the routes that write them.
  for (const email of ['admin@demo.test', 'manager@other.test']) {
    await signIn(t.baseUrl, email);
    await fetch(`${t.baseUrl}/api/auth/password-reset`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email }),
    });
  }
  const tables = await owner.query<{ name: string }>(
    `SELECT c.relname AS name FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
     WHERE n.nspname = 'public' AND c.relkind IN ('r', 'p') ORDER BY 1`,
  );
  allTables = tables.rows.map((r) => r.name);
  const withColumn = await owner.query<{ name: string }>(
    `SELECT table_name AS name FROM information_schema.columns WHERE table_schema = 'public' AND column_name = 'organisation_id'`,
  );
  orgColumnTables = new Set(withColumn.rows.map((r) => r.name).filter((name) => allTables.includes(name)));
  // Rows the demo does not make, written directly for both.
  for (const organisationId of [orgA, orgB]) {
    await owner.query(
      `WITH member AS (SELECT user_id FROM memberships WHERE organisation_id = $1 LIMIT 1),
            site AS (SELECT id FROM sites WHERE organisation_id = $1 LIMIT 1),
            client AS (INSERT INTO sync_clients (id, organisation_id, user_id) SELECT $2, $1, user_id FROM member RETURNING id),
            m AS (INSERT INTO sync_mutations (client_id, mutation_id, organisation_id, entity, entity_id, action, outcome)
                  SELECT id, 1, $1, 'finding', gen_random_uuid(), 'update', 'applied' FROM client),
            a AS (INSERT INTO audit_events (organisation_id, entity_type, entity_id, action) VALUES ($1, 'site', 'x', 'test')),
            d AS (INSERT INTO digest_runs (organisation_id, local_date) VALUES ($1, '2026-01-01')),
            tomb AS (INSERT INTO sync_tombstones (organisation_id, record_type, record_id, reason) VALUES ($1, 'site', 'x', 'deleted'))
       INSERT INTO site_managers (site_id, user_id) SELECT site.id, member.user_id FROM site, member ON CONFLICT DO NOTHING`,
      [organisationId, crypto.randomUUID()],
    );
  }
  await giveRowsTo(orgB, orgA);
  await giveRowsTo(orgA, orgB);
});

afterAll(async () => {
  await app?.end();
  await owner?.end();
  await t?.close();
});

describe('row-level security', () => {
  it('is enabled and forced, with a policy, on every table holding organisation data', async () => {
    const { rows } = await owner.query<{ name: string; enabled: boolean; forced: boolean; policies: number }>(
      `SELECT c.relname AS name, c.relrowsecurity AS enabled, c.relforcerowsecurity AS forced,
              (SELECT count(*)::int FROM pg_policy p WHERE p.polrelid = c.oid) AS policies
       FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace WHERE n.nspname = 'public' AND c.relkind IN ('r', 'p')`,
    );
    const missing = rows
      .filter((r) => !OUTSIDE_ROW_SECURITY.has(r.name) && !(r.enabled && r.forced && r.policies > 0))
      .map((r) => r.name);
    expect(missing, 'tables without forced row-level security').toEqual([]);
    for (const name of orgColumnTables) expect(OUTSIDE_ROW_SECURITY.has(name), `${name} has an organisation_id`).toBe(false);
    // Every protected table says how its rows belong to an organisation (throws otherwise).
    for (const name of allTables.filter((n) => !OUTSIDE_ROW_SECURITY.has(n))) belongsTo(name);
  });

  it('requires an organisation on every row that names one, but the built-in catalogue items shared by all', async () => {
    const { rows } = await owner.query<{ name: string }>(
      `SELECT table_name AS name FROM information_schema.columns
       WHERE table_schema = 'public' AND column_name = 'organisation_id' AND is_nullable = 'YES' ORDER BY 1`,
    );
    expect(rows.map((r) => r.name).filter((name) => orgColumnTables.has(name))).toEqual(['catalogue_items']);
  });

  it('binds the application role: no superuser, no BYPASSRLS, owner of nothing', async () => {
    const { rows } = await app.query<{ rolsuper: boolean; rolbypassrls: boolean; owned: number }>(
      `SELECT r.rolsuper, r.rolbypassrls,
         (SELECT count(*)::int FROM pg_class c WHERE pg_has_role(current_user, c.relowner, 'USAGE')
            AND c.relnamespace = 'public'::regnamespace) AS owned
       FROM pg_roles r WHERE r.rolname = current_user`,
    );
    expect(rows[0]).toEqual({ rolsuper: false, rolbypassrls: false, owned: 0 });
  });

  it('shows the application role no organisation row and refuses its writes while no organisation is set', async () => {
    const protectedTables = allTables.filter((n) => !OUTSIDE_ROW_SECURITY.has(n));
    let tablesWithRows = 0;
    for (const table of protectedTables) {
      const stored = await ownerCount(table, orgColumnTables.has(table) ? 'organisation_id IS NOT NULL' : 'true');
      if (stored > 0) tablesWithRows++;
      const visible = await asApp(null, async (c) => {
        const where = orgColumnTables.has(table) ? 'WHERE organisation_id IS NOT NULL' : '';
        return (await c.query<{ n: number }>(`SELECT count(*)::int AS n FROM ${table} ${where}`)).rows[0].n;
      });
      expect(visible, `${table}: ${stored} rows stored`).toBe(0);
      const row = await sampleRow(table);
      if (!row) continue;
      await expect(
        asApp(null, (c) => c.query(`INSERT INTO ${table} SELECT * FROM jsonb_populate_record(NULL::${table}, $1::jsonb)`, [JSON.stringify(row)])),
        `${table}: insert without an organisation`,
      ).rejects.toThrow(/row-level security/);
    }
    // The demo, the sign-ins and the rows written above fill most tables; all of them were hidden.
    expect(tablesWithRows).toBeGreaterThanOrEqual(17);
  });

  it('shows organisation A exactly its own rows in every table, none of B, and refuses writing B rows', async () => {
    let tablesWithBothOrganisations = 0;
    for (const table of allTables.filter((n) => !OUTSIDE_ROW_SECURITY.has(n))) {
      const rule = belongsTo(table);
      const ofA = await ownerCount(table, rule, [orgA]);
      const ofB = await ownerCount(table, rule, [orgB]);
      if (ofA > 0 && ofB > 0) tablesWithBothOrganisations++;
      const seen = await asApp(orgA, async (c) => {
        const all = await c.query<{ n: number }>(`SELECT count(*)::int AS n FROM ${table}`);
        const ofBSeen = await c.query<{ n: number }>(`SELECT count(*)::int AS n FROM ${table} WHERE ${rule}`, [orgB]);
        return { all: all.rows[0].n, ofB: ofBSeen.rows[0].n };
      });
      const builtIns = table === 'catalogue_items' ? await ownerCount(table, 'organisation_id IS NULL') : 0;
      expect(seen, `${table}: A owns ${ofA}, B owns ${ofB}`).toEqual({ all: ofA + builtIns, ofB: 0 });

      // (A new account may be written by any organisation's invitation before its membership exists.)
      const rowOfB = table === 'users' ? null : await sampleRow(table, orgB);
      if (!rowOfB) continue;
      await expect(
        asApp(orgA, (c) => c.query(`INSERT INTO ${table} SELECT * FROM jsonb_populate_record(NULL::${table}, $1::jsonb)`, [JSON.stringify(rowOfB)])),
        `${table}: inserting a row of B while A is set`,
      ).rejects.toThrow(/row-level security/);
    }
    expect(tablesWithBothOrganisations).toBeGreaterThanOrEqual(17);
  });
});
