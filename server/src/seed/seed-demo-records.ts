import { BUILTIN_ITEMS, estimateFinding, estimateRowText, nextInspectionDue, type ShapeSpec } from '@plummet/shared';
import type { DbExecutor } from '../db/db.tokens.js';
import { controlChecks, findings, fixes, inspections, scaffolds, sites, verifications } from '../db/schema/index.js';
import { DEMO_CONTROL_CHECKS, DEMO_FINDINGS, DEMO_INSPECTIONS, DEMO_SCAFFOLDS, DEMO_SITES, demoRecordId } from './demo-records.js';

export interface DemoPeople {
  orgIds: Map<string, string>;
  userIds: Map<string, string>;
}

const HOUR_MS = 3_600_000;

/**
 * Sites, scaffolds, inspections, control checks and findings of the demo (demo-records.ts), with
 * every estimate computed by the shared physics. Idempotent: fixed ids, and rows that exist are
 * left as they are (a demo someone has been clicking through keeps its state).
 */
export async function seedDemoRecords(tx: DbExecutor, people: DemoPeople): Promise<{ findings: number }> {
  const now = Date.now();
  const at = (hours: number) => new Date(now + hours * HOUR_MS);
  const org = (slug: string) => people.orgIds.get(slug)!;
  const user = (email: string) => people.userIds.get(email)!;
  const foreman = user('foreman@demo.test');
  const inspector = user('inspector@demo.test');

  for (const s of DEMO_SITES) {
    await tx
      .insert(sites)
      .values({ id: s.id, organisationId: org(s.org), name: s.name, address: s.address, clientName: s.clientName, clientAddress: s.clientAddress, clientContactEmail: s.clientContactEmail, regime: s.regime, reportRecipients: [...s.reportRecipients] })
      .onConflictDoNothing();
  }
  const siteOf = new Map<string, (typeof DEMO_SITES)[number]>(DEMO_SITES.map((s) => [s.id, s]));
  const scaffoldOf = new Map<string, (typeof DEMO_SCAFFOLDS)[number]>(DEMO_SCAFFOLDS.map((s) => [s.id, s]));
  const siteOfScaffold = (scaffoldId: string) => siteOf.get(scaffoldOf.get(scaffoldId)!.site)!;
  // The demo sites keep the default time zone.
  const timeZone = 'Europe/London';
  // Local midnight today: the latest start of a day among 23, 24 and 25 hours ago (a day is 23–25 h).
  const startOfToday = new Date(Math.max(...[23, 24, 25].map((h) => nextInspectionDue(at(-h), 'pre-shift', timeZone).getTime()).filter((t) => t <= now)));
  /** When each inspection started and finished ('today' = this morning, after local midnight, before now). */
  const timesOf = (i: (typeof DEMO_INSPECTIONS)[number]): { startedAt: Date; finishedAt: Date | null } => {
    if (i.finishedH !== 'today') return { startedAt: at(i.startedH), finishedAt: i.finishedH === null ? null : at(i.finishedH) };
    const finishedAt = new Date(Math.min(now, Math.max(now - 0.5 * HOUR_MS, startOfToday.getTime() + 60_000)));
    return { startedAt: new Date(finishedAt.getTime() - 0.25 * HOUR_MS), finishedAt };
  };
  // The last finished inspection of each scaffold sets its last and next inspection.
  const lastInspected = new Map<string, Date>();
  for (const i of DEMO_INSPECTIONS) {
    const { finishedAt } = timesOf(i);
    if (finishedAt && !(lastInspected.get(i.scaffold)! > finishedAt)) lastInspected.set(i.scaffold, finishedAt);
  }

  for (const s of DEMO_SCAFFOLDS) {
    const site = siteOf.get(s.site)!;
    const inspected = lastInspected.get(s.id) ?? null;
    await tx
      .insert(scaffolds)
      .values({
        id: s.id,
        organisationId: org(site.org),
        siteId: s.site,
        reference: s.reference,
        description: s.description,
        elevations: [...s.elevations],
        lifts: s.lifts,
        liftHeightM: s.liftHeightM,
        baysPerElevation: s.baysPerElevation,
        status: s.status,
        foremanId: s.foreman ? foreman : null,
        lastInspectedAt: inspected,
        nextDueAt: inspected ? nextInspectionDue(inspected, site.regime, timeZone) : null,
      })
      .onConflictDoNothing();
  }

  for (const i of DEMO_INSPECTIONS) {
    const { startedAt, finishedAt } = timesOf(i);
    const site = siteOfScaffold(i.scaffold);
    await tx
      .insert(inspections)
      .values({
        id: i.id,
        organisationId: org(site.org),
        scaffoldId: i.scaffold,
        inspectorId: site.org === 'harrow-span' ? inspector : user('manager@other.test'),
        startedAt,
        finishedAt,
        reason: i.reason,
        windSpeedMps: i.windSpeedMps,
        ...(i.report ?? {}),
        signature: i.report ? 'M10 40 C 30 10, 50 10, 60 35 S 90 60, 110 30' : null,
        signedAt: i.report ? finishedAt : null,
        // The tag given when signing is the scaffold's status now.
        tagStatus: finishedAt ? scaffoldOf.get(i.scaffold)!.status : null,
        restriction: i.restriction ?? '',
        accessTagsChanged: finishedAt ? false : null,
      })
      .onConflictDoNothing();
  }
  for (const [n, c] of DEMO_CONTROL_CHECKS.entries()) {
    const id = `${c.inspection.slice(0, 9)}cc${n.toString(16).padStart(2, '0')}${c.inspection.slice(13)}`;
    await tx
      .insert(controlChecks)
      .values({ id, organisationId: org('harrow-span'), inspectionId: c.inspection, control: c.control, result: c.result, note: c.note })
      .onConflictDoNothing();
  }

  const windOf = new Map<string, number>(DEMO_INSPECTIONS.map((i) => [i.id, i.windSpeedMps]));
  for (const f of DEMO_FINDINGS) {
    const builtin = 'catalogue' in f.item ? BUILTIN_ITEMS.find((b) => b.id === (f.item as { catalogue: string }).catalogue)! : undefined;
    const item = builtin
      ? { catalogueItemId: builtin.id, itemName: builtin.name, massKg: builtin.massKg, shape: builtin.shape as ShapeSpec | null }
      : { catalogueItemId: null, itemName: (f.item as { name: string }).name, massKg: (f.item as { massKg: number }).massKg, shape: null };
    const result = estimateFinding({
      massKg: item.massKg,
      heightM: f.heightM,
      shape: item.shape,
      exposure: f.exposure,
      likelihoodAnswers: f.answers,
      windSpeedMps: f.inspection ? windOf.get(f.inspection) : null,
    });
    const orgId = org(f.org);
    const createdBy = f.org === 'harrow-span' ? inspector : user('manager@other.test');
    const inserted = await tx
      .insert(findings)
      .values({
        id: f.id,
        organisationId: orgId,
        inspectionId: f.inspection,
        scaffoldId: f.scaffold,
        elevation: f.elevation,
        lift: f.lift,
        bay: f.bay,
        heightM: f.heightM,
        ...item,
        exposure: f.exposure,
        likelihoodAnswers: f.answers,
        likelihood: result.likelihood,
        estimate: result.estimate,
        estimateRow: estimateRowText(result.estimate),
        severity: result.severity,
        riskScore: result.riskScore,
        riskBand: result.riskBand,
        state: f.state,
        assigneeId: f.assignToForeman ? foreman : null,
        dueAt: f.dueH === undefined ? null : at(f.dueH),
        notes: f.notes,
        madeSafeNote: f.madeSafeNote ?? null,
        createdBy,
        createdAt: at(f.inspection ? DEMO_INSPECTIONS.find((i) => i.id === f.inspection)!.startedH + 0.5 : -72),
      })
      .onConflictDoNothing()
      .returning({ id: findings.id });
    if (inserted.length === 0) continue;
    const fixer = scaffoldOf.get(f.scaffold)!.foreman ? foreman : createdBy;
    if (f.state === 'fixed' || f.state === 'verified') {
      await tx.insert(fixes).values({ id: demoRecordId(f.id, 'fix'), organisationId: orgId, findingId: f.id, fixedBy: fixer, fixedAt: at(-24), note: 'Removed from the boards' }).onConflictDoNothing();
    }
    if (f.state === 'verified') {
      await tx
        .insert(verifications)
        .values({ id: demoRecordId(f.id, 'verification'), organisationId: orgId, findingId: f.id, verifiedBy: createdBy, verifiedAt: at(-20), outcome: 'verified', note: 'Checked on the next walk' })
        .onConflictDoNothing();
    }
  }
  return { findings: DEMO_FINDINGS.length };
}
