import { createHash } from 'node:crypto';
import pg from 'pg';
import sharp from 'sharp';
import { processPhoto } from '../../server/src/photos/photo-image.js';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiSignIn } from '../support/api.js';
import { artifactPath, launchPhone } from '../support/browser.js';
import { choose, onScreen, readTable, saveFinding, typeInto } from '../support/phone-page.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

/** A camera-sized JPEG (2400 × 1800, larger than the phone keeps) with some structure in it. */
async function cameraJpeg(hue: { r: number; g: number; b: number }): Promise<Buffer> {
  const stripes = Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="2400" height="1800"><rect width="2400" height="1800" fill="rgb(${hue.r},${hue.g},${hue.b})"/>` +
      Array.from({ length: 24 }, (_, i) => `<rect x="${i * 100}" y="0" width="40" height="1800" fill="#ffffff" opacity="0.35"/>`).join('') +
      `<circle cx="1200" cy="900" r="400" fill="#1c1424"/></svg>`,
  );
  return sharp(stripes).jpeg({ quality: 90 }).toBuffer();
}

interface FindingSnapshot {
  id: string;
  text: string;
}

async function findingRows(page: Page): Promise<FindingSnapshot[]> {
  const rows = onScreen(page, 'inspection-findings').getByTestId('finding-row');
  const count = await rows.count();
  const out: FindingSnapshot[] = [];
  for (let i = 0; i < count; i++) {
    out.push({ id: (await rows.nth(i).getAttribute('data-finding-id')) ?? '', text: (await rows.nth(i).innerText()).replace(/\s+/g, ' ') });
  }
  return out.sort((a, b) => a.id.localeCompare(b.id));
}

async function addFindingAt(page: Page, lift: number, bay: number): Promise<void> {
  await onScreen(page, 'tab-walk').click();
  await onScreen(page, `cell-${lift}-${bay}`).click();
  await onScreen(page, 'add-finding-here').click();
  await onScreen(page, 'finding-editor').waitFor();
}

async function pickCatalogueItem(page: Page, search: string): Promise<void> {
  await typeInto(page, 'item-search', search);
  await onScreen(page, 'item-hit').first().click();
  await onScreen(page, 'chosen-item').waitFor();
}

async function attachPhoto(page: Page, inputTestId: string, jpeg: Buffer): Promise<void> {
  const editor = page.locator('.ion-page:not(.ion-page-hidden)').last();
  await editor.getByTestId(inputTestId).setInputFiles({ name: 'camera.jpg', mimeType: 'image/jpeg', buffer: jpeg });
}

/** Every photo the phone holds, with its bytes (base64). */
async function photoBytes(page: Page): Promise<{ id: string; ownerType: string; ownerId: string; base64: string }[]> {
  return page.evaluate(
    () =>
      new Promise((resolve, reject) => {
        const open = indexedDB.open('plummet');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const request = open.result.transaction('photos', 'readonly').objectStore('photos').getAll();
          request.onsuccess = async () => {
            open.result.close();
            const rows = request.result as { id: string; ownerType: string; ownerId: string; data: Blob | ArrayBuffer }[];
            const out = [];
            for (const row of rows) {
              const buffer = row.data instanceof Blob ? await row.data.arrayBuffer() : row.data;
              let binary = '';
              for (const byte of new Uint8Array(buffer)) binary += String.fromCharCode(byte);
              out.push({ id: row.id, ownerType: row.ownerType, ownerId: row.ownerId, base64: btoa(binary) });
            }
            resolve(out);
          };
          request.onerror = () => reject(request.error);
        };
      }),
  );
}

/**
 * On the server: the signed inspection with the phone's signature, its ten control checks (toe
 * boards failed, with the note), the three findings, and each photo the phone took. The server
 * re-encodes every upload (metadata dropped, server/src/photos/photo-image.ts), so "the same bytes"
 * is checked as: what it serves is exactly what that processing makes of the bytes the phone held.
 */
async function expectWalkOnServer(server: RunningServer, inspectionId: string, signature: string, phonePhotos: Awaited<ReturnType<typeof photoBytes>>) {
  const pool = new pg.Pool({ connectionString: server.db.url, max: 1 });
  try {
    const [walk] = (await pool.query('select finished_at, signed_at, signature from inspections where id = $1', [inspectionId])).rows;
    expect(walk?.finished_at).not.toBeNull();
    expect(walk?.signed_at).not.toBeNull();
    expect(walk?.signature).toBe(signature);
    const checks = (await pool.query('select control, result, note from control_checks where inspection_id = $1', [inspectionId])).rows;
    expect(checks).toHaveLength(10);
    expect(checks.find((c) => c.control === 'toe-boards')).toMatchObject({ result: 'fail', note: 'Missing at North bay 7, lift 5' });
    const findings = (await pool.query(`select id, item_name as name, state from findings where inspection_id = $1`, [inspectionId])).rows;
    expect(findings.map((f) => f.name).sort()).toEqual(expect.arrayContaining(['Brick offcut']));
    expect(findings).toHaveLength(3);
    expect(findings.find((f) => f.name === 'Brick offcut')?.state).toBe('made-safe');

    expect(phonePhotos).toHaveLength(3);
    const stored = (await pool.query('select id, owner_type, owner_id, content_hash from photos where id = any($1::uuid[])', [phonePhotos.map((p) => p.id)])).rows;
    expect(stored).toHaveLength(3);
    const token = await apiSignIn(server.url, 'inspector@demo.test');
    for (const photo of phonePhotos) {
      const row = stored.find((r) => r.id === photo.id);
      expect(row).toMatchObject({ owner_type: photo.ownerType, owner_id: photo.ownerId });
      const processed = await processPhoto(Buffer.from(photo.base64, 'base64'), 'image/jpeg', { keepLocation: false });
      expect(row.content_hash).toBe(processed.contentHash);
      const served = await fetch(`${server.url}/api/photos/${photo.id}`, { headers: { Authorization: `Bearer ${token}` } });
      expect(served.status).toBe(200);
      expect(createHash('sha256').update(Buffer.from(await served.arrayBuffer())).digest('hex')).toBe(processed.contentHash);
    }
  } finally {
    await pool.end();
  }
}

describe('the inspector’s walk with no signal', () => {
  let server: RunningServer;
  let phone: Awaited<ReturnType<typeof launchPhone>>;
  const pageErrors: string[] = [];
  /** One phone tab through the whole file: each test carries on where the last left off. */
  let page: Page;

  beforeAll(async () => {
    server = await startBuiltServer();
    phone = await launchPhone();
  });
  afterAll(async () => {
    await phone?.close();
    await server?.dispose();
  });

  it('records an inspection offline with three findings and photos, and keeps all of it through a reload', async () => {
    page = await phone.context.newPage();
    page.on('pageerror', (error) => pageErrors.push(error.message));
    const [jpegA, jpegB, jpegC] = await Promise.all([cameraJpeg({ r: 190, g: 110, b: 40 }), cameraJpeg({ r: 60, g: 120, b: 170 }), cameraJpeg({ r: 150, g: 40, b: 40 })]);

    // Online: install the app, sign in, make the site available offline.
    await page.goto(server.url);
    await page.getByTestId('app-shell').waitFor();
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 30_000 });
    await onScreen(page, 'home-sign-in').click();
    await typeInto(page, 'sign-in-email', 'inspector@demo.test');
    await typeInto(page, 'sign-in-password', 'plummet-demo');
    await onScreen(page, 'sign-in-submit').click();
    await expect.poll(() => onScreen(page, 'session-expiry').textContent(), { timeout: 15_000 }).toMatch(/Works offline until/);

    const quayside = onScreen(page, 'site-card').filter({ hasText: 'Quayside Library' });
    await quayside.getByTestId('make-offline').click();
    await quayside.getByTestId('storage-report').waitFor({ timeout: 30_000 });
    expect(await quayside.getByTestId('storage-report').innerText()).toMatch(/Plummet uses .+ on this phone/);
    expect(['granted', 'best-effort', 'unsupported']).toContain(await quayside.getByTestId('storage-persistence').getAttribute('data-persistence'));
    await expect.poll(() => quayside.getAttribute('data-offline')).toBe('true');
    await page.screenshot({ path: artifactPath('sites.png') });

    // No signal from here on.
    await server.stop();
    await phone.context.setOffline(true);
    await expect.poll(() => onScreen(page, 'online-status').first().getAttribute('data-online')).toBe('false');

    await quayside.getByTestId('open-site').click();
    await onScreen(page, 'scaffold-card').filter({ hasText: 'QL-A' }).getByTestId('open-scaffold').click();
    await onScreen(page, 'elevation-grid').waitFor();
    await expect.poll(() => onScreen(page, 'cell-6-3').getAttribute('data-count')).toBe('1'); // a downloaded finding, pinned
    await page.getByTestId('offline-ready').waitFor({ state: 'detached', timeout: 15_000 });
    await page.screenshot({ path: artifactPath('scaffold-page.png') });

    // Start the walk.
    await onScreen(page, 'start-inspection').click();
    await choose(page, 'inspection-reason', 'after-bad-weather');
    await typeInto(page, 'inspection-wind', '6');
    await onScreen(page, 'start-walk').click();
    await onScreen(page, 'inspection-page').waitFor();
    const inspectionUrl = page.url();

    // Finding 1: a catalogue item, with a photo.
    await addFindingAt(page, 5, 4);
    await pickCatalogueItem(page, 'hammer');
    await choose(page, 'exposure', 'public');
    await choose(page, 'likelihood-edgeDistance', 'at-edge');
    await attachPhoto(page, 'finding-photos-input', jpegA);
    await onScreen(page, 'finding-photos').getByTestId('photo-thumb').waitFor();
    await expect.poll(() => onScreen(page, 'estimate-energy').textContent()).toMatch(/\d+(\.\d+)? J$/);
    const energyBefore = await onScreen(page, 'estimate-energy').textContent();
    await onScreen(page, 'finding-editor').evaluate((content) => (content as HTMLElement & { scrollToTop(): Promise<void> }).scrollToTop());
    await page.screenshot({ path: artifactPath('finding-editor.png') });
    await onScreen(page, 'estimate-panel').scrollIntoViewIfNeeded();
    await page.screenshot({ path: artifactPath('finding-editor-estimate.png') });
    await onScreen(page, 'explain-estimate').click();
    const sheet = onScreen(page, 'how-computed');
    await sheet.getByText('Terminal speed').first().waitFor();
    expect(await sheet.innerText()).toMatch(/ICAO Doc 7488[\s\S]*competent person prevail/);
    expect(await sheet.getByTestId('how-computed-impacts').innerText()).toMatch(/In still air[\s\S]*Over the ground with the wind/); // the 6 m/s inspection wind
    await page.screenshot({ path: artifactPath('how-computed.png') });
    await sheet.getByRole('button', { name: 'Close' }).click();
    await sheet.waitFor({ state: 'hidden' });
    await saveFinding(page);
    await onScreen(page, 'inspection-page').waitFor();

    // Finding 2: described by hand, measured height, made safe now, with a photo; the estimate follows typing.
    await addFindingAt(page, 3, 7);
    await choose(page, 'item-mode', 'custom');
    await typeInto(page, 'custom-name', 'Brick offcut');
    await typeInto(page, 'custom-mass', '2.3');
    await typeInto(page, 'dimension-lengthM', '21.5');
    await typeInto(page, 'dimension-widthM', '10');
    await typeInto(page, 'dimension-heightM', '6.5');
    await choose(page, 'height-mode', 'measured');
    await typeInto(page, 'measured-height', '5.5');
    const lowEnergy = await onScreen(page, 'estimate-energy').textContent();
    await typeInto(page, 'measured-height', '11');
    await expect.poll(() => onScreen(page, 'estimate-energy').textContent()).not.toBe(lowEnergy);
    await attachPhoto(page, 'finding-photos-input', jpegB);
    await onScreen(page, 'finding-photos').getByTestId('photo-thumb').waitFor();
    await onScreen(page, 'made-safe').check();
    await typeInto(page, 'made-safe-note', 'Bagged and lowered to the ground');
    await saveFinding(page);
    await onScreen(page, 'inspection-page').waitFor();

    // Finding 3: a catalogue item, no photo.
    await addFindingAt(page, 6, 10);
    await pickCatalogueItem(page, 'coupler');
    await choose(page, 'exposure', 'hard-hats');
    await saveFinding(page);
    await onScreen(page, 'inspection-page').waitFor();

    // The ten control checks; toe boards fail, with a note and a photo.
    await onScreen(page, 'tab-checks').click();
    expect(await onScreen(page, 'control-toe-boards-criterion').innerText()).toContain('150 mm'); // a UK site
    const others = ['brick-guards', 'netting-or-sheeting', 'fans-or-canopies', 'exclusion-zone-barriers', 'tool-tethering', 'material-storage'];
    for (const control of [...others, 'chutes-and-lowering', 'loading-bay-gates', 'guardrail-mesh']) {
      await choose(page, `control-${control}-result`, control === 'fans-or-canopies' ? 'not-applicable' : 'pass');
    }
    await choose(page, 'control-toe-boards-result', 'fail');
    await typeInto(page, 'control-toe-boards-note', 'Missing at North bay 7, lift 5');
    await onScreen(page, 'tab-checks').click(); // leave the note: it is saved on blur
    await attachPhoto(page, 'control-toe-boards-photo-input', jpegC);
    await expect.poll(() => onScreen(page, 'control-toe-boards-photo').getAttribute('data-count'), { timeout: 15_000 }).toBe('1');
    await expect.poll(() => onScreen(page, 'tab-checks').textContent()).toBe('Checks 10/10');
    await onScreen(page, 'control-toe-boards').scrollIntoViewIfNeeded();
    await page.screenshot({ path: artifactPath('control-checks.png') });

    await onScreen(page, 'tab-findings').click();
    await expect.poll(async () => (await findingRows(page)).length).toBe(3);
    const before = await findingRows(page);
    await onScreen(page, 'tab-walk').click();
    await onScreen(page, 'cell-5-4').click();
    await onScreen(page, 'cell-panel').scrollIntoViewIfNeeded();
    await page.screenshot({ path: artifactPath('inspection-walk.png') });
    await onScreen(page, 'tab-findings').click();
    expect(before.map((row) => row.text).join('\n')).toContain('Brick offcut');

    // Finish and sign, with a drawn signature.
    await onScreen(page, 'go-finish').click();
    await onScreen(page, 'finish-page').waitFor();
    await expect.poll(() => onScreen(page, 'report-mattersGivingRisk').inputValue()).toContain('Brick offcut');
    await onScreen(page, 'signature-pad').scrollIntoViewIfNeeded();
    const pad = await onScreen(page, 'signature-pad').boundingBox();
    expect(pad).not.toBeNull();
    await page.mouse.move(pad!.x + 30, pad!.y + pad!.height * 0.6);
    await page.mouse.down();
    await page.mouse.move(pad!.x + pad!.width * 0.4, pad!.y + pad!.height * 0.3, { steps: 8 });
    await page.mouse.move(pad!.x + pad!.width * 0.8, pad!.y + pad!.height * 0.7, { steps: 8 });
    await page.mouse.up();
    await expect.poll(() => onScreen(page, 'signature-pad').getAttribute('aria-label')).toBe('Your drawn signature');
    // The outcome written on the tag.
    await choose(page, 'outcome-status', 'closed');
    await choose(page, 'outcome-tags', 'yes');
    await page.screenshot({ path: artifactPath('finish-and-sign.png') });
    await onScreen(page, 'sign-and-finish').click();
    await onScreen(page, 'scaffold-page').waitFor();
    await expect.poll(() => onScreen(page, 'cell-5-4').getAttribute('data-count')).toBe('1');

    // The quick estimate (its route keeps the path /calculator), for a what-if with no record.
    await page.goto(`${server.url}/calculator`);
    await onScreen(page, 'calculator-page').waitFor();
    await choose(page, 'item-mode', 'custom');
    await typeInto(page, 'custom-name', 'Podger spanner');
    await typeInto(page, 'custom-mass', '0.45');
    await choose(page, 'custom-shape', 'rod');
    await typeInto(page, 'dimension-lengthM', '30');
    await typeInto(page, 'dimension-diameterM', '2');
    await typeInto(page, 'calc-height', '12');
    await typeInto(page, 'calc-wind', '8');
    await onScreen(page, 'what-if').waitFor();
    await onScreen(page, 'what-if-section').scrollIntoViewIfNeeded();
    const now = Number(await onScreen(page, 'what-if-now').getAttribute('data-score'));
    expect(Number(await onScreen(page, 'what-if-tethered').getAttribute('data-score'))).toBeLessThan(now);
    expect(Number(await onScreen(page, 'what-if-all').getAttribute('data-score'))).toBeLessThan(now);
    await page.screenshot({ path: artifactPath('calculator.png') });

    // Reload while still offline: everything is still on the phone.
    const waitingBefore = await readTable<{ entity: string; action: string }>(page, 'outbox');
    await page.goto(inspectionUrl);
    await page.reload();
    await onScreen(page, 'inspection-page').waitFor();
    expect(await onScreen(page, 'online-status').first().getAttribute('data-online')).toBe('false');
    await onScreen(page, 'tab-findings').click();
    await expect.poll(async () => (await findingRows(page)).length).toBe(3);
    expect(await findingRows(page)).toEqual(before);

    const outbox = await readTable<{ entity: string; action: string }>(page, 'outbox');
    // The sync engine may have tried (and failed) again while offline: only its retry bookkeeping may differ.
    const changesOnly = (entries: Record<string, unknown>[]) => entries.map(({ attempts: _attempts, ...change }) => change);
    expect(changesOnly(outbox)).toEqual(changesOnly(waitingBefore));
    const tally = outbox.reduce<Record<string, number>>((all, entry) => ({ ...all, [`${entry.entity}:${entry.action}`]: (all[`${entry.entity}:${entry.action}`] ?? 0) + 1 }), {});
    expect(tally).toEqual({
      'inspection:create': 1,
      'finding:create': 3,
      'finding:state': 1,
      'photo:upload': 3,
      'control-check:put': 10,
      'inspection:finish': 1,
    });
    expect(await onScreen(page, 'outbox-count').getAttribute('data-count')).toBe(String(outbox.length));

    const photos = await readTable<{ ownerType: string; width: number; height: number; data: { blobType?: string; bufferSize?: number } }>(page, 'photos');
    expect(photos.filter((photo) => photo.ownerType === 'finding')).toHaveLength(2);
    for (const photo of photos) {
      expect(Math.max(photo.width, photo.height)).toBe(1600); // shrunk from 2400 px on the phone
      expect(photo.data.blobType ?? 'image/jpeg').toBe('image/jpeg');
    }

    // Each finding still shows its estimate, and its photo where it has one.
    let brickEnergyShown: string | null = null;
    for (const row of before) {
      await onScreen(page, 'inspection-findings').locator(`[data-finding-id="${row.id}"]`).click();
      await onScreen(page, 'finding-editor').waitFor();
      expect(await onScreen(page, 'estimate-energy').textContent()).toMatch(/ J$/);
      if (/Scaffold hammer|Brick offcut/.test(row.text)) {
        const image = onScreen(page, 'finding-photos').getByTestId('photo-thumb').locator('img');
        await expect.poll(() => image.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(1600);
      }
      if (/Scaffold hammer/.test(row.text)) expect(await onScreen(page, 'estimate-energy').textContent()).toBe(energyBefore);
      if (/Brick offcut/.test(row.text)) brickEnergyShown = await onScreen(page, 'estimate-energy').textContent();
      await page.goBack();
      await onScreen(page, 'inspection-page').waitFor();
      await onScreen(page, 'tab-findings').click();
    }

    // The brick offcut's estimate against the work gravity does over its fall, E = m·g·h (standard
    // gravity g = 9.80665 m/s², 3rd CGPM 1901): 2.3 kg from 11 m gives 248.1 J. Air drag (ICAO Doc
    // 7488 atmosphere) can only take a few percent off for a compact 2.3 kg item over 11 m, and a
    // 6 m/s wind adds at most ½·m·w² = 41 J of sideways speed (far less for a brick in 1.5 s).
    const gravityWorkJ = 2.3 * 9.80665 * 11;
    const shownJ = Number(brickEnergyShown?.replace(/[^\d.]/g, ''));
    expect(shownJ).toBeGreaterThan(gravityWorkJ * 0.9);
    expect(shownJ).toBeLessThan(gravityWorkJ + 0.5 * 2.3 * 6 ** 2);

    // Back in signal: the phone sends everything by itself, and the server holds the walk as the phone does.
    const inspectionId = new URL(inspectionUrl).pathname.split('/').at(-1)!;
    const [localWalk] = (await readTable<{ id: string; signature: string | null }>(page, 'inspections')).filter((i) => i.id === inspectionId);
    expect(localWalk?.signature).toMatch(/\S/); // the drawn path
    const phonePhotos = await photoBytes(page);
    await server.start();
    await phone.context.setOffline(false);
    await expect.poll(() => onScreen(page, 'outbox-count').getAttribute('data-count'), { timeout: 90_000 }).toBe('0');
    await expectWalkOnServer(server, inspectionId, localWalk!.signature!, phonePhotos);
    // Offline again for the rest of the file, as it was.
    await server.stop();
    await phone.context.setOffline(true);

    expect(pageErrors).toEqual([]);
  });

  it('scrolls a list of 2,000 findings with only the rows in view in the page', async () => {
    const siteId = await page.evaluate(
      () =>
        new Promise<string>((resolve, reject) => {
          const open = indexedDB.open('plummet');
          open.onerror = () => reject(open.error);
          open.onsuccess = () => {
            const tx = open.result.transaction('findings', 'readwrite');
            const store = tx.objectStore('findings');
            const all = store.getAll();
            all.onsuccess = () => {
              const template = all.result[0] as Record<string, unknown> & { siteId: string };
              for (let i = 0; i < 2000; i++) {
                store.put({ ...template, id: `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`, riskScore: (i % 25) + 1, notes: `bulk ${i}` });
              }
              tx.oncomplete = () => {
                open.result.close();
                resolve(template.siteId);
              };
            };
          };
        }),
    );
    await page.goto(`${server.url}/sites/${siteId}/findings`);
    const list = onScreen(page, 'finding-list');
    await list.waitFor();
    expect(Number(await list.locator('[role="list"]').getAttribute('aria-rowcount'))).toBeGreaterThanOrEqual(2000);
    expect(await list.getByTestId('finding-row').count()).toBeLessThan(40);
    await page.screenshot({ path: artifactPath('finding-list.png') });
    await list.evaluate((element) => element.scrollTo(0, element.scrollHeight));
    await expect.poll(() => list.getByTestId('finding-row').last().getAttribute('data-finding-id')).not.toBeNull();
    expect(await list.getByTestId('finding-row').count()).toBeLessThan(40);
  });

  it('switches to imperial units and, on sign-out, warns about unsent changes before clearing the phone', async () => {
    await page.goto(`${server.url}/settings`);
    await onScreen(page, 'settings-page').waitFor();
    const waiting = Number(await onScreen(page, 'outbox-count').getAttribute('data-count'));
    await choose(page, 'units', 'imperial');
    await expect.poll(() => onScreen(page, 'outbox-count').getAttribute('data-count')).toBe(String(waiting + 1));

    await onScreen(page, 'sign-out').click();
    // The walk reached the server before; the units change waits (with whatever else was made since).
    await expect
      .poll(() => onScreen(page, 'sign-out-warning').innerText())
      .toContain(waiting + 1 === 1 ? '1 change has not reached the server yet' : `${waiting + 1} changes have not reached the server yet`);
    await onScreen(page, 'confirm-sign-out').click();
    await onScreen(page, 'home-sign-in').waitFor();
    expect(await readTable(page, 'outbox')).toEqual([]);
    expect(await readTable(page, 'photos')).toEqual([]);
    expect(await readTable(page, 'meta')).toEqual([]);
  });
});
