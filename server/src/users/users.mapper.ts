import type { Member, UserProfile } from '@plummet/shared';
import type { MemberRow, ProfileRow } from './users.repository.js';

/** The one mapping from profile rows to the API's UserProfile. */
export function toUserProfile(row: ProfileRow): UserProfile {
  return {
    id: row.userId,
    email: row.email,
    name: row.name,
    position: row.position,
    units: row.units,
    windUnits: row.windUnits,
    role: row.role,
    organisation: { id: row.organisationId, name: row.organisationName },
    version: row.version,
  };
}

/** The one mapping from member rows to the API's Member. */
export function toMember(row: MemberRow): Member {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    position: row.position,
    role: row.role,
    active: row.active,
    invitationPending: !row.hasPassword,
    createdAt: row.createdAt.toISOString(),
  };
}
