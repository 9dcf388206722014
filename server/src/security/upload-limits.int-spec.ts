import { randomUUID } from 'node:crypto';
import { request } from 'node:http';
import { crc32, deflateSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { photos } from '../db/schema/index.js';
import { DEMO } from '../../test/data-api.js';
import { noiseJpeg } from '../../test/images.js';
import { photoForm, postPhoto } from '../../test/photo-requests.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

function chunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/** A PNG of a few kilobytes that claims 20 000 × 20 000 pixels (400 MP, 1.2 GB decoded). */
function decompressionBombPng(): Buffer {
  const side = 20_000;
  const header = Buffer.alloc(13);
  header.writeUInt32BE(side, 0);
  header.writeUInt32BE(side, 4);
  header.set([8, 2, 0, 0, 0], 8); // 8-bit RGB, deflate, no interlace
  const rows = deflateSync(Buffer.alloc((side * 3 + 1) * 8)); // the first rows; the rest would follow
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', header), chunk('IDAT', rows), chunk('IEND', Buffer.alloc(0))]);
}

describe('uploads are bounded in decoded size and in how many run at once', () => {
  let t: TestApp;
  let token: string;
  const owner = () => ({ id: randomUUID(), ownerType: 'finding', ownerId: DEMO.demoFindings[0] });

  beforeAll(async () => {
    t = await startTestApp({ env: { MAX_CONCURRENT_UPLOADS: '1' } });
    token = await t.tokenFor('inspector@demo.test');
  });
  afterAll(async () => {
    await t?.close();
  });

  it('refuses a decompression bomb with 413 IMAGE_TOO_LARGE before decoding it, and stores nothing', async () => {
    const bomb = decompressionBombPng();
    expect(bomb.length).toBeLessThan(50_000);
    const before = await t.drizzle.select().from(photos);
    const res = await postPhoto(t.baseUrl, token, photoForm(owner(), { bytes: bomb, name: 'bomb.png', type: 'image/png' }));
    expect(res.status).toBe(413);
    expect(((await res.json()) as { code: string }).code).toBe('IMAGE_TOO_LARGE');
    expect(await t.drizzle.select().from(photos)).toHaveLength(before.length);
  });

  it('answers 503 UPLOADS_BUSY with Retry-After while every upload slot is taken, and frees the slot afterwards', { timeout: 60_000 }, async () => {
    // An upload whose body is still arriving holds the only slot.
    const { port } = new URL(t.baseUrl);
    const slow = request({
      host: '127.0.0.1',
      port: Number(port),
      method: 'POST',
      path: '/api/photos',
      headers: { authorization: `Bearer ${token}`, 'content-type': 'multipart/form-data; boundary=slow', 'transfer-encoding': 'chunked' },
    });
    const slowDone = new Promise<number>((ok) => {
      slow.on('response', (res) => {
        res.resume();
        ok(res.statusCode ?? 0);
      });
      slow.on('error', () => ok(0));
    });
    slow.write('--slow\r\nContent-Disposition: form-data; name="id"\r\n\r\n');
    const small = await noiseJpeg(64, 48);
    let slowEnded: number | undefined;
    void slowDone.then((status) => (slowEnded = status));
    // Until the slow request has reached the server, an upload may still find the slot free (on a
    // loaded machine that can take seconds). If the slow request was answered, say so: it holds nothing.
    let busy = await postPhoto(t.baseUrl, token, photoForm(owner(), { bytes: small }));
    const deadline = Date.now() + 15_000;
    while (busy.status !== 503 && slowEnded === undefined && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 100));
      busy = await postPhoto(t.baseUrl, token, photoForm(owner(), { bytes: small }));
    }
    expect(slowEnded, 'the slow upload was answered before the slot could be seen taken').toBeUndefined();
    expect(busy.status).toBe(503);
    expect(((await busy.json()) as { code: string }).code).toBe('UPLOADS_BUSY');
    expect(Number(busy.headers.get('retry-after'))).toBeGreaterThan(0);

    slow.end('--slow--\r\n');
    expect(await slowDone).toBe(400);
    const after = await postPhoto(t.baseUrl, token, photoForm(owner(), { bytes: await noiseJpeg(64, 48) }));
    expect(after.status).toBe(201);
  });
});
