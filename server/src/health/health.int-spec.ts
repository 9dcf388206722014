import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../../test/test-app.js';
import { json } from '../../test/http.js';

describe('GET /api/health against the real PostgreSQL', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ seed: false });
  });
  afterAll(async () => {
    await t?.close();
  });

  it('answers 200 with status ok and db ok while PostgreSQL answers', async () => {
    const res = await fetch(`${t.baseUrl}/api/health`);
    expect(res.status).toBe(200);
    expect(await json(res)).toEqual({ status: 'ok', db: 'ok', store: 'ok' });
  });

  it('sends security headers', async () => {
    const res = await fetch(`${t.baseUrl}/api/health`);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('content-security-policy')).toContain("default-src 'self'");
    expect(res.headers.get('x-powered-by')).toBeNull();
  });

  it('answers an unknown API route with a 404 error body and no stack', async () => {
    const res = await fetch(`${t.baseUrl}/api/no-such-route`);
    expect(res.status).toBe(404);
    const body = await json(res);
    expect(body.code).toBe('NOT_FOUND');
    expect(JSON.stringify(body)).not.toMatch(/at .*\.js/);
  });

  it('answers malformed JSON with 400 INVALID_JSON', async () => {
    const res = await fetch(`${t.baseUrl}/api/health`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{"broken":',
    });
    expect(res.status).toBe(400);
    expect((await json(res)).code).toBe('INVALID_JSON');
  });

  it('publishes the OpenAPI document', async () => {
    const res = await fetch(`${t.baseUrl}/api/docs/openapi.json`);
    expect(res.status).toBe(200);
    const doc = await json(res);
    expect(doc.info.title).toBe('Plummet API');
    expect(Object.keys(doc.paths)).toContain('/api/health');
  });

  it('answers 503 once PostgreSQL stops answering', async () => {
    // Terminate every connection of this database and block new ones: the pool can no longer reach it.
    const pg = (await import('pg')).default;
    const admin = new pg.Client({ connectionString: t.db.url.replace(/\/[^/]+$/, '/postgres') });
    await admin.connect();
    await admin.query(`ALTER DATABASE "${t.db.name}" WITH ALLOW_CONNECTIONS false`);
    await admin.query('SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE datname = $1', [t.db.name]);
    try {
      const res = await fetch(`${t.baseUrl}/api/health`);
      expect(res.status).toBe(503);
      expect(await json(res)).toMatchObject({ status: 'error', db: 'unavailable' });
    } finally {
      await admin.query(`ALTER DATABASE "${t.db.name}" WITH ALLOW_CONNECTIONS true`);
      await admin.end();
    }
  });
});
