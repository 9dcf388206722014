import { randomBytes } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import argon2 from 'argon2';

/**
 * argon2id with the OWASP Password Storage Cheat Sheet's first configuration (m = 19 MiB, t = 2,
 * p = 1): recommended strength at a cost a 2-core replica can afford per sign-in.
 */
export const ARGON2_OPTIONS = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;
const OPTIONS = ARGON2_OPTIONS;

/** argon2id hashing; verification costs the same whether or not there is a real hash to check. */
@Injectable()
export class PasswordHasher {
  private dummyHash?: Promise<string>;

  hash(password: string): Promise<string> {
    return argon2.hash(password, OPTIONS);
  }

  /**
   * True when `password` matches `hash`. With no hash (unknown e-mail, invitation not accepted)
   * it verifies against a throwaway hash with the same parameters, so the answer takes as long.
   */
  async verify(hash: string | null, password: string): Promise<boolean> {
    if (!hash) {
      this.dummyHash ??= argon2.hash(randomBytes(16).toString('hex'), OPTIONS);
      await argon2.verify(await this.dummyHash, password).catch(() => false);
      return false;
    }
    return argon2.verify(hash, password).catch(() => false);
  }
}
