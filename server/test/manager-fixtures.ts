import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { Db } from '../src/db/db.tokens.js';

/** Raw SQL helpers for hand-built data behind the managers' aggregates (counts the tests write out). */
export async function orgIdOf(db: Db, slug: string): Promise<string> {
  const result = await db.execute<{ id: string }>(sql`SELECT id::text AS id FROM organisations WHERE slug = ${slug}`);
  return result.rows[0].id;
}

export async function insertSite(db: Db, organisationId: string, name: string): Promise<string> {
  const id = randomUUID();
  await db.execute(sql`INSERT INTO sites (id, organisation_id, name, address, client_name, time_zone)
    VALUES (${id}, ${organisationId}, ${name}, '1 Test Row', 'Test Client', 'UTC')`);
  return id;
}

/** `nextDue`: 'past' (overdue), 'later-today' (half-way from now to UTC midnight), 'in-3-days' or null. */
export async function insertScaffold(
  db: Db,
  organisationId: string,
  siteId: string,
  status: string,
  nextDue: 'past' | 'later-today' | 'in-3-days' | null,
): Promise<string> {
  const id = randomUUID();
  const due = {
    past: sql`now() - interval '1 day'`,
    'later-today': sql`now() + ((date_trunc('day', now() AT TIME ZONE 'UTC') + interval '1 day') AT TIME ZONE 'UTC' - now()) / 2`,
    'in-3-days': sql`now() + interval '3 days'`,
  } as const;
  await db.execute(sql`INSERT INTO scaffolds (id, organisation_id, site_id, reference, elevations, lifts, lift_height_m, bays_per_elevation, status, next_due_at)
    VALUES (${id}, ${organisationId}, ${siteId}, ${`T-${id.slice(0, 4)}`}, ARRAY['North','South'], 6, 2, 10, ${status}::scaffold_status,
      ${nextDue ? due[nextDue] : sql`NULL`})`);
  return id;
}

export interface HandFinding {
  band: 'Low' | 'Medium' | 'High';
  state: 'open' | 'made-safe' | 'fixed' | 'verified';
  /** Hours from now (negative: past); null for no due time. */
  dueInHours?: number | null;
  /** Hours before now it was raised. */
  raisedHoursAgo?: number;
  elevation?: string;
  lift?: number;
  bay?: number;
  itemName?: string;
  notes?: string;
}

/** A finding copied from one of the organisation's seeded findings, with the fields a test controls. */
export async function insertFinding(db: Db, organisationId: string, scaffoldId: string, f: HandFinding): Promise<string> {
  const id = randomUUID();
  const score = { Low: 2, Medium: 6, High: 15 }[f.band];
  await db.execute(sql`
    INSERT INTO findings (id, organisation_id, scaffold_id, elevation, lift, bay, height_m, item_name, mass_kg, exposure,
      likelihood_answers, likelihood, estimate, severity, risk_score, risk_band, state, due_at, notes, created_by, created_at)
    SELECT ${id}, ${organisationId}, ${scaffoldId}, ${f.elevation ?? 'North'}, ${f.lift ?? 1}, ${f.bay ?? 1}, t.height_m,
      ${f.itemName ?? 'Test item'}, t.mass_kg, t.exposure, t.likelihood_answers, t.likelihood, t.estimate, t.severity, ${score},
      ${f.band}::risk_band, ${f.state}::finding_state,
      ${f.dueInHours === undefined || f.dueInHours === null ? sql`NULL` : sql`now() + ${f.dueInHours} * interval '1 hour'`},
      ${f.notes ?? ''}, t.created_by, now() - ${f.raisedHoursAgo ?? 1} * interval '1 hour'
    FROM findings t WHERE t.organisation_id = ${organisationId} LIMIT 1`);
  return id;
}

export async function insertFix(db: Db, organisationId: string, findingId: string, hoursAfterRaised: number): Promise<void> {
  await db.execute(sql`INSERT INTO fixes (id, organisation_id, finding_id, fixed_by, fixed_at)
    SELECT ${randomUUID()}, f.organisation_id, f.id, f.created_by, f.created_at + ${hoursAfterRaised} * interval '1 hour'
    FROM findings f WHERE f.id = ${findingId} AND f.organisation_id = ${organisationId}`);
}

export async function insertVerification(db: Db, findingId: string, outcome: 'verified' | 'reopened', at: string): Promise<void> {
  await db.execute(sql`INSERT INTO verifications (id, organisation_id, finding_id, verified_by, verified_at, outcome)
    SELECT ${randomUUID()}, f.organisation_id, f.id, f.created_by, ${at}::timestamptz, ${outcome}::verification_outcome
    FROM findings f WHERE f.id = ${findingId}`);
}

export async function insertConflict(db: Db, organisationId: string, findingId: string, status: 'open' | 'resolved'): Promise<void> {
  await db.execute(sql`INSERT INTO sync_conflicts (organisation_id, entity, entity_id, field, current_value, replaced_value,
      replaced_version, winner_client_id, mutation_id, status)
    VALUES (${organisationId}, 'finding', ${findingId}, 'notes', '"a"', '"b"', 1, ${randomUUID()}, 1, ${status}::sync_conflict_status)`);
}
