import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { readSession, saveSession } from '../features/auth/session.store';
import { dropTestDatabases, freshDb, inspector } from '../local-db/testing';
import { authorisedFetch, fetchWithAccessToken } from './authorised-fetch';

afterEach(dropTestDatabases);

function jwt(expiresInMs: number): string {
  const payload = btoa(JSON.stringify({ exp: Math.floor((Date.now() + expiresInMs) / 1000) })).replace(/=+$/, '');
  return `h.${payload}.s`;
}

const signedInAt = new Date().toISOString();
const refreshExpiresAt = new Date(Date.now() + 86_400_000).toISOString();

/** A fake API: accepts only the token validToken() names; refresh hands out a fresh one. */
function server(validToken: () => string) {
  const calls: string[] = [];
  const fetchImpl = async (input: string, init?: RequestInit) => {
    calls.push(input);
    if (input === '/api/auth/refresh') {
      return new Response(JSON.stringify({ accessToken: jwt(900_000), refreshToken: 'n'.repeat(43), user: inspector }), { status: 200 });
    }
    const auth = new Headers(init?.headers).get('Authorization');
    if (auth !== `Bearer ${validToken()}`) return new Response(JSON.stringify({ code: 'UNAUTHENTICATED', message: 'expired' }), { status: 401 });
    return new Response(JSON.stringify({ ok: true }), { status: 200 });
  };
  return { calls, fetchImpl };
}

describe('authorisedFetch', () => {
  it('sends the access token, and asks the user to sign in when there is no session', async () => {
    const database = freshDb();
    const token = jwt(900_000);
    const { fetchImpl, calls } = server(() => token);
    await expect(authorisedFetch('/sites', {}, database, fetchImpl)).rejects.toMatchObject({ status: 401, code: 'UNAUTHENTICATED' });
    await saveSession(database, { accessToken: token, refreshToken: 'r'.repeat(43), user: inspector, signedInAt, refreshExpiresAt });
    await expect(authorisedFetch('/sites', {}, database, fetchImpl)).resolves.toEqual({ ok: true });
    expect(calls).toEqual(['/api/sites']);
  });

  it('renews an expired access token first, keeping the rotated refresh token and moving the offline limit on', async () => {
    const database = freshDb();
    let current = '';
    const { fetchImpl, calls } = server(() => current);
    await saveSession(database, { accessToken: jwt(-60_000), refreshToken: 'r'.repeat(43), user: inspector, signedInAt, refreshExpiresAt });
    const tracking = async (input: string, init?: RequestInit) => {
      const response = await fetchImpl(input, init);
      if (input === '/api/auth/refresh') current = ((await response.clone().json()) as { accessToken: string }).accessToken;
      return response;
    };
    await expect(authorisedFetch('/sites', {}, database, tracking)).resolves.toEqual({ ok: true });
    expect(calls).toEqual(['/api/auth/refresh', '/api/sites']);
    const session = await readSession(database);
    expect(session?.refreshToken).toBe('n'.repeat(43));
    expect(Date.parse(session!.refreshExpiresAt)).toBeGreaterThan(Date.parse(refreshExpiresAt));
  });

  it('renews once when the server refuses a token it thought was valid, and shares one refresh between requests', async () => {
    const database = freshDb();
    let current = 'not-this-one';
    const { fetchImpl, calls } = server(() => current);
    const tracking = async (input: string, init?: RequestInit) => {
      const response = await fetchImpl(input, init);
      if (input === '/api/auth/refresh') current = ((await response.clone().json()) as { accessToken: string }).accessToken;
      return response;
    };
    await saveSession(database, { accessToken: jwt(900_000), refreshToken: 'r'.repeat(43), user: inspector, signedInAt, refreshExpiresAt });
    await Promise.all([authorisedFetch('/sites', {}, database, tracking), authorisedFetch('/catalogue', {}, database, tracking)]);
    expect(calls.filter((call) => call === '/api/auth/refresh')).toHaveLength(1);
  });
});

describe('a session the server has ended', () => {
  it('is marked as ended on the phone, so every screen asks for a new sign-in and keeps the data', async () => {
    const database = freshDb();
    await saveSession(database, { accessToken: jwt(-60_000), refreshToken: 'r'.repeat(43), user: inspector, signedInAt, refreshExpiresAt });
    const refused = async () => new Response(JSON.stringify({ code: 'UNAUTHENTICATED', message: 'The session has ended; sign in again' }), { status: 401 });
    await expect(authorisedFetch('/sites', {}, database, refused)).rejects.toMatchObject({ status: 401 });
    const session = await readSession(database);
    expect(Date.parse(session!.refreshExpiresAt)).toBeLessThanOrEqual(Date.now());
  });
});

describe('fetchWithAccessToken', () => {
  it('adds the access token to a request it did not build, and renews once on a 401', async () => {
    const database = freshDb();
    let current = jwt(900_000);
    const { fetchImpl, calls } = server(() => current);
    await saveSession(database, { accessToken: jwt(900_000), refreshToken: 'r'.repeat(43), user: inspector, signedInAt, refreshExpiresAt });
    const tracking = async (input: string, init?: RequestInit) => {
      const response = await fetchImpl(input, init);
      if (input === '/api/auth/refresh') current = ((await response.clone().json()) as { accessToken: string }).accessToken;
      return response;
    };
    current = 'something-else';
    const response = await fetchWithAccessToken(database, tracking)('/api/sync/pull', { method: 'GET', headers: { Accept: 'application/json' } });
    expect(response.status).toBe(200);
    expect(calls).toEqual(['/api/sync/pull', '/api/auth/refresh', '/api/sync/pull']);
  });
});
