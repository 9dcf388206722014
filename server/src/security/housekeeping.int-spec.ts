import { randomUUID } from 'node:crypto';
import { and, eq, isNull, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { emailTokens, rateLimits, refreshTokens, users } from '../db/schema/index.js';
import { HousekeepingService } from '../housekeeping/housekeeping.service.js';
import { useMailFake, type MailFake } from '../../test/mail-fake.js';
import { api } from '../../test/request.js';
import { signIn } from '../../test/sign-in.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

describe('sessions and links end, and spent rows are purged', () => {
  let t: TestApp;
  let mail: MailFake;

  beforeAll(async () => {
    mail = await useMailFake();
    t = await startTestApp({ env: { ...mail.env } });
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  it('never lengthens a session by refreshing it: the new refresh token keeps the first one’s expiry', async () => {
    const session = await signIn(t.baseUrl, 'inspector@demo.test');
    const [first] = await t.drizzle.select().from(refreshTokens).where(isNull(refreshTokens.usedAt)).orderBy(sql`created_at desc`).limit(1);
    // As if the session had started 29 days ago: one day of it is left.
    const oneDayLeft = new Date(Date.now() + 86_400_000);
    await t.drizzle.update(refreshTokens).set({ expiresAt: oneDayLeft }).where(eq(refreshTokens.familyId, first.familyId));
    const refreshed = await api(t.baseUrl, 'POST', '/auth/refresh', { body: { refreshToken: session.refreshToken } });
    expect(refreshed.status).toBe(200);
    const family = await t.drizzle.select().from(refreshTokens).where(eq(refreshTokens.familyId, first.familyId));
    expect(family).toHaveLength(2);
    for (const row of family) expect(row.expiresAt.getTime()).toBe(oneDayLeft.getTime());
  });

  it('spends an earlier password-reset link when a new one is asked for', async () => {
    const [user] = await t.drizzle.select().from(users).where(eq(users.email, 'manager@demo.test'));
    for (const address of ['10.20.0.1', '10.20.0.2']) {
      const res = await api(t.baseUrl, 'POST', '/auth/password-reset', { body: { email: 'manager@demo.test' }, headers: { 'x-forwarded-for': address } });
      expect(res.status).toBe(202);
    }
    const usable = await t.drizzle
      .select()
      .from(emailTokens)
      .where(and(eq(emailTokens.userId, user.id), eq(emailTokens.kind, 'password-reset'), isNull(emailTokens.usedAt)));
    expect(usable).toHaveLength(1);
  });

  it('purges expired tokens, closed rate-limit windows and sync mutations past the retention, and nothing newer', async () => {
    const [user] = await t.drizzle.select().from(users).where(eq(users.email, 'foreman@demo.test'));
    const [membership] = (await t.drizzle.execute<{ org: string }>(sql`SELECT organisation_id AS org FROM memberships WHERE user_id = ${user.id}`)).rows;
    const hour = 3_600_000;
    const family = randomUUID();
    await t.drizzle.insert(refreshTokens).values([
      { userId: user.id, organisationId: membership.org, familyId: family, tokenHash: `old-${family}`, expiresAt: new Date(Date.now() - hour) },
      { userId: user.id, organisationId: membership.org, familyId: family, tokenHash: `live-${family}`, expiresAt: new Date(Date.now() + hour) },
    ]);
    await t.drizzle.insert(emailTokens).values([
      { kind: 'password-reset', userId: user.id, organisationId: membership.org, tokenHash: `old-link-${family}`, expiresAt: new Date(Date.now() - 48 * hour) },
      { kind: 'password-reset', userId: user.id, organisationId: membership.org, tokenHash: `live-link-${family}`, expiresAt: new Date(Date.now() + hour) },
    ]);
    await t.drizzle.insert(rateLimits).values([
      { key: `old-${family}`, count: 3, resetAt: new Date(Date.now() - 2 * hour) },
      { key: `live-${family}`, count: 3, resetAt: new Date(Date.now() + hour) },
    ]);
    const client = randomUUID();
    await t.drizzle.execute(sql`INSERT INTO sync_clients (id, user_id, organisation_id) VALUES (${client}, ${user.id}, ${membership.org})`);
    await t.drizzle.execute(sql`
      INSERT INTO sync_mutations (client_id, mutation_id, organisation_id, entity, entity_id, action, outcome, applied_at) VALUES
        (${client}, 1, ${membership.org}, 'finding', ${randomUUID()}, 'create', 'applied', now() - interval '46 days'),
        (${client}, 2, ${membership.org}, 'finding', ${randomUUID()}, 'create', 'applied', now() - interval '44 days')`);

    const counts = await t.app.get(HousekeepingService).purge();
    expect(counts.syncMutations).toBe(1);
    expect(counts.refreshTokens).toBeGreaterThanOrEqual(1);
    expect(counts.emailTokens).toBeGreaterThanOrEqual(1);
    expect(counts.rateLimits).toBeGreaterThanOrEqual(1);
    const left = async (q: ReturnType<typeof sql>) => (await t.drizzle.execute<{ n: number }>(q)).rows[0].n;
    expect(await left(sql`SELECT count(*)::int AS n FROM refresh_tokens WHERE family_id = ${family}`)).toBe(1);
    expect(await left(sql`SELECT count(*)::int AS n FROM email_tokens WHERE token_hash LIKE ${`%-link-${family}`}`)).toBe(1);
    expect(await left(sql`SELECT count(*)::int AS n FROM rate_limits WHERE key LIKE ${`%-${family}`}`)).toBe(1);
    expect(await left(sql`SELECT count(*)::int AS n FROM sync_mutations WHERE client_id = ${client}`)).toBe(1);
  });
});
