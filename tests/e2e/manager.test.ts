import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { parse } from 'csv-parse/sync';
import pg from 'pg';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifactPath, launchBrowser, launchPhone } from '../support/browser.js';
import { onScreen, typeInto } from '../support/phone-page.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

const require = createRequire(import.meta.url);
// Evaluated through the DevTools protocol: the app's Content Security Policy rightly refuses an injected <script>.
const AXE_SOURCE = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

/** axe-core in the page; every serious or critical violation, by rule and the first offending element. */
async function accessibilityProblems(page: Page): Promise<string[]> {
  await page.evaluate(AXE_SOURCE);
  return page.evaluate(async () => {
    const result = await (window as unknown as { axe: { run(): Promise<{ violations: { id: string; impact: string | null; nodes: { target: unknown[] }[] }[] }> } }).axe.run();
    return result.violations
      .filter((v) => v.impact === 'serious' || v.impact === 'critical')
      .map((v) => `${v.impact} ${v.id}: ${JSON.stringify(v.nodes[0]?.target)} (${v.nodes.length})`);
  });
}

/** Waits for a value the screen shows after a round trip; generous, as the test machine may be busy. */
const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 15_000 });

async function signInAsManager(page: Page, url: string): Promise<void> {
  await page.goto(url);
  await onScreen(page, 'home-sign-in').click();
  await typeInto(page, 'sign-in-email', 'manager@demo.test');
  await typeInto(page, 'sign-in-password', 'plummet-demo');
  await onScreen(page, 'sign-in-submit').click();
  // Managers start on their own overview, not on the inspector's sites.
  await onScreen(page, 'overview-page').waitFor({ timeout: 20_000 });
  expect(new URL(page.url()).pathname).toBe('/overview');
}

