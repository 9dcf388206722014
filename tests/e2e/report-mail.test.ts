/**
 * The report e-mail from the phone to the manager's mailbox: an inspector finishes and signs an
 * inspection with no signal, the phone reconnects and syncs, and the manager's message arrives in
 * the SMTP fake with the signed PDF. Then an e-mail that keeps failing, as the admin sees it in the
 * app and sends again. Saves the PDF's first page, the e-mail as rendered and the admin screen.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { CONTROLS } from '@plummet/shared';
import type { ParsedMail } from 'mailparser';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type OwnMailFake, startOwnMailFake } from '../../server/test/mail-fake.js';
import { flat, parseEml, pdfText } from '../../server/test/report-fixture.js';
import { apiCall, apiSignIn } from '../support/api.js';
import { artifactPath, launchBrowser, launchPhone } from '../support/browser.js';
import { choose, onScreen, saveFinding, typeInto } from '../support/phone-page.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

const addresses = (m: ParsedMail) => [m.to, m.cc].flat().flatMap((a) => (a ? a.value.map((v) => v.address ?? '') : []));

/** The captured messages so far, parsed; waits until one matches or the time is up. */
async function waitForMessage(mail: OwnMailFake, match: (m: ParsedMail) => boolean, timeoutMs = 45_000): Promise<ParsedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    for (const name of mail.messages()) {
      const parsed = await parseEml(mail.mailDir, name);
      if (match(parsed)) return parsed;
    }
    if (Date.now() > deadline) throw new Error('the expected e-mail did not arrive');
    await new Promise((r) => setTimeout(r, 250));
  }
}

async function signInOnScreen(page: Page, url: string, email: string): Promise<void> {
  await page.goto(url);
  await onScreen(page, 'home-sign-in').click();
  await typeInto(page, 'sign-in-email', email);
  await typeInto(page, 'sign-in-password', 'plummet-demo');
  await onScreen(page, 'sign-in-submit').click();
}

