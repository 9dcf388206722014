import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTION_TEXT } from '@plummet/shared';
import { memberships, organisations, users } from '../../db/schema/index.js';
import { insertFinding, insertScaffold, insertSite } from '../../../test/domain-fixtures.js';
import { type OwnMailFake, startOwnMailFake, waitForMessages } from '../../../test/mail-fake.js';
import { parseEml } from '../../../test/report-fixture.js';
import { startTestApp, type TestApp } from '../../../test/test-app.js';
import { DigestService } from './digest.service.js';

const HOUR = 3600_000;
// 10 Mar 2026: New York is on daylight time since 8 Mar (UTC−4); London is still on GMT (UTC+0).
// So 09:30 UTC is 05:30 in New York (before its 06:00 digest) and 09:30 in London (after it).
const BEFORE_NY_SIX = new Date('2026-03-10T09:30:00Z');
const NY_SIX = new Date('2026-03-10T10:00:00Z');

/** Compares across the plain-text part's word wrapping. */
const flat = (text: string) => text.replace(/\s+/g, ' ');
const addresses = (m: Awaited<ReturnType<typeof parseEml>>) => (m.to && !Array.isArray(m.to) ? m.to.value.map((a) => a.address) : []);

describe('the daily digest to managers and foremen', () => {
  let mail: OwnMailFake;
  let t: TestApp;
  let digests: DigestService;
  let newYork: string;
  let london: string;

  beforeAll(async () => {
    mail = await startOwnMailFake();
    t = await startTestApp({ seed: false, env: { ...mail.env, MAIL_RETRY_DELAY_S: '1', MAIL_POLL_S: '0.5', PUBLIC_URL: 'https://plummet.example.test' } });
    digests = t.app.get(DigestService);
    const db = t.drizzle;
    const org = async (name: string, settings: object) => (await db.insert(organisations).values({ name, slug: name.toLowerCase().replace(/\W+/g, '-'), settings }).returning())[0].id;
    newYork = await org('Hudson Test Builders', { timeZone: 'America/New_York', digestHour: 6 });
    london = await org('Thames Test Builders', {});
    const person = async (organisationId: string, email: string, role: 'manager' | 'foreman' | 'inspector') => {
      const [u] = await db.insert(users).values({ email, name: email.split('@')[0] }).returning();
      await db.insert(memberships).values({ userId: u.id, organisationId, role });
      return u.id;
    };
    await person(newYork, 'ny-manager@example.test', 'manager');
    const foreman = await person(newYork, 'ny-foreman@example.test', 'foreman');
    await person(newYork, 'ny-idle-foreman@example.test', 'foreman'); // nothing in scope: no digest
    const inspector = await person(newYork, 'ny-inspector@example.test', 'inspector'); // not a recipient
    await person(london, 'london-manager@example.test', 'manager'); // an organisation with nothing to say

    const alder = await insertSite(db, { organisationId: newYork, name: 'Alder Street <North>', timeZone: 'America/New_York' });
    const birch = await insertSite(db, { organisationId: newYork, name: 'Birch Yard', timeZone: 'America/New_York' });
    const scaffold = (siteId: string, reference: string, extra: object) => insertScaffold(db, { organisationId: newYork, siteId, reference, ...extra });
    // Due at 14:00 New York time the same day, due yesterday, due in three days, archived.
    const a1 = await scaffold(alder.id, 'A1', { foremanId: foreman, nextDueAt: new Date('2026-03-10T18:00:00Z') });
    const a2 = await scaffold(alder.id, 'A2', { nextDueAt: new Date('2026-03-09T15:00:00Z') });
    const b1 = await scaffold(birch.id, 'B1', { nextDueAt: new Date('2026-03-13T15:00:00Z') });
    const gone = await scaffold(alder.id, 'A3', { nextDueAt: new Date('2026-03-01T15:00:00Z'), archivedAt: new Date('2026-03-02T00:00:00Z') });
    const finding = (scaffoldId: string, extra: object) => insertFinding(db, { organisationId: newYork, scaffoldId, createdBy: inspector, ...extra });
    await finding(a1.id, { itemName: 'Unpinned board <edge>', riskBand: 'High', riskScore: 20, state: 'open', dueAt: new Date(NY_SIX.getTime() - 2 * HOUR) });
    await finding(a1.id, { itemName: 'Tube offcut', riskBand: 'Medium', riskScore: 9, state: 'made-safe', dueAt: new Date(NY_SIX.getTime() + 20 * HOUR) });
    await finding(a1.id, { itemName: 'Verified clip', riskBand: 'Low', riskScore: 2, state: 'verified' });
    await finding(a2.id, { itemName: 'Bucket of clips', riskBand: 'Medium', riskScore: 8, state: 'open', assigneeId: foreman });
    await finding(b1.id, { itemName: 'Loose brick', riskBand: 'Low', riskScore: 3, state: 'open' });
    await finding(b1.id, { itemName: 'Fixed fan board', riskBand: 'High', riskScore: 16, state: 'fixed' });
    await finding(gone.id, { itemName: 'Archived item', riskBand: 'High', riskScore: 20, state: 'open', dueAt: new Date('2026-03-01T00:00:00Z') });
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  it('waits for each organisation’s own local hour: London at 09:30 UTC, New York only from its 06:00 (10:00 UTC)', async () => {
    expect(await digests.queueDue(BEFORE_NY_SIX)).toEqual([london]);
    expect(await digests.queueDue(NY_SIX)).toEqual([newYork]);
  });

  it('sends one e-mail to the manager and one to the foreman in scope, none to people with nothing to say', async () => {
    const names = await waitForMessages(mail, 2);
    await new Promise((r) => setTimeout(r, 2_000)); // the jobs for the idle foreman and London's manager have run by now
    expect(mail.messages()).toHaveLength(2);
    const messages = await Promise.all(names.map((n) => parseEml(mail.mailDir, n)));
    const byTo = new Map(messages.map((m) => [addresses(m)[0], m]));
    expect([...byTo.keys()].sort()).toEqual(['ny-foreman@example.test', 'ny-manager@example.test']);

    const manager = byTo.get('ny-manager@example.test')!;
    expect(manager.subject).toBe('Daily digest · Hudson Test Builders · 2026-03-10 · 1 overdue fix · 2 inspections due');
    const text = flat(manager.text!);
    // Alder Street: High 1 (open), Medium 2 (made safe + open), the verified Low and the archived scaffold not counted.
    expect(text).toContain('== Alder Street <North> == Open findings by band: High 1, Medium 2, Low 0');
    expect(text).toContain('Overdue fixes (1): - [High] Unpinned board <edge> on scaffold A1, due 10 Mar 2026, 04:00 (America/New_York)');
    expect(text).toContain('Scaffolds due for inspection today or overdue (2): - Scaffold A2: overdue since 9 Mar 2026, 11:00 (America/New_York) - Scaffold A1: due 10 Mar 2026, 14:00 (America/New_York)');
    // Birch Yard: one open Low; the fixed High is not open; B1 is due in three days.
    expect(text).toContain('== Birch Yard == Open findings by band: High 0, Medium 0, Low 1 Overdue fixes (0): None. Scaffolds due for inspection today or overdue (0):');
    expect(text.indexOf('== Alder Street')).toBeLessThan(text.indexOf('== Birch Yard'));
    expect(text).not.toContain('Archived item');
    expect(text).toContain(flat(CAUTION_TEXT));
    expect(manager.html).toContain('Alder Street &lt;North&gt;');
    expect(manager.html).toContain('Unpinned board &lt;edge&gt;');
    expect(manager.html).not.toContain('<North>');

    const foreman = flat(byTo.get('ny-foreman@example.test')!.text!);
    // Their scaffold A1 (High open, Medium made safe) and the Medium assigned to them on A2; only A1 is theirs to inspect.
    expect(foreman).toContain('Open findings by band: High 1, Medium 2, Low 0');
    expect(foreman).toContain('Scaffolds due for inspection today or overdue (1): - Scaffold A1: due');
    expect(foreman).not.toContain('Birch Yard');
    expect(foreman).not.toContain('Scaffold A2');
  });

  it('queues a day once however often and from however many processes the tick runs', async () => {
    expect(await digests.queueDue(NY_SIX)).toEqual([]);
    expect(await digests.queueDue(new Date(NY_SIX.getTime() + 5 * HOUR))).toEqual([]);
    // The next day, two ticks at once (as from two server processes): one claims it.
    const nextDay = new Date(NY_SIX.getTime() + 24 * HOUR);
    const [a, b] = await Promise.all([digests.queueDue(nextDay), digests.queueDue(nextDay)]);
    expect([...a, ...b].filter((id) => id === newYork)).toHaveLength(1);
    await waitForMessages(mail, 4);
    await new Promise((r) => setTimeout(r, 2_000));
    expect(mail.messages()).toHaveLength(4);
  });
});
