import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { type Browser, type BrowserContext, chromium } from 'playwright-core';

/** Debian's Chromium, headless, with the flags this closed network needs. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/**
 * A persistent context with a fresh profile folder: service workers and storage behave as on a
 * phone, and the folder is removed afterwards.
 */
export async function launchPhone(): Promise<{ context: BrowserContext; close(): Promise<void> }> {
  const profile = mkdtempSync(join(tmpdir(), 'plummet-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width: 390, height: 844 },
    deviceScaleFactor: 2,
    isMobile: true,
    hasTouch: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  return {
    context,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export function artifactPath(name: string): string {
  const dir = resolve(process.env.TEST_ARTIFACTS_DIR ?? 'test-artifacts');
  mkdirSync(dir, { recursive: true });
  return join(dir, name);
}
