import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifactPath, launchPhone } from '../support/browser.js';
import { onScreen, typeInto } from '../support/phone-page.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

describe('a first visit to /sign-in (the page drawn at build time)', () => {
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

  it('has the form in its HTML, says what is wrong, then signs in and opens the app on the home', async () => {
    const html = await (await phone.context.request.get(`${server.url}/sign-in`, { headers: { accept: 'text/html' } })).text();
    expect(html).toContain('data-testid="sign-in-email"');
    expect(html).toContain('data-testid="sign-in-submit"');

    const page = await phone.context.newPage();
    const scripts: string[] = [];
    page.on('request', (request) => {
      if (request.resourceType() === 'script') scripts.push(new URL(request.url()).pathname);
    });
    await page.goto(`${server.url}/sign-in`);
    const submit = onScreen(page, 'sign-in-submit');
    await expect.poll(() => submit.isEnabled()).toBe(true);
    // Neither React's renderer nor Ionic is fetched for the form.
    expect(scripts.some((path) => /start-app|dist-/.test(path))).toBe(false);

    await submit.click();
    await expect.poll(() => onScreen(page, 'sign-in-error').textContent()).toBe('Enter your email and password.');

    await typeInto(page, 'sign-in-email', 'inspector@demo.test');
    await typeInto(page, 'sign-in-password', 'not-the-password');
    await submit.click();
    await expect.poll(() => onScreen(page, 'sign-in-error').textContent(), { timeout: 15_000 }).toMatch(/do not match an account/);
    await page.screenshot({ path: artifactPath('sign-in-page-error.png') });

    await typeInto(page, 'sign-in-password', 'plummet-demo');
    await submit.click();
    await page.waitForURL((url) => url.pathname === '/', { timeout: 30_000 });
    await expect.poll(() => onScreen(page, 'session-expiry').textContent(), { timeout: 30_000 }).toMatch(/Works offline until/);
    await onScreen(page, 'site-list').waitFor();
    await page.close();
  });

  it('goes back to the welcome in the app from its back button', async () => {
    const page = await phone.context.newPage();
    await page.goto(`${server.url}/sign-in`);
    await page.getByRole('button', { name: 'Back' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await onScreen(page, 'app-shell').waitFor();
    await page.close();
  });
});
