import argon2 from 'argon2';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { PasswordHasher } from './password-hasher.js';

/** `$argon2id$v=19$m=65536,t=3,p=4$…`: the part that decides how long a verification takes. */
const costOf = (hash: string) => hash.split('$').slice(1, 4).join('$');

describe('PasswordHasher', () => {
  afterEach(() => vi.restoreAllMocks());

  it('hashes with argon2id and verifies only the right password', async () => {
    const hasher = new PasswordHasher();
    const hash = await hasher.hash('correct horse battery');
    expect(hash.startsWith('$argon2id$')).toBe(true);
    expect(await hasher.verify(hash, 'correct horse battery')).toBe(true);
    expect(await hasher.verify(hash, 'wrong horse battery')).toBe(false);
  });

  it('answers false for a malformed stored hash instead of failing', async () => {
    expect(await new PasswordHasher().verify('not-a-hash', 'anything')).toBe(false);
  });

  it('verifies against a dummy hash of the same cost when there is no hash, so the answer takes as long', async () => {
    const hasher = new PasswordHasher();
    const real = await hasher.hash('some password');
    const verify = vi.spyOn(argon2, 'verify');
    expect(await hasher.verify(null, 'some password')).toBe(false);
    expect(verify).toHaveBeenCalledTimes(1);
    const dummy = verify.mock.calls[0][0];
    expect(dummy).not.toBe(real);
    expect(costOf(dummy)).toBe(costOf(real));
  });
});
