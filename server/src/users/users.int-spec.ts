import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, users } from '../db/schema/index.js';
import { addOtherOrgRoles, ALL_ROLE_USERS } from '../../test/fixtures.js';
import { useMailFake, type MailFake } from '../../test/mail-fake.js';
import { accountTablesDigest, api } from '../../test/request.js';
import { signIn } from '../../test/sign-in.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

describe('users: profile, members and roles against the real PostgreSQL', () => {
  let t: TestApp;
  let mail: MailFake;
  let admin: string;
  const ids: Record<string, string> = {};
  const call = (method: string, path: string, token: string, body?: unknown) => api(t.baseUrl, method, path, { token, body });

  beforeAll(async () => {
    mail = await useMailFake();
    t = await startTestApp({ env: mail.env });
    await addOtherOrgRoles(t.drizzle);
    for (const row of await t.drizzle.select({ id: users.id, email: users.email }).from(users)) ids[row.email] = row.id;
    admin = await t.tokenFor('admin@demo.test');
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  describe('every route of users and mail, tried by every role of both organisations', () => {
    for (const u of ALL_ROLE_USERS) {
      const isAdmin = u.role === 'admin';
      const ownForeman = u.org === 'demo' ? 'foreman@demo.test' : 'foreman@other.test';
      const otherForeman = u.org === 'demo' ? 'foreman@other.test' : 'foreman@demo.test';

      it(`answers ${u.role} of the ${u.org} organisation as its role allows`, async () => {
        const token = await t.tokenFor(u.email);
        const me = await call('GET', '/users/me', token);
        expect(me.status).toBe(200);
        expect(me.body).toMatchObject({ email: u.email, role: u.role });
        expect((await call('PATCH', '/users/me', token, { position: `Tested ${u.role}` })).status).toBe(200);

        const list = await call('GET', '/users', token);
        expect(list.status).toBe(isAdmin ? 200 : 403);
        if (isAdmin) {
          const domain = u.org === 'demo' ? '@demo.test' : '@other.test';
          expect(list.body.items.length).toBeGreaterThan(0);
          for (const m of list.body.items) expect(m.email.endsWith(domain)).toBe(true);
        } else expect(list.body.code).toBe('FORBIDDEN');

        const foremen = await call('GET', '/users/foremen', token);
        expect(foremen.status).toBe(u.role === 'foreman' ? 403 : 200);
        if (u.role !== 'foreman') {
          expect(foremen.body.items.map((f: { id: string }) => f.id)).toContain(ids[ownForeman]);
          expect(foremen.body.items.map((f: { id: string }) => f.id)).not.toContain(ids[otherForeman]);
          expect(foremen.body.items[0]).toEqual({ id: expect.any(String), name: expect.any(String), position: expect.any(String), phone: null });
        }

        const invite = await call('POST', '/users/invitations', token, { email: `matrix.${u.role}.${u.org}@${u.org}.test`, name: 'Matrix Person', role: 'inspector' });
        expect(invite.status).toBe(isAdmin ? 201 : 403);

        const own = await call('PATCH', `/users/${ids[ownForeman]}`, token, { role: 'foreman' });
        expect(own.status).toBe(isAdmin ? 200 : 403);
        const across = await call('PATCH', `/users/${ids[otherForeman]}`, token, { role: 'foreman' });
        expect(across.status).toBe(isAdmin ? 404 : 403);
        expect(across.body.code).toBe(isAdmin ? 'NOT_FOUND' : 'FORBIDDEN');

        expect((await call('GET', '/mail', token)).status).toBe(isAdmin ? 200 : 403);
        expect((await call('GET', '/mail/no-such-message.eml', token)).status).toBe(isAdmin ? 404 : 403);
      });
    }

    it('answers 401 on every route without an access token', async () => {
      for (const [method, path] of [['GET', '/users/me'], ['PATCH', '/users/me'], ['GET', '/users'], ['GET', '/users/foremen'], ['POST', '/users/invitations'], ['PATCH', `/users/${ids['foreman@demo.test']}`], ['GET', '/mail'], ['GET', '/mail/x.eml']]) {
        const res = await api(t.baseUrl, method, path, { body: method === 'GET' ? undefined : {} });
        expect(res.status, `${method} ${path}`).toBe(401);
      }
    });
  });

  it('updates the caller’s name, position and units, and records it in the audit trail', async () => {
    const token = await t.tokenFor('inspector@demo.test');
    const res = await call('PATCH', '/users/me', token, { name: '  Aileen Marsh-Hale ', position: 'Lead inspector', units: 'imperial' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ name: 'Aileen Marsh-Hale', position: 'Lead inspector', units: 'imperial' });
    expect((await call('GET', '/users/me', token)).body.units).toBe('imperial');
    const events = await t.drizzle
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, ids['inspector@demo.test']), eq(auditEvents.action, 'profile-updated')));
    expect(events.at(-1)?.after).toMatchObject({ name: 'Aileen Marsh-Hale', units: 'imperial' });
  });

  it('keeps the wind unit apart from the display units and refuses a unit it does not know', async () => {
    const token = await t.tokenFor('inspector@demo.test');
    const res = await call('PATCH', '/users/me', token, { windUnits: 'mph' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ windUnits: 'mph' });
    expect((await call('GET', '/users/me', token)).body.windUnits).toBe('mph');
    const wrong = await call('PATCH', '/users/me', token, { windUnits: 'knots' });
    expect(wrong.status).toBe(400);
    expect((await call('GET', '/users/me', token)).body.windUnits).toBe('mph');
  });

  it('lists members a page at a time, by name, filtered by role', async () => {
    const first = await call('GET', '/users?limit=2', admin);
    expect(first.status).toBe(200);
    expect(first.body.items).toHaveLength(2);
    expect(first.body.nextCursor).toEqual(expect.any(String));
    const seen = [...first.body.items];
    let cursor: string | null = first.body.nextCursor;
    while (cursor) {
      const page = await call('GET', `/users?limit=2&cursor=${encodeURIComponent(cursor)}`, admin);
      expect(page.status).toBe(200);
      seen.push(...page.body.items);
      cursor = page.body.nextCursor;
    }
    const all = (await call('GET', '/users?limit=200', admin)).body.items;
    expect(seen.map((m) => m.id)).toEqual(all.map((m: { id: string }) => m.id));
    expect(new Set(seen.map((m) => m.id)).size).toBe(seen.length);
    const foremen = await call('GET', '/users?role=foreman', admin);
    expect(foremen.body.items.map((m: { email: string }) => m.email)).toEqual(['foreman@demo.test']);
    expect(foremen.body.items[0]).toEqual({
      id: ids['foreman@demo.test'],
      email: 'foreman@demo.test',
      name: 'Dev Castellano',
      position: expect.any(String),
      role: 'foreman',
      active: true,
      invitationPending: false,
      createdAt: expect.any(String),
    });
  });

  it('changes a member’s role, which takes effect at their next refresh', async () => {
    const session = await signIn(t.baseUrl, 'foreman@demo.test');
    const res = await call('PATCH', `/users/${ids['foreman@demo.test']}`, admin, { role: 'manager' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('manager');
    const refreshed = await api(t.baseUrl, 'POST', '/auth/refresh', { body: { refreshToken: session.refreshToken } });
    expect(refreshed.body.user.role).toBe('manager');
    expect((await call('GET', '/users', refreshed.body.accessToken)).status).toBe(403);
    await call('PATCH', `/users/${ids['foreman@demo.test']}`, admin, { role: 'foreman' });
  });

  it('deactivates a member: they can neither sign in nor refresh, until reactivated', async () => {
    const session = await signIn(t.baseUrl, 'manager@demo.test');
    const off = await call('PATCH', `/users/${ids['manager@demo.test']}`, admin, { active: false });
    expect(off.status).toBe(200);
    expect(off.body.active).toBe(false);
    expect((await api(t.baseUrl, 'POST', '/auth/refresh', { body: { refreshToken: session.refreshToken } })).status).toBe(401);
    await expect(signIn(t.baseUrl, 'manager@demo.test')).rejects.toThrow(/401/);
    expect((await call('PATCH', `/users/${ids['manager@demo.test']}`, admin, { active: true })).status).toBe(200);
    expect((await signIn(t.baseUrl, 'manager@demo.test')).user.role).toBe('manager');
  });

  it('does not let an admin demote or deactivate themselves', async () => {
    const before = await accountTablesDigest(t.drizzle);
    for (const body of [{ role: 'manager' }, { active: false }]) {
      const res = await call('PATCH', `/users/${ids['admin@demo.test']}`, admin, body);
      expect(res.status).toBe(403);
      expect(res.body.code).toBe('FORBIDDEN');
    }
    expect(await accountTablesDigest(t.drizzle)).toEqual(before);
  });

  it('answers 404 for an unknown id, a malformed id and another organisation’s member', async () => {
    for (const id of ['00000000-0000-4000-8000-000000000000', 'not-a-uuid', ids['manager@other.test']]) {
      const res = await call('PATCH', `/users/${id}`, admin, { role: 'inspector' });
      expect(res.status, id).toBe(404);
      expect(res.body.code).toBe('NOT_FOUND');
    }
  });

  describe('bad input answers 400 with a code and changes nothing', () => {
    const long = 'x'.repeat(201);
    const cases: [string, string, unknown[]][] = [
      ['PATCH', '/users/me', [{}, { units: 'metric' }, { name: '' }, { name: long }, { position: long }, { name: 5 }, { email: 'me@demo.test' }]],
      ['POST', '/users/invitations', [{}, { email: 'bad', name: 'A', role: 'inspector' }, { email: 'a@demo.test', name: long, role: 'inspector' }, { email: 'a@demo.test', name: 'A' }, { email: 'a@demo.test', name: 'A', role: 'owner' }, { email: `${'e'.repeat(260)}@demo.test`, name: 'A', role: 'inspector' }]],
      ['PATCH', '/users/FOREMAN', [{}, { role: 'owner' }, { active: 'yes' }, { role: 'admin', extra: 1 }]],
    ];
    for (const [method, template, bodies] of cases) {
      it(`on ${method} ${template}`, async () => {
        const path = template.replace('FOREMAN', ids['foreman@demo.test']);
        const before = await accountTablesDigest(t.drizzle);
        const malformed = await api(t.baseUrl, method, path, { token: admin, body: '{"name": ' });
        expect(malformed.status).toBe(400);
        expect(malformed.body.code).toBe('INVALID_JSON');
        for (const body of bodies) {
          const res = await call(method, path, admin, body);
          expect(res.status, JSON.stringify(body)).toBe(400);
          expect(res.body.code).toBe('VALIDATION_FAILED');
        }
        expect(await accountTablesDigest(t.drizzle)).toEqual(before);
      });
    }

    it('on GET /users with a bad limit, sort or cursor', async () => {
      for (const query of ['limit=0', 'limit=abc', 'limit=1000', 'sort=passwordHash', 'role=owner', 'cursor=garbage']) {
        const res = await call('GET', `/users?${query}`, admin);
        expect(res.status, query).toBe(400);
        expect(res.body.code).toBe('VALIDATION_FAILED');
      }
    });
  });
});
