import { describe, expect, it } from 'vitest';
import type { AuthUser } from '../auth/auth.types.js';
import { keepsPhotoLocation, mayAttachPhoto, mayDeletePhoto } from './photo-access.js';

const as = (role: AuthUser['role'], userId = 'me'): AuthUser => ({ userId, organisationId: 'org', role });
const finding = { id: 'f' };
const fixBy = (people: Partial<{ fixedBy: string; assigneeId: string | null; scaffoldForemanId: string | null }>) => ({
  id: 'x',
  fixPeople: { fixedBy: 'someone', assigneeId: null, scaffoldForemanId: null, ...people },
});

describe('mayAttachPhoto', () => {
  it('lets inspectors, managers and admins attach to findings, control checks and verifications', () => {
    for (const role of ['inspector', 'manager', 'admin'] as const) {
      for (const type of ['finding', 'control-check', 'verification'] as const) expect(mayAttachPhoto(as(role), type, finding)).toBe(true);
    }
  });

  it('keeps foremen to fixes', () => {
    for (const type of ['finding', 'control-check', 'verification'] as const) expect(mayAttachPhoto(as('foreman'), type, finding)).toBe(false);
  });

  it('lets a foreman attach to a fix assigned to them, on their scaffold, or recorded by them, and no other', () => {
    expect(mayAttachPhoto(as('foreman'), 'fix', fixBy({ assigneeId: 'me' }))).toBe(true);
    expect(mayAttachPhoto(as('foreman'), 'fix', fixBy({ scaffoldForemanId: 'me' }))).toBe(true);
    expect(mayAttachPhoto(as('foreman'), 'fix', fixBy({ fixedBy: 'me' }))).toBe(true);
    expect(mayAttachPhoto(as('foreman'), 'fix', fixBy({ assigneeId: 'other', scaffoldForemanId: 'other' }))).toBe(false);
  });

  it('lets an inspector attach to a fix only when they recorded it', () => {
    expect(mayAttachPhoto(as('inspector'), 'fix', fixBy({ fixedBy: 'me' }))).toBe(true);
    expect(mayAttachPhoto(as('inspector'), 'fix', fixBy({ assigneeId: 'me' }))).toBe(false);
  });

  it('lets managers and admins attach to any fix', () => {
    expect(mayAttachPhoto(as('manager'), 'fix', fixBy({}))).toBe(true);
    expect(mayAttachPhoto(as('admin'), 'fix', fixBy({}))).toBe(true);
  });
});

describe('mayDeletePhoto', () => {
  it('lets the uploader, managers and admins delete, and nobody else', () => {
    expect(mayDeletePhoto(as('foreman'), 'me')).toBe(true);
    expect(mayDeletePhoto(as('inspector'), 'someone')).toBe(false);
    expect(mayDeletePhoto(as('foreman'), 'someone')).toBe(false);
    expect(mayDeletePhoto(as('manager'), 'someone')).toBe(true);
    expect(mayDeletePhoto(as('admin'), 'someone')).toBe(true);
  });
});

describe('keepsPhotoLocation', () => {
  it('keeps the location only for an explicit true', () => {
    expect(keepsPhotoLocation({ keepPhotoLocation: true })).toBe(true);
    expect(keepsPhotoLocation({ keepPhotoLocation: 'true' })).toBe(false);
    expect(keepsPhotoLocation({})).toBe(false);
    expect(keepsPhotoLocation(null)).toBe(false);
  });
});
