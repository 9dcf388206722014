import { describe, expect, it } from 'vitest';
import { describeSignInError, signIn } from './auth.api';

function answering(status: number, body?: unknown): typeof fetch {
  return async () => new Response(body === undefined ? null : JSON.stringify(body), { status });
}

const credentials = { email: 'inspector@demo.test', password: 'plummet-demo' };

async function failureOf(fetchImpl: typeof fetch): Promise<string> {
  try {
    await signIn(credentials, fetchImpl);
  } catch (error) {
    return describeSignInError(error);
  }
  throw new Error('sign-in unexpectedly succeeded');
}

describe('signIn', () => {
  it('posts the credentials as JSON to /api/auth/sign-in', async () => {
    const calls: [string, RequestInit | undefined][] = [];
    const fetchImpl: typeof fetch = async (input, init) => {
      calls.push([String(input), init]);
      return new Response(JSON.stringify({ ok: true }), { status: 200 });
    };
    await expect(signIn(credentials, fetchImpl)).resolves.toEqual({ ok: true });
    expect(calls[0]?.[0]).toBe('/api/auth/sign-in');
    expect(calls[0]?.[1]?.method).toBe('POST');
    expect(JSON.parse(String(calls[0]?.[1]?.body))).toEqual(credentials);
  });

  it('says sign-in is not available yet when the server has no such route', async () => {
    expect(await failureOf(answering(404, { code: 'NOT_FOUND', message: 'Cannot POST' }))).toBe(
      'Sign-in is not available on this server yet.',
    );
  });

  it('says there is no connection when no answer comes', async () => {
    const offline: typeof fetch = async () => {
      throw new TypeError('Failed to fetch');
    };
    expect(await failureOf(offline)).toMatch(/^No connection to the Plummet server/);
  });

  it('says there is no connection when a gateway cannot reach the server', async () => {
    expect(await failureOf(answering(502))).toMatch(/^No connection to the Plummet server/);
  });

  it('shows the server message for other refusals', async () => {
    expect(await failureOf(answering(400, { code: 'VALIDATION', message: 'Email is not valid.' }))).toBe('Email is not valid.');
  });
});
