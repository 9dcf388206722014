import pg from 'pg';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifactPath, launchBrowser, launchPhone } from '../support/browser.js';
import { choose, onScreen, typeInto } from '../support/phone-page.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

async function signIn(page: Page, url: string, email: string): Promise<void> {
  await page.goto(url);
  await onScreen(page, 'home-sign-in').click();
  await typeInto(page, 'sign-in-email', email);
  await typeInto(page, 'sign-in-password', 'plummet-demo');
  await onScreen(page, 'sign-in-submit').click();
}

describe('the register: a trigger closes a scaffold and puts it on the due lists', () => {
  let server: RunningServer;
  let browser: Browser;
  let db: pg.Client;
  let phone: Awaited<ReturnType<typeof launchPhone>>;

  beforeAll(async () => {
    server = await startBuiltServer();
    browser = await launchBrowser();
    phone = await launchPhone();
    db = new pg.Client({ connectionString: server.db.url });
    await db.connect();
  });
  afterAll(async () => {
    await db?.end();
    await phone?.close();
    await browser?.close();
    await server?.dispose();
  });

  it('records "altered" on the phone: the scaffold is closed, due now on the inspector’s home and on the managers’ overview', async () => {
    const { id: scaffoldId } = (await db.query<{ id: string }>("SELECT id::text AS id FROM scaffolds WHERE reference = 'QL-A'")).rows[0];
    // Cleared and not due for days, as after an ordinary inspection.
    await db.query("UPDATE scaffolds SET status = 'cleared', last_inspected_at = now() - interval '1 day', next_due_at = now() + interval '6 days' WHERE id = $1", [scaffoldId]);

    const page = await phone.context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signIn(page, server.url, 'inspector@demo.test');
    await onScreen(page, 'due-section').waitFor({ timeout: 20_000 });
    await expect.poll(() => onScreen(page, 'due-section').locator(`[data-scaffold-id="${scaffoldId}"]`).count()).toBe(0);

    const quayside = onScreen(page, 'site-card').filter({ hasText: 'Quayside Library' });
    await quayside.getByTestId('make-offline').click();
    await expect.poll(() => quayside.getAttribute('data-offline'), { timeout: 30_000 }).toBe('true');
    await quayside.getByTestId('open-site').click();
    await onScreen(page, 'scaffold-card').filter({ hasText: 'QL-A' }).getByTestId('open-scaffold').click();
    await onScreen(page, 'scaffold-page').waitFor();
    await expect.poll(() => onScreen(page, 'scaffold-status').first().getAttribute('data-status')).toBe('cleared');

    await onScreen(page, 'open-trigger').click();
    await choose(page, 'trigger-kind', 'altered');
    await typeInto(page, 'trigger-note', 'Loading bay added at lift 2, bays 3–4');
    await onScreen(page, 'record-trigger').click();
    await onScreen(page, 'trigger-recorded').waitFor({ timeout: 15_000 });
    await expect.poll(() => onScreen(page, 'scaffold-status').first().getAttribute('data-status')).toBe('closed');
    expect(await onScreen(page, 'next-due').innerText()).toContain('overdue');

    const row = (await db.query('SELECT status, next_due_at <= now() AS due FROM scaffolds WHERE id = $1', [scaffoldId])).rows[0];
    expect(row).toEqual({ status: 'closed', due: true });

    // Home: first on the inspector's due list, before use, with the regulation named.
    await page.goto(server.url);
    const item = onScreen(page, 'due-section').locator(`[data-scaffold-id="${scaffoldId}"]`);
    await item.waitFor({ timeout: 20_000 });
    // The phone's own list (no triggers: overdue) shows first; the server's, with the trigger, replaces it when it answers.
    await expect.poll(() => item.getAttribute('data-state'), { timeout: 20_000 }).toBe('before-use');
    const text = await item.innerText();
    expect(text).toMatch(/Due now, before use/i);
    expect(text).toContain('UK WAHR 2005 reg. 12(4)(b)');
    expect(text).toContain('Every 7 days (UK WAHR 2005 reg. 12(4)(a))');
    expect(await onScreen(page, 'due-list').getByTestId('due-item').first().getAttribute('data-scaffold-id')).toBe(scaffoldId);
    await onScreen(page, 'due-section').scrollIntoViewIfNeeded();
    await page.screenshot({ path: artifactPath('register-due.png') });

    // Going offline, the list comes from the phone and still holds the closed scaffold.
    await phone.context.setOffline(true);
    await expect.poll(() => onScreen(page, 'online-status').first().getAttribute('data-online'), { timeout: 20_000 }).toBe('false');
    await expect.poll(() => onScreen(page, 'due-section').locator(`[data-scaffold-id="${scaffoldId}"]`).getAttribute('data-state')).toBe('overdue');
    await phone.context.setOffline(false);

    expect(errors).toEqual([]);

    // The managers' overview, at a desk.
    const desk = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const manager = await desk.newPage();
    await signIn(manager, server.url, 'manager@demo.test');
    await onScreen(manager, 'overview-page').waitFor({ timeout: 20_000 });
    const managerItem = onScreen(manager, 'overview-due').locator(`[data-scaffold-id="${scaffoldId}"]`);
    await managerItem.waitFor({ timeout: 20_000 });
    expect(await managerItem.getAttribute('data-state')).toBe('before-use');
    await onScreen(manager, 'overview-due').scrollIntoViewIfNeeded();
    await manager.screenshot({ path: artifactPath('register-due-1366.png') });
    await desk.close();
  });

  it('says clearly on the scaffold screen that a trigger needs a connection when offline', async () => {
    const page = phone.context.pages()[0];
    const { id: scaffoldId } = (await db.query<{ id: string }>("SELECT id::text AS id FROM scaffolds WHERE reference = 'QL-B'")).rows[0];
    await page.goto(`${server.url}/scaffolds/${scaffoldId}`);
    await onScreen(page, 'scaffold-page').waitFor();
    await phone.context.setOffline(true);
    await expect.poll(() => onScreen(page, 'online-status').first().getAttribute('data-online'), { timeout: 20_000 }).toBe('false');
    await onScreen(page, 'open-trigger').click();
    await onScreen(page, 'trigger-offline').waitFor();
    expect(await onScreen(page, 'record-trigger').evaluate((button) => (button as HTMLElement & { disabled: boolean }).disabled)).toBe(true);
    await phone.context.setOffline(false);
  });

  it('sets the exclusion zone below an elevation: the suggestion shows drift, bounce allowance and the rules of thumb with sources', async () => {
    const page = phone.context.pages()[0];
    const { id: scaffoldId } = (await db.query<{ id: string }>("SELECT id::text AS id FROM scaffolds WHERE reference = 'QL-A'")).rows[0];
    await page.goto(`${server.url}/scaffolds/${scaffoldId}`);
    await onScreen(page, 'scaffold-page').waitFor();
    const card = onScreen(page, 'exclusion-zone').first();
    await card.waitFor({ timeout: 20_000 });
    expect(await card.getByTestId('zone-missing').innerText()).toMatch(/heaviest item and the limiting wind speed/);

    await card.getByTestId('edit-zone').click();
    await typeInto(card, 'zone-item-search', 'hammer');
    await card.getByTestId('zone-item-hit').first().click();
    await card.getByTestId('zone-chosen-item').waitFor();
    await typeInto(card, 'zone-wind', '10');
    await typeInto(card, 'zone-width', '3');
    await card.getByTestId('save-zone').click();

    const suggestion = card.getByTestId('zone-suggestion');
    await suggestion.waitFor({ timeout: 15_000 });
    const text = await card.innerText();
    expect(text).toMatch(/Wind drift of the item/);
    expect(text).toContain('(common practice, no source)');
    expect(text).toContain('IBC 2021 Table 3306.1');
    expect(text).toContain('UK WAHR 2005 reg. 11');
    expect(text).toMatch(/work above still drops things/);
    expect(await card.getByTestId('caution').innerText()).not.toBe('');

    const rows = (await db.query('SELECT limiting_wind_mps, barriered_width_m, heaviest_item_id IS NOT NULL AS has_item FROM exclusion_zones WHERE scaffold_id = $1', [scaffoldId])).rows;
    expect(rows).toHaveLength(1);
    expect(rows[0].has_item).toBe(true);
    expect(rows[0].limiting_wind_mps).toBeGreaterThan(0);
    expect(rows[0].barriered_width_m).toBeGreaterThan(0);

    await card.scrollIntoViewIfNeeded();
    await page.screenshot({ path: artifactPath('exclusion-zone.png'), fullPage: false });

    // Managers see and change it at a desk, from the scaffold's setting-up page.
    const desk = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const manager = await desk.newPage();
    await signIn(manager, server.url, 'manager@demo.test');
    await onScreen(manager, 'overview-page').waitFor({ timeout: 20_000 });
    await manager.goto(`${server.url}/setup/scaffolds/${scaffoldId}`);
    const deskCard = onScreen(manager, 'exclusion-zone').first();
    await deskCard.getByTestId('zone-suggestion').waitFor({ timeout: 20_000 });
    await deskCard.getByTestId('edit-zone').waitFor();
    await deskCard.scrollIntoViewIfNeeded();
    await manager.screenshot({ path: artifactPath('exclusion-zone-1366.png') });
    await desk.close();
  });
});
