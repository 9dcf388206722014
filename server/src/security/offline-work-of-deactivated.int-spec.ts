import { randomUUID } from 'node:crypto';
import { JwtService } from '@nestjs/jwt';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, users } from '../db/schema/index.js';
import { ENDED_SESSION_ACTION } from '../sync/ended-session-pushes.js';
import { DEMO, findingBody } from '../../test/data-api.js';
import { api } from '../../test/request.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

/** An inspector deactivated while walking a site offline: the hazards they recorded are kept. */
describe('work recorded offline by someone deactivated meanwhile', () => {
  let t: TestApp;
  let inspectorId: string;
  let token: string;
  let expired: string;

  beforeAll(async () => {
    t = await startTestApp();
    [{ id: inspectorId }] = await t.drizzle.select({ id: users.id }).from(users).where(eq(users.email, 'inspector@demo.test'));
    token = await t.tokenFor('inspector@demo.test');
    const claims = new JwtService().decode<{ sub: string; org: string; role: string; ver: number }>(token);
    expired = await t.app.get(JwtService).signAsync({ sub: claims.sub, org: claims.org, role: claims.role, ver: claims.ver }, { expiresIn: -60 });
    const admin = await t.tokenFor('admin@demo.test');
    expect((await api(t.baseUrl, 'PATCH', `/users/${inspectorId}`, { token: admin, body: { active: false } })).status).toBe(200);
  });
  afterAll(async () => {
    await t?.close();
  });

  const push = (bearer: string, id: string) => {
    const body = findingBody(DEMO.foremansScaffold, { id });
    return api(t.baseUrl, 'POST', '/sync/push', {
      token: bearer,
      body: { clientId: randomUUID(), mutations: [{ id: 1, entity: 'finding', entityId: id, action: 'create', baseVersion: 0, payload: body }] },
    });
  };

  it('applies the push, even with a token that expired meanwhile, and flags each record for a manager', async () => {
    for (const bearer of [token, expired]) {
      const id = randomUUID();
      const res = await push(bearer, id);
      expect(res.status).toBe(200);
      expect(res.body.results[0].outcome).toBe('applied');
      const flags = await t.drizzle
        .select()
        .from(auditEvents)
        .where(and(eq(auditEvents.entityId, id), eq(auditEvents.action, ENDED_SESSION_ACTION)));
      expect(flags).toHaveLength(1);
      expect(flags[0].actorId).toBe(inspectorId);
    }
  });

  it('opens nothing else to the deactivated member: no pull, no lists', async () => {
    expect((await api(t.baseUrl, 'GET', '/sync/pull', { token })).status).toBe(401);
    expect((await api(t.baseUrl, 'GET', '/findings', { token })).status).toBe(401);
  });

  it('still refuses a push with a token of a member who is active (they refresh instead)', async () => {
    const other = await t.tokenFor('manager@demo.test');
    const claims = new JwtService().decode<{ sub: string; org: string; role: string; ver: number }>(other);
    const stale = await t.app.get(JwtService).signAsync({ sub: claims.sub, org: claims.org, role: claims.role, ver: claims.ver }, { expiresIn: -60 });
    expect((await push(stale, randomUUID())).status).toBe(401);
  });
});
