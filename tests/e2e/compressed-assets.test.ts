import { existsSync, readdirSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchPhone } from '../support/browser.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

const DIST = resolve(dirname(fileURLToPath(import.meta.url)), '../../mobile-web/dist');
const IMMUTABLE = 'public, max-age=31536000, immutable';

/** Every file the build left for browsers (not the source maps, not the compressed copies). */
function builtAssets(): string[] {
  return (readdirSync(DIST, { recursive: true, withFileTypes: true }) as import('node:fs').Dirent[])
    .filter((entry) => entry.isFile())
    .map((entry) => '/' + relative(DIST, join(entry.parentPath, entry.name)).split(sep).join('/'))
    // Dot files (the build's input hash) are never served.
    .filter((path) => !/\.(map|br|gz)$/.test(path) && !path.split('/').some((part) => part.startsWith('.')));
}

const hasBrotli = (path: string) => existsSync(join(DIST, `${path}.br`));

describe('built assets over the wire', () => {
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

  it('has brotli and gzip copies of the code, styles and page, emitted by the build', () => {
    const assets = builtAssets();
    const code = assets.filter((path) => /\.(js|css|html)$/.test(path));
    expect(code.length).toBeGreaterThan(10);
    const withCopies = code.filter((path) => hasBrotli(path) && existsSync(join(DIST, `${path}.gz`)));
    // Files under 1 KiB are left as they are: compressing them saves less than the headers cost.
    expect(withCopies.length).toBeGreaterThan(code.length / 2);
    for (const path of ['/index.html', '/sw.js']) expect(withCopies).toContain(path);
  });

  it('sends brotli to a browser that accepts it and plain bytes to one that does not, varying by Accept-Encoding', async () => {
    for (const path of builtAssets()) {
      const withBr = await phone.context.request.get(server.url + path, { headers: { 'accept-encoding': 'br' } });
      expect(withBr.status(), path).toBe(200);
      const plain = await phone.context.request.get(server.url + path, { headers: { 'accept-encoding': 'identity' } });
      expect(plain.status(), path).toBe(200);
      expect(plain.headers()['content-encoding'], path).toBeUndefined();
      if (hasBrotli(path)) {
        expect(withBr.headers()['content-encoding'], path).toBe('br');
        expect(withBr.headers().vary, path).toMatch(/Accept-Encoding/i);
        expect(plain.headers().vary, path).toMatch(/Accept-Encoding/i);
        // The browser gets the same bytes either way, only the transfer differs.
        expect((await withBr.body()).equals(await plain.body()), path).toBe(true);
        expect(withBr.headers()['content-type'], path).toBe(plain.headers()['content-type']);
      } else {
        expect(withBr.headers()['content-encoding'], path).toBeUndefined();
      }
    }
  });

  it('caches hashed files for a year and makes the page, manifest and service worker revalidate', async () => {
    const assets = builtAssets();
    const hashed = assets.filter((path) => path.startsWith('/assets/'));
    expect(hashed.length).toBeGreaterThan(10);
    for (const path of hashed) {
      const res = await phone.context.request.get(server.url + path, { headers: { 'accept-encoding': 'br' } });
      expect(res.headers()['cache-control'], path).toBe(IMMUTABLE);
    }
    for (const path of ['/index.html', '/manifest.webmanifest', '/sw.js', '/sign-in']) {
      for (const encoding of ['br', 'identity']) {
        const res = await phone.context.request.get(server.url + path, { headers: { 'accept-encoding': encoding } });
        expect(res.headers()['cache-control'], `${path} (${encoding})`).toBe('no-cache');
      }
    }
  });

  it('serves the page of any app route compressed, and compresses API answers over 1 KiB only', async () => {
    const page = await phone.context.request.get(`${server.url}/sites/some-site`, { headers: { 'accept-encoding': 'br', accept: 'text/html' } });
    expect(page.headers()['content-encoding']).toBe('br');
    expect(await page.text()).toContain('<div id="root"');
    // /sign-in gets its page drawn at build time: the form is in the HTML, before any script runs.
    const signIn = await phone.context.request.get(`${server.url}/sign-in`, { headers: { 'accept-encoding': 'br', accept: 'text/html' } });
    expect(signIn.headers()['content-encoding']).toBe('br');
    expect(await signIn.text()).toContain('data-testid="sign-in-email"');
    const big = await phone.context.request.get(`${server.url}/api/docs/openapi.json`, { headers: { 'accept-encoding': 'gzip' } });
    expect(big.headers()['content-encoding']).toBe('gzip');
    expect(Object.keys(await big.json())).toContain('paths');
    const small = await phone.context.request.get(`${server.url}/api/health`, { headers: { 'accept-encoding': 'gzip' } });
    expect(small.headers()['content-encoding']).toBeUndefined();
  });

  it('loads the app in Chromium with compressed scripts and styles', async () => {
    const tab = await phone.context.newPage();
    const encodings = new Map<string, string | undefined>();
    tab.on('response', (res) => {
      if (/\.(js|css)$/.test(new URL(res.url()).pathname)) encodings.set(res.url(), res.headers()['content-encoding']);
    });
    // The app itself: /sign-in is drawn in its HTML and needs only a few small scripts.
    await tab.goto(server.url);
    await tab.getByTestId('app-shell').waitFor();
    const compressed = [...encodings.values()].filter((e) => e === 'br' || e === 'gzip');
    expect(compressed.length).toBeGreaterThan(3);
    await tab.close();
  });
});
