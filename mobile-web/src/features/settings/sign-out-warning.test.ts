import { describe, expect, it } from 'vitest';
import { signOutWarning } from './sign-out-warning';

describe('the sign-out warning', () => {
  it('counts the changes that would be lost', () => {
    expect(signOutWarning(3)).toMatchObject({ header: '3 changes not sent', confirm: 'Delete them and sign out' });
    expect(signOutWarning(1).message).toMatch(/^1 change has not reached the server yet/);
    expect(signOutWarning(0).header).toBe('Sign out?');
  });
});
