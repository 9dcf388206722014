import { Inject, Injectable } from '@nestjs/common';
import { MemberListQuerySchema, type ForemanListResponse } from '@plummet/shared';
import type { Member, MemberListQuery, MemberListResponse, MemberUpdate, UserProfile, UserProfileUpdate } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { SessionStateCache } from '../auth/session-state.cache.js';
import { SessionStateRepository } from '../auth/session-state.repository.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { toPage } from '../common/keyset.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { UserSettingsCommands } from './user-settings-commands.js';
import { toMember, toUserProfile } from './users.mapper.js';
import { UsersRepository } from './users.repository.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The caller's own profile, and admins' management of their organisation's members. */
@Injectable()
export class UsersService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly users: UsersRepository,
    private readonly sessionStates: SessionStateRepository,
    private readonly sessionCache: SessionStateCache,
    private readonly settingsCommands: UserSettingsCommands,
  ) {}

  async me(caller: AuthUser): Promise<UserProfile> {
    const row = await this.users.findProfile(caller.userId, caller.organisationId);
    if (!row) throw AppError.notFound('User');
    return toUserProfile(row);
  }

  /** Through the one settings command (user-settings-commands.ts), as a phone's push is. */
  async updateMe(caller: AuthUser, patch: UserProfileUpdate): Promise<UserProfile> {
    return this.db.transaction(async (tx) => {
      await this.settingsCommands.edit(tx, { user: caller, clientId: null, mutationId: null }, caller.userId, patch);
      const after = await this.users.findProfile(caller.userId, caller.organisationId, tx);
      if (!after) throw AppError.notFound('User');
      return toUserProfile(after);
    });
  }

  async list(caller: AuthUser, query: MemberListQuery): Promise<MemberListResponse> {
    const rows = await this.users.listMembers(caller.organisationId, query);
    return toPage(rows, query, toMember);
  }

  /**
   * The organisation's active foremen (at most 200, by name), so an inspector or manager can hand a
   * finding to one. Phone numbers are not kept yet, so `phone` is null.
   */
  async foremen(caller: AuthUser): Promise<ForemanListResponse> {
    const rows = await this.users.listMembers(caller.organisationId, MemberListQuerySchema.parse({ role: 'foreman', limit: 200 }));
    return { items: rows.filter((row) => row.active).map((row) => ({ id: row.id, name: row.name, position: row.position, phone: null })) };
  }

  /** Role and active flag of a member of the admin's own organisation; admins cannot lock themselves out. */
  async updateMember(caller: AuthUser, userId: string, patch: MemberUpdate): Promise<Member> {
    if (!UUID.test(userId)) throw AppError.notFound('User');
    const demotesSelf = patch.role !== undefined && patch.role !== 'admin';
    if (userId === caller.userId && (demotesSelf || patch.active === false)) {
      throw new AppError(ErrorCode.Forbidden, 'You cannot change your own role or deactivate yourself; ask another admin');
    }
    const member = await this.db.transaction(async (tx) => {
      const before = await this.users.findMember(caller.organisationId, userId, tx, true);
      if (!before) throw AppError.notFound('User');
      if (patch.role !== undefined) await this.users.updateRole(userId, caller.organisationId, patch.role, tx);
      if (patch.active !== undefined) await this.users.updateUser(userId, { active: patch.active }, tx);
      const after = (await this.users.findMember(caller.organisationId, userId, tx))!;
      // Neither must wait for old access tokens to expire. A deactivation ends every session; after
      // a role change the phone's next refresh brings a token with the new role.
      if (before.active && !after.active) await this.sessionStates.endAllSessions(userId, tx);
      else if (after.role !== before.role) await this.sessionStates.bumpVersion(userId, tx);
      await this.users.insertAudit(
        {
          organisationId: caller.organisationId,
          actorId: caller.userId,
          entityType: 'user',
          entityId: userId,
          action: 'member-updated',
          before: { role: before.role, active: before.active },
          after: { role: after.role, active: after.active },
        },
        tx,
      );
      return toMember(after);
    });
    this.sessionCache.forget(userId);
    return member;
  }
}
