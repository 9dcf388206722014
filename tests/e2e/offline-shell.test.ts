import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifactPath, launchPhone } from '../support/browser.js';
import { onScreen } from '../support/phone-page.js';
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

  it('registers the service worker once while the home hands over to the full app', async () => {
    const page = await phone.context.newPage();
    // Counts, in the page, every registration and every hourly timer (the app's update check).
    await page.addInitScript(() => {
      const counts = { registrations: 0, hourlyTimers: 0 };
      Object.assign(window, { serviceWorkerCounts: counts });
      const register = ServiceWorkerContainer.prototype.register;
      ServiceWorkerContainer.prototype.register = function (...args: Parameters<typeof register>) {
        counts.registrations += 1;
        return register.apply(this, args);
      };
      const setInterval = window.setInterval;
      window.setInterval = ((handler: TimerHandler, timeout?: number, ...rest: unknown[]) => {
        if (timeout === 60 * 60 * 1000) counts.hourlyTimers += 1;
        return setInterval(handler, timeout, ...rest);
      }) as typeof window.setInterval;
    });
    const counts = () => page.evaluate(() => (window as unknown as { serviceWorkerCounts: object }).serviceWorkerCounts);

    await page.goto(server.url);
    await page.getByTestId('app-shell').waitFor();
    await expect.poll(counts, { timeout: 30_000 }).toEqual({ registrations: 1, hourlyTimers: 1 });

    // Leaving the home starts the full app in the same page, with its own reload prompt.
    await onScreen(page, 'home-sign-in').click();
    await onScreen(page, 'sign-in-email').waitFor();
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 30_000 });
    // A second registration, were there one, would follow the full app's first render within moments.
    await page.waitForTimeout(1000);
    expect(await counts()).toEqual({ registrations: 1, hourlyTimers: 1 });
    await page.close();
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
