import argon2 from 'argon2';
import { ARGON2_OPTIONS } from '../src/auth/password-hasher.js';
import { eq } from 'drizzle-orm';
import type { Role } from '@plummet/shared';
import type { Db } from '../src/db/db.tokens.js';
import { memberships, organisations, users } from '../src/db/schema/index.js';

/** Every role in both demo organisations: the four demo.test sign-ins plus these in the other one. */
export const ALL_ROLE_USERS: { email: string; role: Role; org: 'demo' | 'other' }[] = [
  { email: 'admin@demo.test', role: 'admin', org: 'demo' },
  { email: 'manager@demo.test', role: 'manager', org: 'demo' },
  { email: 'inspector@demo.test', role: 'inspector', org: 'demo' },
  { email: 'foreman@demo.test', role: 'foreman', org: 'demo' },
  { email: 'admin@other.test', role: 'admin', org: 'other' },
  { email: 'manager@other.test', role: 'manager', org: 'other' },
  { email: 'inspector@other.test', role: 'inspector', org: 'other' },
  { email: 'foreman@other.test', role: 'foreman', org: 'other' },
];

/** Adds admin, inspector and foreman sign-ins to the second demo organisation (tests only). */
export async function addOtherOrgRoles(db: Db): Promise<void> {
  const [other] = await db.select().from(organisations).where(eq(organisations.slug, 'other-build'));
  if (!other) throw new Error('seed the demo first');
  const passwordHash = await argon2.hash('plummet-demo', ARGON2_OPTIONS);
  for (const u of ALL_ROLE_USERS.filter((x) => x.org === 'other' && x.role !== 'manager')) {
    const [row] = await db
      .insert(users)
      .values({ email: u.email, name: `Other ${u.role}`, passwordHash })
      .onConflictDoUpdate({ target: users.email, set: { active: true } })
      .returning({ id: users.id });
    await db.insert(memberships).values({ userId: row.id, organisationId: other.id, role: u.role }).onConflictDoNothing();
  }
}
