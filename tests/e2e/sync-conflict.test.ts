import { randomUUID } from 'node:crypto';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiCall, apiSignIn } from '../support/api.js';
import { artifactPath, launchPhone } from '../support/browser.js';
import { choose, onScreen, readTable, typeInto } from '../support/phone-page.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

type Phone = Awaited<ReturnType<typeof launchPhone>>;
interface StoredFinding {
  id: string;
  notes: string;
  exposure: string;
  version: number;
}
interface StoredEntry {
  entity: string;
  action: string;
  payload: Record<string, unknown>;
}

/** The seeded finding both phones edit (QL-A, North, lift 6, bay 3). */
const SEEDED_NOTES = 'Podger left on the toe board above the library entrance';
const NOTES_A = 'Podger taken down and tethered; toe board checked (phone A)';
const NOTES_B = 'Podger still there at 10:40, foreman told (phone B)';
/** Clashing notes keep both texts, the one already on the server first. */
const BOTH_NOTES = `${NOTES_A}\n\n${NOTES_B}`;

async function signInAndKeepOffline(phone: Phone, url: string, errors: string[]): Promise<Page> {
  const page = await phone.context.newPage();
  page.on('pageerror', (error) => errors.push(error.message));
  await page.goto(url);
  await page.getByTestId('app-shell').waitFor();
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 30_000 });
  await onScreen(page, 'home-sign-in').click();
  await typeInto(page, 'sign-in-email', 'inspector@demo.test');
  await typeInto(page, 'sign-in-password', 'plummet-demo');
  await onScreen(page, 'sign-in-submit').click();
  await expect.poll(() => onScreen(page, 'session-expiry').textContent(), { timeout: 15_000 }).toMatch(/Works offline until/);
  // The engine starts with the session and syncs at once.
  await expect.poll(() => onScreen(page, 'last-sync').textContent(), { timeout: 15_000 }).toMatch(/^Synced \d\d:\d\d$/);
  const quayside = onScreen(page, 'site-card').filter({ hasText: 'Quayside Library' });
  await quayside.getByTestId('make-offline').click();
  await expect.poll(() => quayside.getAttribute('data-offline'), { timeout: 30_000 }).toBe('true');
  return page;
}

async function goOffline(phone: Phone, page: Page): Promise<void> {
  await phone.context.setOffline(true);
  await expect.poll(() => onScreen(page, 'online-status').first().getAttribute('data-online')).toBe('false');
}

async function editFinding(page: Page, url: string, id: string, edit: (page: Page) => Promise<void>): Promise<void> {
  await page.goto(`${url}/findings/${id}`);
  await onScreen(page, 'finding-editor').waitFor();
  await expect.poll(() => onScreen(page, 'finding-notes').inputValue()).toBe(SEEDED_NOTES);
  await edit(page);
  await onScreen(page, 'save-finding').click();
  await expect.poll(() => onScreen(page, 'outbox-count').getAttribute('data-count')).toBe('1');
}

/** Sets a scaffold's tag on its screen with a reason, as an inspector does on site. */
async function setTag(page: Page, url: string, scaffoldId: string, status: string, note: string): Promise<void> {
  await page.goto(`${url}/scaffolds/${scaffoldId}`);
  await onScreen(page, 'scaffold-page').waitFor();
  await onScreen(page, 'change-tag').click();
  await choose(page, 'tag-change-status', status);
  await typeInto(page, 'tag-change-note', note);
  await onScreen(page, 'tag-change-save').scrollIntoViewIfNeeded();
  await page.screenshot({ path: artifactPath(`scaffold-tag-${status}.png`) });
  await onScreen(page, 'tag-change-save').click();
  await expect.poll(() => onScreen(page, 'scaffold-status').first().getAttribute('data-status')).toBe(status);
}

async function storedFinding(page: Page, id: string): Promise<StoredFinding> {
  return (await readTable<StoredFinding>(page, 'findings')).find((finding) => finding.id === id)!;
}

