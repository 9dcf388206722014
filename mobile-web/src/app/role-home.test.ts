import { describe, expect, it } from 'vitest';
import { homePathFor } from './role-home';

describe('the start screen of each role', () => {
  it('keeps inspectors on their sites and walks', () => expect(homePathFor('inspector')).toBe('/'));
  it('sends foremen to their fix list', () => expect(homePathFor('foreman')).toBe('/fix-list'));
  it('sends managers and admins to the overview', () => {
    expect(homePathFor('manager')).toBe('/overview');
    expect(homePathFor('admin')).toBe('/overview');
  });
});
