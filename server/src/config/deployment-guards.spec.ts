import { describe, expect, it } from 'vitest';
import { loadConfig } from './config.js';
import { DEVELOPMENT_JWT_SECRET } from './deployment-guards.js';

const DB = { DATABASE_URL: 'postgres://app@127.0.0.1:5432/plummet' };
const STRONG_SECRET = 'q8Zr1vN3kLp0sX7bT2mW9yF4hJ6dC5aE+uGiOoRn/Q=';
const PRODUCTION = {
  ...DB,
  MIGRATION_DATABASE_URL: 'postgres://owner@127.0.0.1:5432/plummet',
  NODE_ENV: 'production',
  HOST: '0.0.0.0',
  JWT_SECRET: STRONG_SECRET,
  PUBLIC_URL: 'https://plummet.example.org',
  SMTP_HOST: 'smtp.example.org',
  MAIL_FROM: 'Plummet <no-reply@example.org>',
  S3_BUCKET: 'plummet-photos',
  S3_ACCESS_KEY_ID: 'AKIAEXAMPLEEXAMPLE',
  S3_SECRET_ACCESS_KEY: 'example-secret-access-key',
};

describe('the server refuses configurations that would let a stranger sign tokens', () => {
  it('treats an unset NODE_ENV as production and then demands a secret', () => {
    expect(() => loadConfig({ ...DB })).toThrow(/JWT_SECRET/);
  });

  it('refuses the development secret on a public interface even in development', () => {
    expect(() => loadConfig({ ...DB, NODE_ENV: 'development', HOST: '0.0.0.0' })).toThrow(/JWT_SECRET/);
  });

  it('refuses the development secret written out explicitly in production', () => {
    expect(() => loadConfig({ ...PRODUCTION, JWT_SECRET: DEVELOPMENT_JWT_SECRET })).toThrow(/JWT_SECRET/);
  });

  it('refuses a short or typed-by-hand secret in production', () => {
    expect(() => loadConfig({ ...PRODUCTION, JWT_SECRET: 'short-secret-but-16+' })).toThrow(/JWT_SECRET/);
    expect(() => loadConfig({ ...PRODUCTION, JWT_SECRET: 'a'.repeat(40) })).toThrow(/JWT_SECRET/);
  });

  it('accepts the development secret on loopback when development or test is asked for', () => {
    for (const NODE_ENV of ['development', 'test']) {
      for (const HOST of ['127.0.0.1', '::1', 'localhost']) {
        expect(loadConfig({ ...DB, NODE_ENV, HOST }).JWT_SECRET).toBe(DEVELOPMENT_JWT_SECRET);
      }
    }
  });

  it('demands PUBLIC_URL and real mail and storage settings in production', () => {
    expect(loadConfig(PRODUCTION).NODE_ENV).toBe('production');
    for (const name of ['MIGRATION_DATABASE_URL', 'PUBLIC_URL', 'SMTP_HOST', 'MAIL_FROM', 'S3_BUCKET', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'] as const) {
      const env: Record<string, string | undefined> = { ...PRODUCTION };
      delete env[name];
      expect(() => loadConfig(env), name).toThrow(new RegExp(name));
    }
  });

  it('refuses one role for migrations and requests in production (row-level security would not bind it)', () => {
    expect(() => loadConfig({ ...PRODUCTION, MIGRATION_DATABASE_URL: PRODUCTION.DATABASE_URL })).toThrow(/MIGRATION_DATABASE_URL/);
  });

  it("refuses the local storage fake's keys in production", () => {
    expect(() => loadConfig({ ...PRODUCTION, S3_ACCESS_KEY_ID: 'S3RVER', S3_SECRET_ACCESS_KEY: 'S3RVER' })).toThrow(/fake/);
  });
});