describe('the signed report reaches the manager once the phone is back online', () => {
  let mail: OwnMailFake;
  let server: RunningServer;
  let phone: Awaited<ReturnType<typeof launchPhone>>;
  let browser: Browser;
  let inspectionId = '';

  beforeAll(async () => {
    mail = await startOwnMailFake();
    // One retry a second apart: an e-mail that cannot go out ends failed within seconds.
    server = await startBuiltServer({ env: { ...mail.env, MAIL_POLL_S: '0.5', MAIL_RETRY_DELAY_S: '1', MAIL_RETRY_LIMIT: '1' } });
    phone = await launchPhone();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await phone?.close();
    await browser?.close();
    await server?.dispose();
    await mail?.close();
  });

  it('finishes and signs offline, syncs on reconnecting, and the manager gets the findings e-mail with the PDF', async () => {
    const page = await phone.context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    await page.goto(server.url);
    await page.getByTestId('app-shell').waitFor();
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 30_000 });
    await signInOnScreen(page, server.url, 'inspector@demo.test');
    await expect.poll(() => onScreen(page, 'session-expiry').textContent(), { timeout: 15_000 }).toMatch(/Works offline until/);
    const quayside = onScreen(page, 'site-card').filter({ hasText: 'Quayside Library' });
    await quayside.getByTestId('make-offline').click();
    await expect.poll(() => quayside.getAttribute('data-offline'), { timeout: 30_000 }).toBe('true');

    // No signal from here until the report is signed.
    await phone.context.setOffline(true);
    await expect.poll(() => onScreen(page, 'online-status').first().getAttribute('data-online')).toBe('false');
    await quayside.getByTestId('open-site').click();
    await onScreen(page, 'scaffold-card').filter({ hasText: 'QL-A' }).getByTestId('open-scaffold').click();
    await onScreen(page, 'elevation-grid').waitFor();
    await onScreen(page, 'start-inspection').click();
    await choose(page, 'inspection-reason', 'after-bad-weather');
    await typeInto(page, 'inspection-wind', '6');
    await onScreen(page, 'start-walk').click();
    await onScreen(page, 'inspection-page').waitFor();
    inspectionId = new URL(page.url()).pathname.split('/')[2];

    // One finding: a hammer at the edge above the public footway.
    await onScreen(page, 'tab-walk').click();
    await onScreen(page, 'cell-5-4').click();
    await onScreen(page, 'add-finding-here').click();
    await onScreen(page, 'finding-editor').waitFor();
    await typeInto(page, 'item-search', 'hammer');
    await onScreen(page, 'item-hit').first().click();
    await onScreen(page, 'chosen-item').waitFor();
    await choose(page, 'exposure', 'public');
    await choose(page, 'likelihood-edgeDistance', 'at-edge');
    await saveFinding(page);
    await onScreen(page, 'inspection-page').waitFor();

    await onScreen(page, 'tab-checks').click();
    for (const control of CONTROLS) await choose(page, `control-${control}-result`, control === 'fans-or-canopies' ? 'not-applicable' : 'pass');
    await expect.poll(() => onScreen(page, 'tab-checks').textContent()).toBe('Checks 10/10');

    await onScreen(page, 'go-finish').click();
    await onScreen(page, 'finish-page').waitFor();
    await expect.poll(() => onScreen(page, 'report-mattersGivingRisk').inputValue()).toMatch(/hammer/i);
    await onScreen(page, 'signature-pad').scrollIntoViewIfNeeded();
    const pad = await onScreen(page, 'signature-pad').boundingBox();
    if (!pad) throw new Error('no signature pad');
    await page.mouse.move(pad.x + 30, pad.y + pad.height * 0.6);
    await page.mouse.down();
    await page.mouse.move(pad.x + pad.width * 0.45, pad.y + pad.height * 0.25, { steps: 6 });
    await page.mouse.move(pad.x + pad.width * 0.8, pad.y + pad.height * 0.7, { steps: 6 });
    await page.mouse.up();
    expect(await onScreen(page, 'signature-pad').getAttribute('aria-label')).toBe('Your drawn signature');
    // The outcome written on the tag: a High finding is open, so not for use until it is dealt with.
    await choose(page, 'outcome-status', 'closed');
    await choose(page, 'outcome-tags', 'yes');
    await onScreen(page, 'sign-and-finish').click();
    await onScreen(page, 'scaffold-page').waitFor();
    expect(Number(await onScreen(page, 'outbox-count').first().getAttribute('data-count'))).toBeGreaterThan(0);
    expect(mail.messages()).toEqual([]);

    // Signal again: the phone pushes by itself, the server queues the report with the finish.
    await phone.context.setOffline(false);
    await expect.poll(() => onScreen(page, 'outbox-count').first().getAttribute('data-count'), { timeout: 30_000 }).toBe('0');
    const message = await waitForMessage(mail, (m) => addresses(m).includes('manager@demo.test') && String(m.text).includes(`/inspections/${inspectionId}`));
    // Tag status first, then site, scaffold, date and the count of High findings.
    expect(message.subject).toMatch(/^[^·]+ · Quayside Library[^·]* · scaffold QL-A · .+ · 1 High finding$/);
    expect(String(message.html)).toContain('Findings, highest risk first');
    expect(flat(String(message.text))).toMatch(/competent person/);
    const pdf = message.attachments.find((a) => a.contentType === 'application/pdf');
    expect(pdf?.filename).toMatch(/^inspection-report-QL-A\.pdf$/);
    const text = flat(pdfText(pdf!.content));
    expect(text).toMatch(/hammer/i);
    expect(text).toContain('Aileen Marsh');
    expect(text).not.toContain('not signed');
    // A heading stays with what follows it: the page that has the findings heading starts the list.
    const pageWithList = pdfText(pdf!.content).split('\f').map(flat).find((page) => page.includes('Findings, highest risk first'));
    expect(pageWithList).toMatch(/Findings, highest risk first \(1\) 1\. High – /);
    // Exactly one report for this inspection, however often the phone retried.
    await new Promise((r) => setTimeout(r, 1_500));
    const reports = await Promise.all(mail.messages().map((n) => parseEml(mail.mailDir, n)));
    expect(reports.filter((m) => String(m.text).includes(`/inspections/${inspectionId}`) && !String(m.subject).startsWith('Re-sent'))).toHaveLength(1);

    // What a person looks at: the PDF's first page and the e-mail as a mail program shows it.
    const base = artifactPath('report-page-1');
    execFileSync('pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '1', '-singlefile', '-', base], { input: pdf!.content });
    expect(readFileSync(`${base}.png`).subarray(1, 4).toString()).toBe('PNG');
    let html = String(message.html);
    for (const a of message.attachments.filter((x) => x.cid)) html = html.split(`cid:${a.cid}`).join(`data:${a.contentType};base64,${a.content.toString('base64')}`);
    const view = await browser.newPage({ viewport: { width: 760, height: 900 } });
    await view.setContent(html);
    await view.screenshot({ path: artifactPath('findings-email.png'), fullPage: true });
    expect(await view.getByText(/hammer/i).count()).toBeGreaterThan(0);
    await view.close();
    expect(errors).toEqual([]);
  });

  it('shows the admin an e-mail that kept failing, at a desk and on a phone, and sends it again', async () => {
    expect(inspectionId).not.toBe('');
    await mail.stop();
    const manager = await apiSignIn(server.url, 'manager@demo.test');
    const resend = await apiCall(server.url, 'POST', `/inspections/${inspectionId}/report/send`, manager);
    expect(resend.status).toBe(202);
    const admin = await apiSignIn(server.url, 'admin@demo.test');
    await expect
      .poll(async () => ((await apiCall(server.url, 'GET', '/mail-jobs/failed', admin)).body as { items: unknown[] }).items.length, {
        timeout: 30_000,
        interval: 500,
      })
      .toBe(1);

    const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    await signInOnScreen(page, server.url, 'admin@demo.test');
    await onScreen(page, 'overview-page').waitFor({ timeout: 20_000 });
    await page.getByRole('navigation', { name: 'Manager sections' }).filter({ visible: true }).getByRole('link', { name: 'E-mails not sent' }).click();
    const item = onScreen(page, 'failed-mail-item');
    await item.waitFor();
    expect(await item.count()).toBe(1);
    expect(await item.getByTestId('failed-mail-subject').textContent()).toMatch(/^Re-sent: .+ · scaffold QL-A · /);
    expect(await item.getByTestId('failed-mail-recipients').textContent()).toContain('manager@demo.test');
    expect(await item.getByTestId('failed-mail-attempts').textContent()).toBe('2');
    expect(await item.getByTestId('failed-mail-last-error').textContent()).not.toBe('Not recorded');
    await page.screenshot({ path: artifactPath('failed-mail-wide.png') });

    // A phone: nothing sticks out sideways, the button is on screen.
    await page.setViewportSize({ width: 390, height: 844 });
    await expect.poll(() => item.boundingBox().then((box) => (box ? box.x + box.width : 9999))).toBeLessThanOrEqual(390);
    const button = await item.getByTestId('failed-mail-retry').boundingBox();
    expect(button && button.x + button.width).toBeLessThanOrEqual(390);
    await page.screenshot({ path: artifactPath('failed-mail-phone.png'), fullPage: true });

    // The mail server is back: send again, the list empties and the message arrives once.
    await mail.start();
    const before = mail.messages().length;
    await item.getByTestId('failed-mail-retry').click();
    await onScreen(page, 'failed-mail-none').waitFor({ timeout: 30_000 });
    const again = await waitForMessage(mail, (m) => String(m.subject).startsWith('Re-sent:'));
    expect(addresses(again)).toContain('manager@demo.test');
    expect(mail.messages()).toHaveLength(before + 1);
    expect(errors).toEqual([]);
    await context.close();
  });
});
