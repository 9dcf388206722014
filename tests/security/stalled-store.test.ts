/**
 * A stalled object store: it accepts connections and never answers. Photo uploads wait on it (and
 * then fail with 503), but they hold no database connection while they wait, so every other route
 * keeps answering, and the health route reports the store as degraded.
 */
import { randomUUID } from 'node:crypto';
import { createServer, type Server, type Socket } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../../server/test/data-api.js';
import { noiseJpeg } from '../../server/test/images.js';
import { photoForm, postPhoto } from '../../server/test/photo-requests.js';
import { freePort, type RunningServer, startBuiltServer } from '../support/server.js';

let stalled: Server;
const sockets: Socket[] = [];
let server: RunningServer;
let token: string;

beforeAll(async () => {
  const port = await freePort();
  stalled = createServer((socket) => {
    sockets.push(socket);
    socket.on('error', () => undefined);
  });
  await new Promise<void>((ok) => stalled.listen(port, '127.0.0.1', ok));
  // A pool of two connections: if uploads held connections while waiting, nothing else could run.
  server = await startBuiltServer({
    env: {
      LOG_LEVEL: 'fatal',
      S3_ENDPOINT: `http://127.0.0.1:${port}`,
      S3_REQUEST_TIMEOUT_MS: '4000',
      DATABASE_POOL_MAX: '2',
    },
  });
  const res = await fetch(`${server.url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'inspector@demo.test', password: 'plummet-demo' }),
  });
  token = ((await res.json()) as { accessToken: string }).accessToken;
});

afterAll(async () => {
  await server?.dispose();
  for (const s of sockets) s.destroy();
  await new Promise((ok) => stalled?.close(ok));
});

describe('a stalled object store', () => {
  it('keeps every other route answering while uploads wait on it, and the uploads end with 503', async () => {
    const image = await noiseJpeg(320, 240);
    const connectionsBefore = sockets.length;
    const uploads = [0, 1, 2].map(() =>
      postPhoto(server.url, token, photoForm({ id: randomUUID(), ownerType: 'finding', ownerId: DEMO.demoFindings[0] }, { bytes: image })),
    );
    // Wait until the uploads are talking to the store (they have reached the point of waiting).
    while (sockets.length < connectionsBefore + 3) await new Promise((r) => setTimeout(r, 50));

    for (let n = 0; n < 5; n++) {
      const list = await fetch(`${server.url}/api/findings?limit=5`, { headers: { authorization: `Bearer ${token}` } });
      expect(list.status).toBe(200);
    }
    const health = await fetch(`${server.url}/api/health`);
    expect(health.status).toBe(200);
    expect(await health.json()).toEqual({ status: 'degraded', db: 'ok', store: 'unavailable' });

    const answers = await Promise.all(uploads);
    for (const answer of answers) {
      expect(answer.status).toBe(503);
      expect(((await answer.json()) as { code: string }).code).toBe('SERVICE_UNAVAILABLE');
    }
  });
});
