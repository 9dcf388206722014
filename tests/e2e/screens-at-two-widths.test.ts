import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifactPath, launchPhone } from '../support/browser.js';
import { choose, onScreen, rowOverlaps, settled, typeInto } from '../support/phone-page.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

/** Every visible row's risk badge ends before its item name starts (no overlap at this width). */
async function badgesClearOfText(page: Page): Promise<number> {
  const rows = onScreen(page, 'finding-row');
  const count = await rows.count();
  for (let i = 0; i < count; i++) {
    const row = rows.nth(i);
    const badge = await row.locator('.risk-badge').boundingBox();
    const item = await row.locator('.finding-row__item').boundingBox();
    if (!badge || !item) continue;
    expect(badge.x + badge.width, await row.locator('.finding-row__item').innerText()).toBeLessThanOrEqual(item.x);
  }
  return count;
}

describe('the home and the findings list on a phone and on a wide screen', () => {
  let server: RunningServer;
  let phone: Awaited<ReturnType<typeof launchPhone>>;

  beforeAll(async () => {
    server = await startBuiltServer();
    phone = await launchPhone();
  });
  afterAll(async () => {
    await phone?.close();
    await server?.dispose();
  });

  it('keeps the header status to one compact line and the risk badges clear of the item names', async () => {
    const page = await phone.context.newPage();
    await page.goto(server.url);
    await onScreen(page, 'home-sign-in').click();
    await onScreen(page, 'sign-in-email').waitFor();
    await settled(page);
    await page.screenshot({ path: artifactPath('sign-in-phone.png') });
    await typeInto(page, 'sign-in-email', 'inspector@demo.test');
    await typeInto(page, 'sign-in-password', 'plummet-demo');
    await onScreen(page, 'sign-in-submit').click();
    await expect.poll(() => onScreen(page, 'session-expiry').textContent(), { timeout: 15_000 }).toMatch(/Works offline until/);
    const quayside = onScreen(page, 'site-card').filter({ hasText: 'Quayside Library' });
    await quayside.getByTestId('make-offline').click();
    await expect.poll(() => quayside.getAttribute('data-offline'), { timeout: 30_000 }).toBe('true');

    // One toolbar row: the status sits inside it instead of a strip of chips under it.
    const header = await page.locator('ion-header').filter({ visible: true }).first().boundingBox();
    expect(header?.height).toBeLessThanOrEqual(72);
    expect(await onScreen(page, 'sync-badge').getAttribute('href')).toBe('/sync');
    await settled(page);
    await page.screenshot({ path: artifactPath('home-phone.png') });

    await quayside.getByTestId('open-site').click();
    await page.waitForURL(/\/sites\/[^/]+$/);
    const siteUrl = page.url();
    await page.goto(`${siteUrl}/findings`);
    await onScreen(page, 'finding-list').waitFor();
    await onScreen(page, 'finding-row').first().waitFor();
    expect(await badgesClearOfText(page)).toBeGreaterThan(0);
    await expect.poll(() => rowOverlaps(page, 'finding-row')).toEqual([]);
    await settled(page);
    await page.screenshot({ path: artifactPath('findings-phone.png') });

    await page.setViewportSize({ width: 1366, height: 900 });
    await onScreen(page, 'finding-row').first().waitFor();
    expect(await badgesClearOfText(page)).toBeGreaterThan(0);
    await expect.poll(() => rowOverlaps(page, 'finding-row')).toEqual([]);
    await settled(page);
    await page.screenshot({ path: artifactPath('findings-wide.png') });
    await page.goto(server.url);
    await onScreen(page, 'site-card').first().waitFor();
    await settled(page);
    await page.screenshot({ path: artifactPath('home-wide.png') });

    // The finding editor at phone width: scrolled to the estimate card, the strip under the
    // toolbar ends above the card's heading instead of covering it.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${siteUrl}/findings`);
    await onScreen(page, 'finding-row').first().click();
    const panel = onScreen(page, 'estimate-panel');
    await panel.waitFor();
    await panel.evaluate((element) => element.scrollIntoView({ block: 'start' }));
    await expect
      .poll(async () => {
        const strip = await onScreen(page, 'estimate-strip').boundingBox();
        const heading = await panel.locator('.estimate-panel__title').boundingBox();
        return strip && heading ? heading.y - (strip.y + strip.height) : -1;
      })
      .toBeGreaterThanOrEqual(0);
    await settled(page);
    await page.screenshot({ path: artifactPath('finding-estimate-phone.png') });

    // A new finding at phone width with no signal: the title shows whole beside the status.
    await phone.context.setOffline(true);
    await page.goto(siteUrl);
    await onScreen(page, 'scaffold-card').filter({ hasText: 'QL-A' }).getByTestId('open-scaffold').click();
    await onScreen(page, 'start-inspection').click();
    await choose(page, 'inspection-reason', 'after-bad-weather');
    await typeInto(page, 'inspection-wind', '6');
    await onScreen(page, 'start-walk').click();
    await onScreen(page, 'inspection-page').waitFor();
    await page.goto(`${page.url()}/findings/new`);
    await onScreen(page, 'finding-editor').waitFor();
    await expect.poll(() => onScreen(page, 'online-status').getAttribute('data-online')).toBe('false');
    const title = page.locator('ion-header').filter({ visible: true }).first().locator('ion-title');
    const cut = await title.evaluate((element) => {
      const text = element.shadowRoot?.querySelector('.toolbar-title') ?? element;
      return { text: element.textContent, cut: text.scrollWidth > text.clientWidth };
    });
    expect(cut).toEqual({ text: 'New finding', cut: false });
    await settled(page);
    await page.screenshot({ path: artifactPath('new-finding-phone.png') });
    await phone.context.setOffline(false);
  });
});
