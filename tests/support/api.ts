/**
 * The API of a running server (tests/support/server.ts) as the browser tests call it beside the
 * phones: to sign a demo user in, to set something up as another user, or to check what reached the
 * server.
 */
import { DEMO_PASSWORD } from '../../server/src/seed/demo-data.js';

export interface ApiAnswer {
  status: number;
  /** The answer parsed as JSON; undefined when it is not JSON (a photo, an empty answer). */
  body: any;
}

/** One call to the server at `url` (without `/api`), as the holder of `token`, or signed out without one. */
export async function apiCall(url: string, method: string, path: string, token?: string, body?: unknown): Promise<ApiAnswer> {
  const res = await fetch(`${url}/api${path}`, {
    method,
    headers: {
      accept: 'application/json',
      ...(body === undefined ? {} : { 'content-type': 'application/json' }),
      ...(token ? { authorization: `Bearer ${token}` } : {}),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if ((res.headers.get('content-type') ?? '').includes('json')) return { status: res.status, body: await res.json() };
  await res.arrayBuffer(); // read to the end, so the connection is free for the next call
  return { status: res.status, body: undefined };
}

/** A demo user's access token, signed in through the API; throws, naming the answer, when refused. */
export async function apiSignIn(url: string, email: string): Promise<string> {
  const answer = await apiCall(url, 'POST', '/auth/sign-in', undefined, { email, password: DEMO_PASSWORD });
  if (answer.status !== 200) throw new Error(`Signing ${email} in answered ${answer.status}: ${JSON.stringify(answer.body)}`);
  return answer.body.accessToken as string;
}