describe('two phones edit the same finding offline', () => {
  let server: RunningServer;
  let phoneA: Phone;
  let phoneB: Phone;
  /** The two signed-in pages, kept for the next test. */
  const pages: Page[] = [];
  const errors: string[] = [];

  beforeAll(async () => {
    server = await startBuiltServer();
    [phoneA, phoneB] = await Promise.all([launchPhone(), launchPhone()]);
  });
  afterAll(async () => {
    await phoneA?.close();
    await phoneB?.close();
    await server?.dispose();
  });

  it('merges different fields, keeps both texts of a notes clash with a conflict, and settles it in the app', async () => {
    const a = await signInAndKeepOffline(phoneA, server.url, errors);
    const b = await signInAndKeepOffline(phoneB, server.url, errors);
    pages.push(a, b);
    const seeded = (await readTable<StoredFinding>(a, 'findings')).find((finding) => finding.notes === SEEDED_NOTES)!;
    expect(seeded).toBeDefined();
    expect((await storedFinding(b, seeded.id)).version).toBe(seeded.version);

    // No signal on either phone; each edits the notes, and B also who is below.
    await goOffline(phoneA, a);
    await goOffline(phoneB, b);
    await editFinding(a, server.url, seeded.id, (page) => typeInto(page, 'finding-notes', NOTES_A));
    await editFinding(b, server.url, seeded.id, async (page) => {
      await typeInto(page, 'finding-notes', NOTES_B);
      await choose(page, 'exposure', 'hard-hats');
    });
    // Only the changed fields travel, with the version each edit started from.
    expect((await readTable<StoredEntry>(a, 'outbox')).map((entry) => entry.payload)).toEqual([{ notes: NOTES_A, version: seeded.version }]);
    expect((await readTable<StoredEntry>(b, 'outbox')).map((entry) => entry.payload)).toEqual([{ notes: NOTES_B, exposure: 'hard-hats', version: seeded.version }]);

    // A reconnects first and syncs by itself when the connection returns.
    await phoneA.context.setOffline(false);
    await expect.poll(() => onScreen(a, 'outbox-count').getAttribute('data-count'), { timeout: 20_000 }).toBe('0');
    expect(await storedFinding(a, seeded.id)).toMatchObject({ notes: NOTES_A, exposure: 'public' });

    // Then B: its exposure merges; its notes clash with A's, which B had not seen: both texts stay, and a conflict.
    await phoneB.context.setOffline(false);
    await expect.poll(() => onScreen(b, 'outbox-count').getAttribute('data-count'), { timeout: 30_000 }).toBe('0');
    await expect.poll(() => onScreen(b, 'sync-attention').textContent(), { timeout: 30_000 }).toBe('1 conflict to settle');
    expect(await storedFinding(b, seeded.id)).toMatchObject({ notes: BOTH_NOTES, exposure: 'hard-hats' });

    // The conflict in the app: the finding, the field, both values and who wrote them.
    await onScreen(b, 'sync-badge').click();
    await onScreen(b, 'sync-page').waitFor();
    const card = onScreen(b, 'conflict-card');
    await card.waitFor();
    expect(await card.getByTestId('conflict-field').textContent()).toBe('Notes');
    await expect.poll(() => card.innerText()).toMatch(/QL-A · North, lift 6, bay 3/);
    expect(await card.getByTestId('conflict-current').textContent()).toBe(BOTH_NOTES);
    expect(await card.getByTestId('conflict-replaced').textContent()).toBe(NOTES_A);
    expect(await card.innerText()).toMatch(/written by you/);
    // Who wrote the replaced value, and when: phone A's edit, made by the same inspector.
    expect(await card.getByTestId('conflict-replaced-by').textContent()).toMatch(/^Replaced — written by you, \d{1,2} \w{3} \d{4}, \d\d:\d\d$/);
    await expect.poll(() => onScreen(b, 'online-status').first().getAttribute('data-online')).toBe('true');
    await card.getByTestId('keep-current').scrollIntoViewIfNeeded();
    await b.screenshot({ path: artifactPath('sync-conflict.png') });

    // Settling needs the server: with no signal the app says so and nothing changes.
    await phoneB.context.setOffline(true);
    await card.getByTestId('keep-replaced').click();
    await expect.poll(() => card.getByTestId('conflict-problem').textContent()).toMatch(/needs a connection/);
    await phoneB.context.setOffline(false);

    // Settle it: keep A's notes alone.
    await card.getByTestId('keep-replaced').click();
    await onScreen(b, 'no-conflicts').waitFor({ timeout: 15_000 });
    await expect.poll(async () => (await storedFinding(b, seeded.id)).notes, { timeout: 15_000 }).toBe(NOTES_A);

    // A syncs again and gets the settled value and B's merged field.
    await onScreen(a, 'sync-badge').click();
    await onScreen(a, 'sync-page').waitFor();
    await onScreen(a, 'sync-now').click();
    await expect.poll(() => onScreen(a, 'sync-outcome').getAttribute('data-outcome'), { timeout: 15_000 }).toBe('done');
    await onScreen(a, 'no-conflicts').waitFor();

    for (const page of [a, b]) {
      expect(await storedFinding(page, seeded.id)).toMatchObject({ notes: NOTES_A, exposure: 'hard-hats' });
      await expect.poll(() => onScreen(page, 'sync-pending').getAttribute('data-count')).toBe('0');
      expect(await onScreen(page, 'outbox-count').textContent()).toBe('All changes sent');
      expect(await onScreen(page, 'no-rejected').count()).toBe(1);
      await page.goto(`${server.url}/findings/${seeded.id}`);
      await onScreen(page, 'finding-editor').waitFor();
      await expect.poll(() => onScreen(page, 'finding-notes').inputValue()).toBe(NOTES_A);
    }
    expect(errors).toEqual([]);
  });

  it('sends a tag set offline once the connection returns; against another phone’s unseen tag the more restrictive stands, settled on the conflict card', async () => {
    const [a, b] = pages as [Page, Page];
    const qlA = (await readTable<{ id: string; reference: string }>(a, 'scaffolds')).find((scaffold) => scaffold.reference === 'QL-A')!;
    await goOffline(phoneA, a);
    await goOffline(phoneB, b);
    await setTag(a, server.url, qlA.id, 'limited', 'Lifts 1–4 only: ties out above');
    await setTag(b, server.url, qlA.id, 'cleared', 'Ties back in');
    expect((await readTable<StoredEntry>(a, 'outbox')).map((entry) => [entry.entity, entry.action, entry.payload])).toEqual([
      ['scaffold', 'status', { status: 'limited', note: 'Lifts 1–4 only: ties out above' }],
    ]);

    // A reconnects first: its tag reaches the server. Then B's cleared tag clashes with it and the limited tag stands.
    await phoneA.context.setOffline(false);
    await expect.poll(() => onScreen(a, 'outbox-count').getAttribute('data-count'), { timeout: 20_000 }).toBe('0');
    await phoneB.context.setOffline(false);
    await expect.poll(() => onScreen(b, 'outbox-count').getAttribute('data-count'), { timeout: 30_000 }).toBe('0');
    await expect.poll(() => onScreen(b, 'sync-attention').textContent(), { timeout: 30_000 }).toBe('1 conflict to settle');
    await expect.poll(async () => (await readTable<{ id: string; status: string }>(b, 'scaffolds')).find((s) => s.id === qlA.id)?.status, { timeout: 15_000 }).toBe('limited');

    await onScreen(b, 'sync-badge').click();
    await onScreen(b, 'sync-page').waitFor();
    const card = onScreen(b, 'conflict-card');
    await card.waitFor();
    expect(await card.getAttribute('data-entity')).toBe('scaffold');
    expect(await card.getByTestId('conflict-field').textContent()).toBe('Tag status');
    expect(await card.getByTestId('conflict-current').textContent()).toBe('Limited use');
    expect(await card.getByTestId('conflict-replaced').textContent()).toBe('Cleared for use');
    await card.getByTestId('keep-current').scrollIntoViewIfNeeded();
    await b.screenshot({ path: artifactPath('sync-conflict-tag.png') });
    await card.getByTestId('keep-current').click();
    await onScreen(b, 'no-conflicts').waitFor({ timeout: 15_000 });
    expect(errors).toEqual([]);
  });
  it('names a writer who is not you, and says what a conflict is on when it is an inspection', async () => {
    const b = pages[1]!;
    const call = async (token: string, method: string, path: string, body?: unknown) => {
      const answer = await apiCall(server.url, method, path, token, body);
      expect(answer.status, JSON.stringify(answer.body)).toBeLessThan(300);
      return answer.body;
    };
    const [inspector, manager] = [await apiSignIn(server.url, 'inspector@demo.test'), await apiSignIn(server.url, 'manager@demo.test')];
    const qlB = (await readTable<{ id: string; reference: string }>(b, 'scaffolds')).find((scaffold) => scaffold.reference === 'QL-B')!;

    // Offline, the phone closes QL-B; meanwhile the manager, who had not seen that, clears it from the office.
    await goOffline(phoneB, b);
    await setTag(b, server.url, qlB.id, 'closed', 'Boards loose on lift 2');
    await call(manager, 'POST', `/scaffolds/${qlB.id}/status`, { status: 'cleared', note: 'Boards fixed' });
    // And two of the inspector's phones send an inspection's wind, each without the other's.
    const inspectionId = randomUUID();
    await call(inspector, 'POST', '/inspections', { id: inspectionId, scaffoldId: qlB.id, reason: 'scheduled', windSpeedMps: 4 });
    for (const windSpeedMps of [12, 6]) {
      await call(inspector, 'POST', '/sync/push', {
        clientId: randomUUID(),
        mutations: [{ id: 1, entity: 'inspection', entityId: inspectionId, action: 'update', baseVersion: 1, payload: { windSpeedMps } }],
      });
    }

    await phoneB.context.setOffline(false);
    await expect.poll(() => onScreen(b, 'sync-attention').textContent(), { timeout: 30_000 }).toBe('2 conflicts to settle');
    await onScreen(b, 'sync-badge').click();
    await onScreen(b, 'sync-page').waitFor();
    const tag = b.locator('[data-testid="conflict-card"][data-entity="scaffold"]');
    await expect.poll(() => tag.getByTestId('conflict-replaced-by').textContent()).toMatch(/^Not in place — written by Tomasz Reid, /);
    expect(await tag.getByTestId('conflict-current').textContent()).toBe('Closed to use');
    const inspection = b.locator('[data-testid="conflict-card"][data-entity="inspection"]');
    await expect.poll(() => inspection.locator('.conflict-card__title').innerText()).toMatch(/^Inspection — QL-B, started \d{1,2} \w{3} \d{4}, \d\d:\d\d$/);
    expect(await inspection.getByTestId('conflict-field').textContent()).toBe('Wind speed');
    // The stronger wind stands (it carries items further), in the user's wind unit.
    expect(await inspection.getByTestId('conflict-current').textContent()).toMatch(/^(12 m\/s|43\.2 km\/h|26\.8 mph)$/);
    expect(await inspection.innerText()).toMatch(/then change it in the inspection/);
    await inspection.scrollIntoViewIfNeeded();
    await b.screenshot({ path: artifactPath('sync-conflict-inspection.png') });
    expect(errors).toEqual([]);
  });
});
