import type { PhotoOwnerType } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import type { PhotoOwnerRow } from './photos.repository.js';

/**
 * Who may attach a photo to what (the owner is already known to be in the caller's organisation):
 * - managers and admins: anything;
 * - inspectors: findings, control checks and verifications of any inspection of the
 *   organisation (inspections are often shared), and fixes they recorded themselves;
 * - foremen: only fixes, and only of findings assigned to them, on a scaffold they are the
 *   foreman of, or recorded by them (the proof photo of their own work).
 */
export function mayAttachPhoto(user: AuthUser, ownerType: PhotoOwnerType, owner: PhotoOwnerRow): boolean {
  if (user.role === 'manager' || user.role === 'admin') return true;
  if (ownerType === 'fix') {
    const people = owner.fixPeople;
    if (!people) return false;
    if (people.fixedBy === user.userId) return true;
    return user.role === 'foreman' && (people.assigneeId === user.userId || people.scaffoldForemanId === user.userId);
  }
  return user.role === 'inspector';
}

/** The uploader may take back their own photo; managers and admins may remove any. */
export function mayDeletePhoto(user: AuthUser, uploadedBy: string): boolean {
  return uploadedBy === user.userId || user.role === 'manager' || user.role === 'admin';
}

/** Organisation settings are jsonb: only an explicit `true` keeps the GPS position. */
export function keepsPhotoLocation(settings: unknown): boolean {
  return typeof settings === 'object' && settings !== null && (settings as { keepPhotoLocation?: unknown }).keepPhotoLocation === true;
}