describe('a manager reviews the synced findings', () => {
  let server: RunningServer;
  let browser: Browser;
  let db: pg.Client;
  let orgId: string;

  beforeAll(async () => {
    server = await startBuiltServer();
    browser = await launchBrowser();
    db = new pg.Client({ connectionString: server.db.url });
    await db.connect();
    orgId = (await db.query<{ id: string }>("SELECT id::text AS id FROM organisations WHERE slug = 'harrow-span'")).rows[0].id;
  });
  afterAll(async () => {
    await db?.end();
    await browser?.close();
    await server?.dispose();
  });

  /**
   * The review a manager does, the same at a desk and on a phone: the overview against the
   * database, the table filtered and sorted, the CSV read back, one finding handed to the foreman.
   * `pick` is the row (in the sorted table) to assign; `shots` names the screenshots to keep.
   */
  async function review(page: Page, pick: number, shots: { overview: string; table?: string }): Promise<void> {
    await signInAsManager(page, server.url);

    // The overview's numbers against counts taken straight from PostgreSQL.
    const counts = await db.query<{ band: string; n: number }>(
      "SELECT risk_band AS band, count(*)::int AS n FROM findings WHERE organisation_id = $1 AND state IN ('open', 'made-safe') GROUP BY risk_band",
      [orgId],
    );
    const fixed = (await db.query<{ n: number }>("SELECT count(*)::int AS n FROM findings WHERE organisation_id = $1 AND state = 'fixed'", [orgId])).rows[0].n;
    const figure = (id: string) => onScreen(page, id).locator('.manager-figure__value').textContent();
    for (const band of ['High', 'Medium', 'Low']) {
      await poll(() => figure(`total-open-${band}`)).toBe(String(counts.rows.find((r) => r.band === band)?.n ?? 0));
    }
    expect(await figure('total-to-verify')).toBe(String(fixed));
    expect(await accessibilityProblems(page)).toEqual([]);
    await page.screenshot({ path: artifactPath(shots.overview), fullPage: true });

    // A number opens the list behind it.
    await onScreen(page, 'total-open-High').click();
    await onScreen(page, 'findings-table-page').waitFor();
    const high = counts.rows.find((r) => r.band === 'High')?.n ?? 0;
    await poll(() => onScreen(page, 'finding-row').count()).toBe(high);

    // Filters and sort: Medium too, then the oldest first.
    await onScreen(page, 'filter-band-Medium').check();
    const expectedRows = (
      await db.query<{ id: string }>(
        "SELECT id::text AS id FROM findings WHERE organisation_id = $1 AND state IN ('open', 'made-safe') AND risk_band IN ('High', 'Medium') ORDER BY created_at ASC, id ASC",
        [orgId],
      )
    ).rows.map((r) => r.id);
    await poll(() => onScreen(page, 'finding-row').count()).toBe(expectedRows.length);
    await onScreen(page, 'sort-createdAt').click();
    await poll(() => new URL(page.url()).searchParams.get('sort')).toBe('createdAt');
    if (new URL(page.url()).searchParams.get('order') !== 'asc') await onScreen(page, 'sort-createdAt').click();
    const rowIds = () => page.locator('[data-testid="finding-row"]').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-finding-id')));
    await poll(rowIds).toEqual(expectedRows);
    expect(await accessibilityProblems(page)).toEqual([]);
    if (shots.table) await page.screenshot({ path: artifactPath(shots.table), fullPage: true });

    // The export holds the same rows, in the same order.
    const [download] = await Promise.all([page.waitForEvent('download'), onScreen(page, 'export-csv').click()]);
    const csv = parse(readFileSync((await download.path())!, 'utf8'), { columns: true }) as Record<string, string>[];
    expect(csv.map((r) => r['Finding id'])).toEqual(expectedRows);

    // Open one and hand it to the foreman.
    const foreman = (await db.query<{ id: string; name: string }>("SELECT id::text AS id, name FROM users WHERE email = 'foreman@demo.test'")).rows[0];
    const chosen = expectedRows[pick];
    await page.locator(`[data-testid="finding-row"][data-finding-id="${chosen}"]`).getByRole('link').click();
    await onScreen(page, 'manager-finding-page').waitFor();
    await onScreen(page, 'finding-title').waitFor();
    expect(new URL(page.url()).pathname).toBe(`/review/${chosen}`);
    await onScreen(page, 'assign-foreman').selectOption(foreman.id);
    await onScreen(page, 'assign-button').click();
    await poll(() => onScreen(page, 'finding-assignee').textContent()).toContain(foreman.name);
    const assigned = await db.query<{ assignee: string }>('SELECT assignee_id::text AS assignee FROM findings WHERE id = $1', [chosen]);
    expect(assigned.rows[0].assignee).toBe(foreman.id);
    expect(await accessibilityProblems(page)).toEqual([]);
  }

  it('at a desk: overview matching the database, table filtered and sorted, a finding reassigned, the CSV read back, trends', async () => {
    const context = await browser.newContext({ viewport: { width: 1366, height: 900 }, acceptDownloads: true });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await review(page, 0, { overview: 'manager-overview.png', table: 'manager-findings-table.png' });

    // Trends: the chart comes with this screen, and its numbers are in tables too.
    await page.getByRole('link', { name: 'Trends' }).click();
    await onScreen(page, 'trends-weekly-table').waitFor();
    await page.locator('.uplot canvas').first().waitFor();
    expect(await accessibilityProblems(page)).toEqual([]);
    await page.screenshot({ path: artifactPath('manager-trends.png'), fullPage: true });

    await page.getByRole('link', { name: 'Reports' }).click();
    await onScreen(page, 'reports-scaffolds').waitFor();
    await page.locator('[data-testid="reports-scaffolds"] button').first().click();
    await onScreen(page, 'reports-inspections').waitFor();
    expect(await accessibilityProblems(page)).toEqual([]);

    expect(errors).toEqual([]);
    await context.close();
  });

  it('on a phone: the same review, stacked, with no offline download asked for, and the last overview readable offline', async () => {
    const phone = await launchPhone();
    try {
      const page = await phone.context.newPage();
      const errors: string[] = [];
      page.on('pageerror', (e) => errors.push(e.message));
      await review(page, 1, { overview: 'manager-overview-phone.png', table: 'manager-findings-table-phone.png' });
      expect(await page.getByTestId('make-offline').count()).toBe(0);

      // Trends and reports stack on a phone too, and pass the same checks.
      await page.goto(`${server.url}/trends`);
      await onScreen(page, 'trends-weekly-table').waitFor();
      expect(await accessibilityProblems(page)).toEqual([]);
      await page.screenshot({ path: artifactPath('manager-trends-phone.png'), fullPage: true });

      await page.goto(`${server.url}/overview`);
      await onScreen(page, 'total-open-High').waitFor();
      await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 30_000 });
      // No connection: the last overview stays on screen, with a note that it may be stale.
      await phone.context.setOffline(true);
      await page.reload().catch(() => undefined);
      await onScreen(page, 'overview-page').waitFor({ timeout: 20_000 });
      await onScreen(page, 'total-open-High').waitFor();
      await onScreen(page, 'stale-note').waitFor({ timeout: 20_000 });
      await page.screenshot({ path: artifactPath('manager-overview-offline-phone.png'), fullPage: true });
      expect(errors).toEqual([]);
    } finally {
      await phone.close();
    }
  });
});
