import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { simpleParser } from 'mailparser';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifactPath, launchBrowser, launchPhone } from '../support/browser.js';
import { onScreen, readTable, typeInto } from '../support/phone-page.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

const NEW_FOREMAN = { name: 'Robin Fairweather', email: `robin.fairweather.${Date.now()}@demo.test` };
const NEW_PASSWORD = 'kestrel-harbour-42';
const SITE_NAME = 'Wharf Lane Offices';
/** Each step drives two or three browsers in turn; on a loaded machine that outlasts the default. */
const JOURNEY_TIMEOUT_MS = 300_000;

async function signIn(page: Page, url: string, email: string, password: string): Promise<void> {
  await page.goto(url);
  await onScreen(page, 'home-sign-in').click();
  await typeInto(page, 'sign-in-email', email);
  await typeInto(page, 'sign-in-password', password);
  await onScreen(page, 'sign-in-submit').click();
}

/** A section of the managers' menu. */
const navLink = (page: Page, name: string) =>
  page.getByRole('navigation', { name: 'Manager sections' }).filter({ visible: true }).getByRole('link', { name, exact: true });

/** The invitation e-mail to `to` from the SMTP fake's folder, read with mailparser. */
async function invitationLink(mailDir: string, to: string): Promise<string> {
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    for (const name of readdirSync(mailDir).filter((n) => n.endsWith('.eml'))) {
      const mail = await simpleParser(readFileSync(join(mailDir, name)));
      const recipients = [mail.to ?? []].flat().flatMap((a) => a.value.map((v) => v.address));
      if (!recipients.includes(to)) continue;
      const link = /https?:\/\/[^\s"<>]+\/accept-invite\?token=[A-Za-z0-9_%-]+/.exec(`${mail.text ?? ''} ${mail.html || ''}`)?.[0];
      if (link) return link.replace(/&amp;/g, '&');
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no invitation e-mail to ${to}`);
}

describe('setting up: people, a site and a scaffold, and the phone receiving them', () => {
  let server: RunningServer;
  let browser: Browser;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    server = await startBuiltServer();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.dispose();
  });

  it('an admin invites a foreman by e-mail; the foreman follows the link, sets a password and signs in', async () => {
    const mailDir = process.env.MAIL_DIR;
    expect(mailDir, 'the SMTP fake’s folder (npm test sets MAIL_DIR)').toBeTruthy();

    const desk = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const admin = await desk.newPage();
    admin.on('pageerror', (e) => pageErrors.push(e.message));
    await signIn(admin, server.url, 'admin@demo.test', 'plummet-demo');
    await onScreen(admin, 'overview-page').waitFor({ timeout: 20_000 });
    await navLink(admin, 'People').click();
    await onScreen(admin, 'people-page').waitFor();
    await onScreen(admin, 'member-manager@demo.test').waitFor();

    // A bad address is answered on its field before anything is sent.
    await onScreen(admin, 'invite-form').locator('#invite-email').fill('robin at the yard');
    await onScreen(admin, 'invite-form').locator('#invite-name').fill(NEW_FOREMAN.name);
    await onScreen(admin, 'invite-form').locator('#invite-role').selectOption('foreman');
    await onScreen(admin, 'send-invitation').click();
    await expect.poll(() => onScreen(admin, 'error-invite-email').textContent()).toBeTruthy();

    await onScreen(admin, 'invite-form').locator('#invite-email').fill(NEW_FOREMAN.email);
    await onScreen(admin, 'send-invitation').click();
    const row = onScreen(admin, `member-${NEW_FOREMAN.email}`);
    await row.waitFor({ timeout: 15_000 });
    expect(await row.innerText()).toMatch(/Invited, not joined yet/);
    expect(await row.getByRole('combobox').inputValue()).toBe('foreman');
    await admin.screenshot({ path: artifactPath('admin-people.png'), fullPage: true });

    // The e-mail, from the SMTP fake, read as a mail client would.
    const link = await invitationLink(mailDir!, NEW_FOREMAN.email);
    const phone = await launchPhone();
    try {
      const foreman = await phone.context.newPage();
      foreman.on('pageerror', (e) => pageErrors.push(e.message));
      await foreman.goto(link);
      await onScreen(foreman, 'accept-invite-page').waitFor({ timeout: 20_000 });
      await typeInto(foreman, 'accept-password', NEW_PASSWORD);
      await typeInto(foreman, 'accept-password-again', 'not the same one');
      await onScreen(foreman, 'accept-submit').click();
      await expect.poll(() => onScreen(foreman, 'accept-error').textContent()).toMatch(/differ/);
      await typeInto(foreman, 'accept-password-again', NEW_PASSWORD);
      await onScreen(foreman, 'accept-submit').click();
      await onScreen(foreman, 'fix-list-page').waitFor({ timeout: 20_000 });
    } finally {
      await phone.close();
    }

    // Signing in afresh, on another phone, with the password just chosen.
    const second = await launchPhone();
    try {
      const foreman = await second.context.newPage();
      await signIn(foreman, server.url, NEW_FOREMAN.email, NEW_PASSWORD);
      await onScreen(foreman, 'fix-list-page').waitFor({ timeout: 20_000 });
    } finally {
      await second.close();
    }

    await admin.reload();
    await expect.poll(async () => (await onScreen(admin, `member-${NEW_FOREMAN.email}`).innerText()).includes('Active'), { timeout: 15_000 }).toBe(true);
    await desk.close();
  }, JOURNEY_TIMEOUT_MS);

  it('a manager adds a site and a scaffold, the drawing following the form', async () => {
    const desk = await browser.newContext({ viewport: { width: 1366, height: 1100 } });
    const manager = await desk.newPage();
    manager.on('pageerror', (e) => pageErrors.push(e.message));
    await signIn(manager, server.url, 'manager@demo.test', 'plummet-demo');
    await onScreen(manager, 'overview-page').waitFor({ timeout: 20_000 });
    await navLink(manager, 'Sites and scaffolds').click();
    await onScreen(manager, 'sites-setup-page').waitFor();
    // Managers set up sites; the admin-only sections are not offered to them.
    expect(await navLink(manager, 'People').count()).toBe(0);
    expect(await navLink(manager, 'Organisation').count()).toBe(0);

    await onScreen(manager, 'new-site').click();
    const site = onScreen(manager, 'site-form');
    await site.waitFor();
    await site.locator('#site-name').fill(SITE_NAME);
    await site.locator('#site-address').fill('14 Wharf Lane, Eastmouth EM2 4QT');
    await site.locator('#site-clientName').fill('Eastmouth Harbour Trust');
    await site.locator('#site-clientContactEmail').fill('not an address');
    await site.locator('#site-timeZone').fill('Europe/London');
    await site.locator('#site-jurisdiction').selectOption('uk');
    await onScreen(manager, 'save-site').click();
    expect(await onScreen(manager, 'error-site-clientContactEmail').textContent()).toBe('An e-mail address, e.g. name@example.com');
    await site.locator('#site-clientContactEmail').fill('works@eastmouth-harbour.test');
    await onScreen(manager, 'save-site').click();
    await onScreen(manager, 'sites-setup-page').waitFor();

    const card = onScreen(manager, `site-card-${SITE_NAME}`);
    await card.waitFor({ timeout: 15_000 });
    await card.getByTestId('new-scaffold').click();
    const form = onScreen(manager, 'scaffold-form');
    await form.waitFor();
    const preview = onScreen(manager, 'scaffold-preview');
    await form.locator('#scaffold-reference').fill('WL-1');
    await form.locator('#scaffold-description').fill('Independent scaffold to the street elevation, with a fan over the footpath');
    await form.locator('#scaffold-elevations').fill('Street, Yard');
    await form.locator('#scaffold-lifts').fill('3');
    await form.locator('#scaffold-bays').fill('6');
    // The drawing follows what is typed: 3 lifts of 6 bays.
    await preview.getByTestId('cell-3-6').waitFor();
    expect(await preview.getByTestId('cell-4-1').count()).toBe(0);
    await onScreen(manager, 'lifts-differ').check();
    await form.locator('#scaffold-lift-1').fill('2.7');
    await expect.poll(() => preview.innerText()).toMatch(/top platform at 6\.7 m/);
    await form.locator('#scaffold-foreman').selectOption({ label: NEW_FOREMAN.name });
    await form.locator('#scaffold-load-class').selectOption('class-3');
    await form.locator('#scaffold-design').fill('Design sheet WL-07 rev A');
    await form.locator('#scaffold-contractor').fill('Northgate Access Ltd');
    await form.locator('#scaffold-handed-over').fill('2026-03-02');
    await form.locator('#scaffold-reference').focus();
    await manager.getByTestId('offline-ready').waitFor({ state: 'detached', timeout: 15_000 });
    await manager.locator('ion-content').filter({ visible: true }).evaluate((el) => (el as HTMLElement & { scrollToTop(ms: number): Promise<void> }).scrollToTop(0));
    await manager.screenshot({ path: artifactPath('scaffold-editor.png') });
    await onScreen(manager, 'save-scaffold').click();

    // Saved: the editor reopens on the new scaffold, closed to use until its first inspection.
    await expect.poll(() => new URL(manager.url()).pathname, { timeout: 15_000 }).toMatch(/^\/setup\/scaffolds\//);
    await expect.poll(() => onScreen(manager, 'scaffold-status').getAttribute('data-status'), { timeout: 15_000 }).toBe('closed');
    const editorPath = new URL(manager.url()).pathname;
    await desk.close();

    // The same editor on a phone: nothing wider than the screen but the drawing's own scroller.
    const phone = await launchPhone();
    try {
      const page = await phone.context.newPage();
      page.on('pageerror', (e) => pageErrors.push(e.message));
      await signIn(page, server.url, 'manager@demo.test', 'plummet-demo');
      await onScreen(page, 'overview-page').waitFor({ timeout: 20_000 });
      await page.goto(`${server.url}${editorPath}`);
      const phoneForm = onScreen(page, 'scaffold-form');
      await phoneForm.waitFor({ timeout: 20_000 });
      expect(await phoneForm.locator('#scaffold-reference').inputValue()).toBe('WL-1');
      expect(await phoneForm.locator('#scaffold-lift-1').inputValue()).toBe('2.7');
      const box = await phoneForm.boundingBox();
      expect(box!.x + box!.width).toBeLessThanOrEqual(390);
      await page.getByTestId('offline-ready').waitFor({ state: 'detached', timeout: 15_000 });
      await page.screenshot({ path: artifactPath('scaffold-editor-phone.png') });
    } finally {
      await phone.close();
    }
  }, JOURNEY_TIMEOUT_MS);

  it('the inspector’s phone receives the site and scaffold after sync, and shows the scaffold closed until inspected', async () => {
    const phone = await launchPhone();
    try {
      const page = await phone.context.newPage();
      page.on('pageerror', (e) => pageErrors.push(e.message));
      await signIn(page, server.url, 'inspector@demo.test', 'plummet-demo');
      await expect.poll(() => onScreen(page, 'session-expiry').textContent(), { timeout: 20_000 }).toMatch(/Works offline until/);
      // The sync engine's pull puts the new scaffold on the phone, closed until its first inspection.
      await expect
        .poll(async () => (await readTable<{ reference: string; status: string }>(page, 'scaffolds')).find((s) => s.reference === 'WL-1')?.status, { timeout: 30_000 })
        .toBe('closed');
      const card = onScreen(page, 'site-card').filter({ hasText: SITE_NAME });
      await card.waitFor({ timeout: 30_000 });
      await card.getByTestId('make-offline').click();
      await card.getByTestId('open-site').click({ timeout: 30_000 });
      const byReference = page.locator('[data-testid="scaffold-card"][data-reference="WL-1"]').filter({ visible: true });
      await byReference.waitFor({ timeout: 30_000 });
      expect(await byReference.getByTestId('scaffold-status').getAttribute('data-status')).toBe('closed');
      expect(await byReference.innerText()).toMatch(/Closed to use/);
    } finally {
      await phone.close();
    }
    expect(pageErrors).toEqual([]);
  }, JOURNEY_TIMEOUT_MS);
});
