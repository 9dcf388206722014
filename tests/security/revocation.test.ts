/**
 * Ending sessions across server processes: two BUILT server processes on one database. A change
 * made through one process (deactivation, role change, password reset) ends the user's access
 * tokens on the other one too, without waiting for the tokens to expire, and every refresh token
 * of the user stops working.
 */
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { newOpaqueToken } from '../../server/src/auth/opaque-token.js';
import { createTestDatabase, type TestDatabase } from '../../server/test/test-db.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

let database: TestDatabase;
let pool: pg.Pool;
let first: RunningServer;
let second: RunningServer;
let admin: string;

interface Session {
  accessToken: string;
  refreshToken: string;
  user: { id: string; role: string };
}

async function call(server: RunningServer, method: string, path: string, token?: string, body?: unknown): Promise<Response> {
  const headers: Record<string, string> = {};
  if (token) headers.authorization = `Bearer ${token}`;
  if (body !== undefined) headers['content-type'] = 'application/json';
  return fetch(`${server.url}/api${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
}

async function signIn(email: string, password = 'plummet-demo'): Promise<Session> {
  const res = await call(first, 'POST', '/auth/sign-in', undefined, { email, password });
  expect(res.status).toBe(200);
  return (await res.json()) as Session;
}

/** The first process keeps each user's state for up to its cache window: ask until it has caught up. */
async function statusOnceCaughtUp(server: RunningServer, token: string, expected: number): Promise<number> {
  const deadline = Date.now() + 10_000;
  let status = 0;
  while (Date.now() < deadline) {
    status = (await call(server, 'GET', '/users/me', token)).status;
    if (status === expected) break;
    await new Promise((r) => setTimeout(r, 200));
  }
  return status;
}

beforeAll(async () => {
  database = await createTestDatabase();
  first = await startBuiltServer({ database, seed: true, env: { LOG_LEVEL: 'warn', SESSION_CHECK_CACHE_MS: '2000' } });
  // The second process remembers nothing: what it answers comes from PostgreSQL at once.
  second = await startBuiltServer({ database, env: { LOG_LEVEL: 'warn', SESSION_CHECK_CACHE_MS: '0' } });
  pool = new pg.Pool({ connectionString: database.url, max: 2 });
  admin = (await signIn('admin@demo.test')).accessToken;
});

afterAll(async () => {
  await first?.dispose();
  await second?.dispose();
  await pool?.end();
  await database?.drop();
});

describe('ending a user’s sessions reaches every server process', () => {
  it('refuses a deactivated user’s access token on the other process, and their refresh token', async () => {
    const inspector = await signIn('inspector@demo.test');
    expect((await call(second, 'GET', '/users/me', inspector.accessToken)).status).toBe(200);
    expect((await call(first, 'PATCH', `/users/${inspector.user.id}`, admin, { active: false })).status).toBe(200);
    expect((await call(second, 'GET', '/users/me', inspector.accessToken)).status).toBe(401);
    expect((await call(first, 'GET', '/users/me', inspector.accessToken)).status).toBe(401);
    expect((await call(second, 'POST', '/auth/refresh', undefined, { refreshToken: inspector.refreshToken })).status).toBe(401);
  });

  it('refuses a token that still names the old role after a role change; a refresh brings the new role', async () => {
    const foreman = await signIn('foreman@demo.test');
    expect((await call(first, 'GET', '/users/me', foreman.accessToken)).status).toBe(200);
    expect((await call(second, 'PATCH', `/users/${foreman.user.id}`, admin, { role: 'inspector' })).status).toBe(200);
    expect((await call(second, 'GET', '/users/me', foreman.accessToken)).status).toBe(401);
    // The first process trusted its memory for at most its window, then asked PostgreSQL again.
    expect(await statusOnceCaughtUp(first, foreman.accessToken, 401)).toBe(401);
    const refreshed = await call(first, 'POST', '/auth/refresh', undefined, { refreshToken: foreman.refreshToken });
    expect(refreshed.status).toBe(200);
    const session = (await refreshed.json()) as Session;
    expect(session.user.role).toBe('inspector');
    expect((await call(second, 'GET', '/users/me', session.accessToken)).status).toBe(200);
  });

  it('ends every session of a user whose password was reset through the other process', async () => {
    const manager = await signIn('manager@demo.test');
    const { token, hash } = newOpaqueToken();
    await pool.query(
      `INSERT INTO email_tokens (kind, user_id, organisation_id, token_hash, expires_at)
       SELECT 'password-reset', $1, organisation_id, $2, now() + interval '1 hour' FROM memberships WHERE user_id = $1 LIMIT 1`,
      [manager.user.id, hash],
    );
    const confirm = await call(second, 'POST', '/auth/password-reset/confirm', undefined, { token, password: 'a-new-long-password-1' });
    expect(confirm.status).toBeLessThan(300);
    expect((await call(second, 'GET', '/users/me', manager.accessToken)).status).toBe(401);
    expect(await statusOnceCaughtUp(first, manager.accessToken, 401)).toBe(401);
    expect((await call(first, 'POST', '/auth/refresh', undefined, { refreshToken: manager.refreshToken })).status).toBe(401);
    expect((await signIn('manager@demo.test', 'a-new-long-password-1')).accessToken).toBeTruthy();
  });
});
