import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Db } from '../src/db/db.tokens.js';
import {
  controlChecks,
  findings,
  fixes,
  inspections,
  organisations,
  scaffolds,
  sites,
  users,
  verifications,
} from '../src/db/schema/index.js';

/**
 * Rows of the inspection model written straight into the database, for tests of features that
 * need them to exist (photos, reports…) without going through the API that creates them.
 * Every builder takes the required links and optional overrides; defaults are plausible and
 * fictional. A finding's estimate here is a placeholder, not the shared physics' result.
 */

type Insert<T extends { $inferInsert: unknown }> = T['$inferInsert'];

export async function organisationId(db: Db, slug: string): Promise<string> {
  const [row] = await db.select({ id: organisations.id }).from(organisations).where(eq(organisations.slug, slug));
  if (!row) throw new Error(`no organisation ${slug}: seed the demo first`);
  return row.id;
}

export async function userId(db: Db, email: string): Promise<string> {
  const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  if (!row) throw new Error(`no user ${email}: seed the demo first`);
  return row.id;
}

export async function insertSite(db: Db, values: { organisationId: string } & Partial<Insert<typeof sites>>) {
  const [row] = await db
    .insert(sites)
    .values({ name: 'Test site', address: '1 Example Row, Testbury', clientName: 'Example Client Ltd', ...values })
    .returning();
  return row;
}

export async function insertScaffold(db: Db, values: { organisationId: string; siteId: string } & Partial<Insert<typeof scaffolds>>) {
  const [row] = await db
    .insert(scaffolds)
    .values({ reference: `SC-${randomUUID().slice(0, 6)}`, elevations: ['North'], lifts: 4, liftHeightM: 2, baysPerElevation: 6, ...values })
    .returning();
  return row;
}

export async function insertInspection(
  db: Db,
  values: { organisationId: string; scaffoldId: string; inspectorId: string } & Partial<Insert<typeof inspections>>,
) {
  const [row] = await db
    .insert(inspections)
    .values({ id: randomUUID(), startedAt: new Date(), reason: 'scheduled', ...values })
    .returning();
  return row;
}

export async function insertFinding(
  db: Db,
  values: { organisationId: string; scaffoldId: string; createdBy: string } & Partial<Insert<typeof findings>>,
) {
  const [row] = await db
    .insert(findings)
    .values({
      id: randomUUID(),
      elevation: 'North',
      lift: 3,
      bay: 2,
      heightM: 6,
      itemName: 'Loose scaffold fitting',
      massKg: 1,
      exposure: 'hard-hats',
      likelihoodAnswers: {},
      likelihood: 3,
      estimate: {},
      severity: 3,
      riskScore: 9,
      riskBand: 'Medium',
      ...values,
    })
    .returning();
  return row;
}

export async function insertControlCheck(
  db: Db,
  values: { organisationId: string; inspectionId: string } & Partial<Insert<typeof controlChecks>>,
) {
  const [row] = await db
    .insert(controlChecks)
    .values({ id: randomUUID(), control: 'toe-boards', result: 'fail', ...values })
    .returning();
  return row;
}

export async function insertFix(db: Db, values: { organisationId: string; findingId: string; fixedBy: string } & Partial<Insert<typeof fixes>>) {
  const [row] = await db
    .insert(fixes)
    .values({ id: randomUUID(), fixedAt: new Date(), ...values })
    .returning();
  return row;
}

export async function insertVerification(
  db: Db,
  values: { organisationId: string; findingId: string; verifiedBy: string } & Partial<Insert<typeof verifications>>,
) {
  const [row] = await db
    .insert(verifications)
    .values({ id: randomUUID(), verifiedAt: new Date(), outcome: 'verified', ...values })
    .returning();
  return row;
}

/** A site, one scaffold, an inspection and one finding in an organisation: the usual starting point. */
export async function insertFindingTree(db: Db, options: { organisationId: string; inspectorId: string; foremanId?: string }) {
  const { organisationId, inspectorId, foremanId } = options;
  const site = await insertSite(db, { organisationId });
  const scaffold = await insertScaffold(db, { organisationId, siteId: site.id, foremanId: foremanId ?? null });
  const inspection = await insertInspection(db, { organisationId, scaffoldId: scaffold.id, inspectorId });
  const finding = await insertFinding(db, { organisationId, scaffoldId: scaffold.id, inspectionId: inspection.id, createdBy: inspectorId });
  return { site, scaffold, inspection, finding };
}
