import argon2 from 'argon2';
import { ARGON2_OPTIONS } from '../auth/password-hasher.js';
import { sql } from 'drizzle-orm';
import type { Db } from '../db/db.tokens.js';
import { memberships, organisations, users } from '../db/schema/index.js';
import { upsertBuiltinCatalogue } from '../catalogue/catalogue-builtins.js';
import { DEMO_ORGANISATIONS, DEMO_PASSWORD, DEMO_USERS } from './demo-data.js';
import { seedDemoRecords } from './seed-demo-records.js';

/** Idempotent: running it again leaves one copy of everything and keeps other data. */
export async function seedDemo(db: Db): Promise<{ users: number }> {
  // Demo accounts share one published password: only where development or tests were asked for.
  if (process.env.NODE_ENV !== 'development' && process.env.NODE_ENV !== 'test') {
    throw new Error(`Refusing to seed demo data unless NODE_ENV is development or test (it is ${process.env.NODE_ENV ?? 'unset'}).`);
  }
  const passwordHash = await argon2.hash(DEMO_PASSWORD, ARGON2_OPTIONS);
  await db.transaction(async (tx) => {
    const orgIds = new Map<string, string>();
    for (const org of DEMO_ORGANISATIONS) {
      const [row] = await tx
        .insert(organisations)
        .values(org)
        .onConflictDoUpdate({ target: organisations.slug, set: { name: sql`excluded.name` } })
        .returning({ id: organisations.id });
      orgIds.set(org.slug, row.id);
    }
    const userIds = new Map<string, string>();
    for (const u of DEMO_USERS) {
      const [row] = await tx
        .insert(users)
        .values({ email: u.email, name: u.name, position: u.position, passwordHash })
        .onConflictDoUpdate({ target: users.email, set: { name: u.name, position: u.position, active: true } })
        .returning({ id: users.id });
      userIds.set(u.email, row.id);
      await tx
        .insert(memberships)
        .values({ userId: row.id, organisationId: orgIds.get(u.org)!, role: u.role })
        .onConflictDoUpdate({ target: [memberships.userId, memberships.organisationId], set: { role: u.role } });
    }
    await upsertBuiltinCatalogue(tx);
    await seedDemoRecords(tx, { orgIds, userIds });
  });
  return { users: DEMO_USERS.length };
}
