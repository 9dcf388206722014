import { randomUUID } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import type { MemberListQuery, Role, WindUnits } from '@plummet/shared';
import { and, asc, eq, sql } from 'drizzle-orm';
import { keyset, type SortKey } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { auditEvents, memberships, organisations, users } from '../db/schema/index.js';

const profileColumns = {
  userId: users.id,
  email: users.email,
  name: users.name,
  position: users.position,
  units: users.units,
  windUnits: users.windUnits,
  active: users.active,
  sessionVersion: users.sessionVersion,
  version: users.version,
  role: memberships.role,
  organisationId: organisations.id,
  organisationName: organisations.name,
};

const memberColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  position: users.position,
  role: memberships.role,
  active: users.active,
  hasPassword: sql<boolean>`(${users.passwordHash} IS NOT NULL)`,
  createdAt: memberships.createdAt,
};

export type ProfileRow = {
  userId: string;
  email: string;
  name: string;
  position: string;
  units: 'si' | 'imperial';
  windUnits: WindUnits;
  active: boolean;
  sessionVersion: number;
  version: number;
  role: Role;
  organisationId: string;
  organisationName: string;
};
export type SignInCandidate = ProfileRow & { passwordHash: string | null };
export type MemberRow = {
  id: string;
  email: string;
  name: string;
  position: string;
  role: Role;
  active: boolean;
  hasPassword: boolean;
  createdAt: Date;
};
export type AuditInsert = typeof auditEvents.$inferInsert;

/** Users, their memberships and the audit trail of changes to them. */
@Injectable()
export class UsersRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** The user's profile in one organisation (null when not a member of it). */
  async findProfile(userId: string, organisationId: string, ex: DbExecutor = this.db): Promise<ProfileRow | null> {
    const [row] = await ex
      .select(profileColumns)
      .from(users)
      .innerJoin(memberships, eq(memberships.userId, users.id))
      .innerJoin(organisations, eq(organisations.id, memberships.organisationId))
      .where(and(eq(users.id, userId), eq(memberships.organisationId, organisationId)));
    return row ?? null;
  }

  /**
   * The organisation sign-in opens for an e-mail (the account's first membership), looked up
   * across organisations before any is known, through a narrow function of the database
   * (auth_sign_in_organisation). Null when the e-mail is unknown or has no membership.
   */
  async signInOrganisation(email: string, ex: DbExecutor = this.db): Promise<string | null> {
    const result = await ex.execute<{ organisation: string | null }>(sql`SELECT auth_sign_in_organisation(${email})::text AS organisation`);
    return result.rows[0]?.organisation ?? null;
  }

  /** The account behind an e-mail, in its first organisation visible here; null when unknown or without membership. */
  async findSignInCandidate(email: string, ex: DbExecutor = this.db): Promise<SignInCandidate | null> {
    const [row] = await ex
      .select({ ...profileColumns, passwordHash: users.passwordHash })
      .from(users)
      .innerJoin(memberships, eq(memberships.userId, users.id))
      .innerJoin(organisations, eq(organisations.id, memberships.organisationId))
      .where(eq(users.email, email))
      .orderBy(asc(memberships.createdAt))
      .limit(1);
    return row ?? null;
  }

  async findUser(userId: string, ex: DbExecutor = this.db) {
    const [row] = await ex.select().from(users).where(eq(users.id, userId));
    return row ?? null;
  }

  async findUserByEmail(email: string, ex: DbExecutor = this.db) {
    const [row] = await ex.select().from(users).where(eq(users.email, email));
    return row ?? null;
  }

  /**
   * Inserts a user; null when the e-mail is already taken (by a concurrent request, too). No
   * RETURNING: the new account is not visible to the organisation until its membership exists.
   */
  async insertUser(values: { email: string; name: string }, ex: DbExecutor = this.db): Promise<string | null> {
    const id = randomUUID();
    // No conflict target either: naming one makes PostgreSQL check the new row against the read
    // policy too. The id is fresh, so only the unique e-mail can conflict.
    const result = await ex.insert(users).values({ id, ...values }).onConflictDoNothing();
    return result.rowCount === 1 ? id : null;
  }

  async insertMembership(values: { userId: string; organisationId: string; role: Role }, ex: DbExecutor = this.db): Promise<void> {
    await ex.insert(memberships).values(values);
  }

  async updateUser(
    userId: string,
    patch: Partial<{ name: string; position: string; units: 'si' | 'imperial'; windUnits: WindUnits; active: boolean; passwordHash: string }>,
    ex: DbExecutor = this.db,
  ): Promise<void> {
    if (Object.keys(patch).length === 0) return;
    await ex.update(users).set(patch).where(eq(users.id, userId));
  }

  async updateRole(userId: string, organisationId: string, role: Role, ex: DbExecutor = this.db): Promise<void> {
    await ex
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.userId, userId), eq(memberships.organisationId, organisationId)));
  }

  /** One member of the organisation; `forUpdate` locks the rows until the transaction ends. */
  async findMember(organisationId: string, userId: string, ex: DbExecutor = this.db, forUpdate = false): Promise<MemberRow | null> {
    const query = ex
      .select(memberColumns)
      .from(users)
      .innerJoin(memberships, eq(memberships.userId, users.id))
      .where(and(eq(memberships.organisationId, organisationId), eq(users.id, userId)));
    const [row] = forUpdate ? await query.for('update') : await query;
    return row ?? null;
  }

  /** One keyset page (see common/keyset.ts), fetched one row long to know whether more follow. */
  async listMembers(organisationId: string, query: MemberListQuery, ex: DbExecutor = this.db): Promise<(MemberRow & { sortKey: string })[]> {
    const key: SortKey =
      query.sort === 'email'
        ? { expr: users.email, cast: 'text' }
        : query.sort === 'createdAt'
          ? { expr: memberships.createdAt, cast: 'timestamptz' }
          : { expr: users.name, cast: 'text' };
    const page = keyset(key, users.id, query);
    return ex
      .select({ ...memberColumns, sortKey: page.sortKey })
      .from(users)
      .innerJoin(memberships, eq(memberships.userId, users.id))
      .where(and(eq(memberships.organisationId, organisationId), query.role ? eq(memberships.role, query.role) : undefined, page.after))
      .orderBy(...page.orderBy)
      .limit(page.fetch);
  }

  async insertAudit(event: AuditInsert, ex: DbExecutor = this.db): Promise<void> {
    await ex.insert(auditEvents).values(event);
  }
}
