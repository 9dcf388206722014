import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifactPath, launchPhone } from '../support/browser.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

describe('the app shell on a phone with no signal', () => {
  let server: RunningServer;
  let phone: Awaited<ReturnType<typeof launchPhone>>;

  beforeAll(async () => {
    server = await startBuiltServer({ seed: false });
    phone = await launchPhone();
  });
  afterAll(async () => {
    await phone?.close();
    await server?.dispose();
  });

  it('still renders in Open Sans after the server stops and the phone goes offline', async () => {
    const page = await phone.context.newPage();
    await page.goto(server.url);
    await page.getByTestId('app-shell').waitFor();
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 30_000 });

    await server.stop();
    await phone.context.setOffline(true);
    await page.reload();

    await page.getByTestId('app-shell').waitFor();
    await expect(page.getByTestId('caution').textContent()).resolves.toMatch(/competent person/);
    await page.evaluate(() => document.fonts.ready);
    const fontOk = await page.evaluate(() => document.fonts.check('16px "Open Sans"'));
    expect(fontOk).toBe(true);
    // check() is also true when no face matches at all, so also require a loaded Open Sans face.
    const loadedFaces = await page.evaluate(() =>
      [...document.fonts].filter((f) => f.family.replace(/["']/g, '') === 'Open Sans' && f.status === 'loaded').length,
    );
    expect(loadedFaces).toBeGreaterThan(0);
    const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
    expect(family).toMatch(/Open Sans/);
    await page.screenshot({ path: artifactPath('offline-shell.png') });
  });
});
