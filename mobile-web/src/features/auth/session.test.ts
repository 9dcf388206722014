import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { listWaitingChanges } from '../../local-db/outbox';
import { dropTestDatabases, freshDb, inspector, ORG_ID, site } from '../../local-db/testing';
import { accessTokenNeedsRefresh, ASSUMED_REFRESH_LIFETIME_MS, sessionStatus } from './session';
import { sessionFromResponse } from './session-response';
import { changeUnits, changeWindUnits, readSession, saveSession, signOutLocally, startSession } from './session.store';

afterEach(dropTestDatabases);

function jwtExpiringAt(ms: number): string {
  const payload = btoa(JSON.stringify({ sub: inspector.id, exp: Math.floor(ms / 1000) })).replace(/=+$/, '');
  return `eyJhbGciOiJIUzI1NiJ9.${payload}.signature`;
}

const now = new Date('2026-03-01T08:00:00Z');
const response = { accessToken: jwtExpiringAt(now.getTime() + 900_000), refreshToken: 'r'.repeat(43), user: inspector };

describe('the session on the phone', () => {
  it('lasts offline until the refresh token would expire', () => {
    const session = sessionFromResponse(response, now);
    expect(Date.parse(session.refreshExpiresAt) - now.getTime()).toBe(ASSUMED_REFRESH_LIFETIME_MS);
    expect(sessionStatus(session, now)).toBe('active');
    expect(sessionStatus(session, new Date(now.getTime() + ASSUMED_REFRESH_LIFETIME_MS))).toBe('expired');
    expect(sessionStatus(undefined, now)).toBe('signed-out');
  });

  it('uses the expiry the server gives, when it gives one', () => {
    const session = sessionFromResponse({ ...response, refreshTokenExpiresAt: '2026-03-08T08:00:00.000Z' }, now);
    expect(session.refreshExpiresAt).toBe('2026-03-08T08:00:00.000Z');
  });

  it('renews the access token 30 s before it expires', () => {
    expect(accessTokenNeedsRefresh(jwtExpiringAt(now.getTime() + 60_000), now)).toBe(false);
    expect(accessTokenNeedsRefresh(jwtExpiringAt(now.getTime() + 20_000), now)).toBe(true);
    expect(accessTokenNeedsRefresh('not-a-jwt', now)).toBe(false);
  });

  it('is stored in the database and validated when read back', async () => {
    const database = freshDb();
    await saveSession(database, sessionFromResponse(response, now));
    expect((await readSession(database))?.user.email).toBe('inspector@demo.test');
    await database.meta.put({ key: 'session', value: { accessToken: 'x' } });
    expect(await readSession(database)).toBeUndefined();
  });

  it('changes the units locally and queues the profile change', async () => {
    const database = freshDb();
    await saveSession(database, sessionFromResponse(response, now));
    await changeUnits(database, 'imperial');
    expect((await readSession(database))?.user.units).toBe('imperial');
    expect(await listWaitingChanges(database)).toMatchObject([{ entity: 'user', action: 'update', payload: { units: 'imperial' } }]);
  });

  it('keeps wind in its own unit while the other figures stay metric', async () => {
    const database = freshDb();
    await saveSession(database, sessionFromResponse(response, now));
    await changeWindUnits(database, 'mph');
    const user = (await readSession(database))?.user;
    expect(user).toMatchObject({ units: 'si', windUnits: 'mph' });
    expect(await listWaitingChanges(database)).toMatchObject([{ entity: 'user', action: 'update', payload: { windUnits: 'mph' } }]);
  });

  it('reads back a profile saved before wind had its own unit, giving it the unit of its display units', async () => {
    const database = freshDb();
    const saved = sessionFromResponse(response, now);
    const { windUnits: _dropped, ...olderUser } = { ...saved.user, units: 'imperial' as const };
    await database.meta.put({ key: 'session', value: { ...saved, user: olderUser } });
    expect((await readSession(database))?.user).toMatchObject({ units: 'imperial', windUnits: 'mph' });
  });

  it('clears another user’s records when someone else signs in on the phone', async () => {
    const database = freshDb();
    await startSession(database, sessionFromResponse(response, now));
    await database.sites.put({ ...site, organisationId: ORG_ID });
    await startSession(database, sessionFromResponse(response, now));
    expect(await database.sites.count()).toBe(1);

    const someoneElse = { ...inspector, id: '0b000000-0000-4000-8000-000000000002' };
    await startSession(database, sessionFromResponse({ ...response, user: someoneElse }, now));
    expect(await database.sites.count()).toBe(0);
    expect((await readSession(database))?.user.id).toBe(someoneElse.id);
  });

  it('signing out clears every record, photo, waiting change and the session', async () => {
    const database = freshDb();
    await saveSession(database, sessionFromResponse(response, now));
    await changeUnits(database, 'imperial');
    await database.sites.put({ ...site, organisationId: ORG_ID });
    await signOutLocally(database);
    expect(await readSession(database)).toBeUndefined();
    expect(await database.outbox.count()).toBe(0);
    expect(await database.sites.count()).toBe(0);
  });
});
