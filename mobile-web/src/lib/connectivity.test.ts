import { afterEach, describe, expect, it } from 'vitest';
import { isOnline, probeServer, reportServerReachable } from './connectivity';

afterEach(() => reportServerReachable(true));

describe('connectivity', () => {
  it('counts the server as unreachable when the probe gets no answer', async () => {
    await probeServer(async () => {
      throw new TypeError('Failed to fetch');
    });
    expect(isOnline()).toBe(false);
  });

  it('counts any answer from the server as reachable, even an error status', async () => {
    reportServerReachable(false);
    await probeServer(async () => new Response('{}', { status: 503 }));
    expect(isOnline()).toBe(true);
  });

  it('counts a gateway failure as the server being unreachable', async () => {
    await probeServer(async () => new Response('Bad Gateway', { status: 502 }));
    expect(isOnline()).toBe(false);
  });
});
