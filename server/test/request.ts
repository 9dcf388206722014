import { sql } from 'drizzle-orm';
import type { Db } from '../src/db/db.tokens.js';

export interface ApiAnswer {
  status: number;
  headers: Headers;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  body: any;
}

/**
 * One API call: JSON in and out. `body` as a string is sent verbatim (malformed JSON tests);
 * `token` adds a Bearer header; `headers` adds anything else (e.g. X-Forwarded-For).
 */
export async function api(
  baseUrl: string,
  method: string,
  path: string,
  options: { body?: unknown; token?: string; headers?: Record<string, string> } = {},
): Promise<ApiAnswer> {
  const headers: Record<string, string> = { ...options.headers };
  if (options.token) headers.authorization = `Bearer ${options.token}`;
  let body: string | undefined;
  if (options.body !== undefined) {
    headers['content-type'] = 'application/json';
    body = typeof options.body === 'string' ? options.body : JSON.stringify(options.body);
  }
  const res = await fetch(`${baseUrl}/api${path}`, { method, headers, body });
  const text = await res.text();
  let parsed: unknown = text;
  if ((res.headers.get('content-type') ?? '').includes('application/json') && text) parsed = JSON.parse(text);
  return { status: res.status, headers: res.headers, body: parsed };
}

const DIGEST_TABLES = ['users', 'memberships', 'refresh_tokens', 'email_tokens', 'rate_limits', 'audit_events'] as const;

/** A fingerprint of the account tables, to show that a refused request changed nothing. */
export async function accountTablesDigest(db: Db): Promise<Record<string, string>> {
  const digest: Record<string, string> = {};
  for (const table of DIGEST_TABLES) {
    const result = await db.execute<{ d: string | null }>(
      sql.raw(`SELECT md5(coalesce(string_agg(t::text, '|' ORDER BY t::text), '')) AS d FROM ${table} t`),
    );
    digest[table] = String(result.rows[0].d);
  }
  return digest;
}
