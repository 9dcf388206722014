import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../../test/test-app.js';
import { dueState, estimateFinding, nextInspectionDue } from '@plummet/shared';
import { DEMO_FINDINGS } from './demo-records.js';
import { seedDemo } from './seed-demo.js';

const TABLES = ['organisations', 'users', 'memberships', 'sites', 'scaffolds', 'inspections', 'control_checks', 'findings', 'fixes', 'verifications', 'catalogue_items'];

async function counts(t: TestApp): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const table of TABLES) {
    const r = await t.drizzle.execute<{ n: number }>(sql.raw(`SELECT count(*)::int AS n FROM ${table}`));
    out[table] = r.rows[0].n;
  }
  return out;
}

describe('the demo seed', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(async () => {
    await t?.close();
  });

  it('holds two sites and four scaffolds for Harrow & Span, one of each for Otherbuild, and findings in every state and band', async () => {
    const perOrg = await t.drizzle.execute<{ slug: string; sites: number; scaffolds: number; findings: number }>(sql`
      SELECT o.slug,
        (SELECT count(*)::int FROM sites s WHERE s.organisation_id = o.id) AS sites,
        (SELECT count(*)::int FROM scaffolds s WHERE s.organisation_id = o.id) AS scaffolds,
        (SELECT count(*)::int FROM findings f WHERE f.organisation_id = o.id) AS findings
      FROM organisations o ORDER BY o.slug`);
    expect(perOrg.rows).toEqual([
      { slug: 'harrow-span', sites: 2, scaffolds: 4, findings: 12 },
      { slug: 'other-build', sites: 1, scaffolds: 1, findings: 2 },
    ]);
    const mix = await t.drizzle.execute<{ states: string[]; bands: string[]; finished: number }>(sql`
      SELECT array_agg(DISTINCT state::text ORDER BY state::text) AS states, array_agg(DISTINCT risk_band::text ORDER BY risk_band::text) AS bands,
        (SELECT count(*)::int FROM inspections WHERE finished_at IS NOT NULL) AS finished
      FROM findings`);
    expect(mix.rows[0]).toEqual({ states: ['fixed', 'made-safe', 'open', 'verified'], bands: ['High', 'Low', 'Medium'], finished: 5 });
  });

  it('gives every cleared or limited scaffold a signed inspection behind its tag, and leaves QL-B and FS-1 overdue for the due list', async () => {
    const rows = await t.drizzle.execute<{ reference: string; status: string; regime: string; last: string | null; next: string | null; finished: string | null; signed: boolean; tag: string | null }>(sql`
      SELECT sc.reference, sc.status::text AS status, si.regime::text AS regime, sc.last_inspected_at AS last, sc.next_due_at AS next,
        i.finished_at AS finished, (i.signature IS NOT NULL AND i.signed_at IS NOT NULL) AS signed, i.tag_status::text AS tag
      FROM scaffolds sc JOIN sites si ON si.id = sc.site_id
      LEFT JOIN LATERAL (SELECT * FROM inspections WHERE scaffold_id = sc.id AND finished_at IS NOT NULL ORDER BY finished_at DESC LIMIT 1) i ON true
      ORDER BY sc.reference`);
    const now = new Date();
    const states: Record<string, string> = {};
    for (const r of rows.rows) {
      if (r.status === 'closed') {
        expect(r.last, r.reference).toBeNull();
        continue;
      }
      expect(r.finished, r.reference).not.toBeNull();
      expect(r.signed, r.reference).toBe(true);
      expect(r.tag, r.reference).toBe(r.status);
      expect(new Date(r.last!).getTime(), r.reference).toBe(new Date(r.finished!).getTime());
      expect(new Date(r.next!).getTime(), r.reference).toBe(nextInspectionDue(new Date(r.finished!), r.regime as '7-day', 'Europe/London').getTime());
      states[r.reference] = dueState({ nextDueAt: r.next, lastInspectedAt: r.last }, null, now, 'Europe/London');
    }
    expect(states).toEqual({ 'FS-1': 'overdue', 'FS-2': 'later', 'MY-1': 'later', 'QL-A': 'later', 'QL-B': 'overdue' });
  });

  it('computes every finding’s risk with the shared physics', async () => {
    const rows = await t.drizzle.execute<{ id: string; risk_score: number; height_m: number; mass_kg: number; shape: never; exposure: never; likelihood_answers: never }>(
      sql`SELECT id, risk_score, height_m, mass_kg, shape, exposure, likelihood_answers FROM findings WHERE inspection_id IS NULL`,
    );
    for (const r of rows.rows) {
      const expected = estimateFinding({ massKg: r.mass_kg, heightM: r.height_m, shape: r.shape, exposure: r.exposure, likelihoodAnswers: r.likelihood_answers });
      expect(r.risk_score, r.id).toBe(expected.riskScore);
    }
    expect(rows.rows.length).toBe(DEMO_FINDINGS.filter((f) => f.inspection === null).length);
  });

  it('leaves one copy of everything when run again', async () => {
    const before = await counts(t);
    await seedDemo(t.drizzle);
    expect(await counts(t)).toEqual(before);
  });

  it('refuses to run unless development or test was asked for', async () => {
    const previous = process.env.NODE_ENV;
    process.env.NODE_ENV = 'production';
    try {
      await expect(seedDemo(t.drizzle)).rejects.toThrow(/production/);
    } finally {
      process.env.NODE_ENV = previous;
    }
  });
});
