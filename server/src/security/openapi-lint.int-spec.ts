import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../../test/test-app.js';

const run = promisify(execFile);
const REDOCLY = resolve(import.meta.dirname, '../../../node_modules/.bin/redocly');

describe('the OpenAPI document', () => {
  let t: TestApp;
  let dir: string;
  let doc: { openapi: string; paths: Record<string, Record<string, { summary?: string; responses?: Record<string, unknown> }>> };
  beforeAll(async () => {
    t = await startTestApp({ seed: false });
    dir = mkdtempSync(join(tmpdir(), 'plummet-openapi-'));
    doc = (await (await fetch(`${t.baseUrl}/api/docs/openapi.json`)).json()) as typeof doc;
  });
  afterAll(async () => {
    await t?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('declares OpenAPI 3.1 and gives every operation a summary and its error answers', () => {
    expect(doc.openapi).toBe('3.1.0');
    for (const [path, item] of Object.entries(doc.paths)) {
      for (const [method, op] of Object.entries(item)) {
        expect(op.summary, `${method} ${path}`).toBeTruthy();
        expect(Object.keys(op.responses ?? {}).some((s) => s.startsWith('4')), `${method} ${path}`).toBe(true);
      }
    }
  });

  it('passes redocly lint with the recommended rules, without an error', async () => {
    const file = join(dir, 'openapi.json');
    writeFileSync(file, JSON.stringify(doc));
    const result = await run(REDOCLY, ['lint', file, '--extends=recommended', '--format=stylish'], { env: { ...process.env, REDOCLY_TELEMETRY: 'off', REDOCLY_SUPPRESS_UPDATE_NOTICE: 'true' } }).catch(
      (error: { code?: number; stdout?: string; stderr?: string }) => ({ stdout: error.stdout ?? '', stderr: error.stderr ?? '', failed: true }),
    );
    expect('failed' in result ? `${result.stdout}\n${result.stderr}` : '').toBe('');
  }, 120_000);
});
