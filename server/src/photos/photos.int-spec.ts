import { createHash, randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, organisations, photos } from '../db/schema/index.js';
import { insertFindingTree, organisationId, userId } from '../../test/domain-fixtures.js';
import { json } from '../../test/http.js';
import { bandColour, exifGpsLatitudeRef, noiseJpeg, sidewaysJpegWithGps } from '../../test/images.js';
import { bytesOf, getWithToken, photoForm, postPhoto } from '../../test/photo-requests.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';
import { startTestObjectStore, type TestObjectStore } from '../../test/test-object-store.js';

const MAX_UPLOAD_BYTES = 1024 * 1024;

describe('photo uploads against the real PostgreSQL and the object-storage fake', () => {
  let t: TestApp;
  let store: TestObjectStore;
  let inspector: string;
  let findingId: string;
  let orgId: string;

  const upload = (fields: Record<string, string | undefined>, bytes?: Buffer, name?: string) =>
    postPhoto(t.baseUrl, inspector, photoForm(fields, bytes ? { bytes, name } : undefined));
  const rowsFor = (id: string) => t.drizzle.select().from(photos).where(eq(photos.id, id));

  beforeAll(async () => {
    store = await startTestObjectStore();
    t = await startTestApp({ env: { ...store.env, MAX_UPLOAD_BYTES: String(MAX_UPLOAD_BYTES) } });
    inspector = await t.tokenFor('inspector@demo.test');
    orgId = await organisationId(t.drizzle, 'harrow-span');
    const tree = await insertFindingTree(t.drizzle, { organisationId: orgId, inspectorId: await userId(t.drizzle, 'inspector@demo.test') });
    findingId = tree.finding.id;
  });
  afterAll(async () => {
    await t?.close();
    await store?.close();
  });

  it('stores a sideways photo upright, without its GPS position, as JPEG named by its content hash', async () => {
    const id = randomUUID();
    const res = await upload({ id, ownerType: 'finding', ownerId: findingId, takenAt: '2026-03-02T09:15:00+00:00' }, await sidewaysJpegWithGps());
    expect(res.status).toBe(201);
    const body = await json(res);
    expect(body).toMatchObject({ id, ownerType: 'finding', ownerId: findingId, mediaType: 'image/jpeg', width: 200, height: 400 });
    expect(body.takenAt).toBe('2026-03-02T09:15:00.000Z');
    expect(body.url).toBe(`/api/photos/${id}`);

    const image = await getWithToken(t.baseUrl, inspector, body.url);
    expect(image.status).toBe(200);
    expect(image.headers.get('content-type')).toBe('image/jpeg');
    expect(image.headers.get('cache-control')).toBe('private, max-age=31536000, immutable');
    expect(image.headers.get('etag')).toBe(`"${body.contentHash}"`);
    const bytes = await bytesOf(image);
    expect(createHash('sha256').update(bytes).digest('hex')).toBe(body.contentHash);
    expect(bytes.length).toBe(body.sizeBytes);
    const meta = await sharp(bytes).metadata();
    expect([meta.width, meta.height]).toEqual([200, 400]);
    expect(meta.exif).toBeUndefined();
    const top = await bandColour(bytes, 0.05, 0.45);
    expect(top.r).toBeGreaterThan(top.b);
    expect(await store.listKeys(`photos/${body.contentHash}`)).toEqual([`photos/${body.contentHash}.jpg`]);
    expect(await store.listKeys(`thumbs/${body.contentHash}`)).toEqual([`thumbs/${body.contentHash}.jpg`]);
  });

  it('keeps the GPS position when the organisation settings say keepPhotoLocation', async () => {
    await t.drizzle.update(organisations).set({ settings: { keepPhotoLocation: true } }).where(eq(organisations.id, orgId));
    try {
      const res = await upload({ id: randomUUID(), ownerType: 'finding', ownerId: findingId }, await sidewaysJpegWithGps());
      expect(res.status).toBe(201);
      const bytes = await bytesOf(await getWithToken(t.baseUrl, inspector, (await json(res)).url));
      const meta = await sharp(bytes).metadata();
      expect([meta.width, meta.height]).toEqual([200, 400]);
      expect(exifGpsLatitudeRef(meta.exif)).toBe('N');
    } finally {
      await t.drizzle.update(organisations).set({ settings: {} }).where(eq(organisations.id, orgId));
    }
  });

  it('refuses a text file renamed .jpg with 415 and stores nothing', async () => {
    const before = await store.listKeys();
    const id = randomUUID();
    const res = await upload({ id, ownerType: 'finding', ownerId: findingId }, Buffer.from('Lift 3: loose clip near bay 2\n'), 'photo.jpg');
    expect(res.status).toBe(415);
    expect((await json(res)).code).toBe('UNSUPPORTED_MEDIA_TYPE');
    expect(await rowsFor(id)).toEqual([]);
    expect(await store.listKeys()).toEqual(before);
  });

  it('answers a repeated upload of the same id with the first record: one row, one object', async () => {
    const id = randomUUID();
    const jpeg = await noiseJpeg();
    const first = await upload({ id, ownerType: 'finding', ownerId: findingId }, jpeg);
    expect(first.status).toBe(201);
    const keysAfterFirst = await store.listKeys();
    const again = await upload({ id, ownerType: 'finding', ownerId: findingId }, jpeg);
    expect(again.status).toBe(200);
    expect(await json(again)).toEqual(await json(first));
    expect(await rowsFor(id)).toHaveLength(1);
    expect(await store.listKeys()).toEqual(keysAfterFirst);
    const audits = await t.drizzle.select().from(auditEvents).where(eq(auditEvents.entityId, id));
    expect(audits.map((a) => a.action)).toEqual(['create']);
  });

  it('answers the same id attached to another owner with 409 CONFLICT', async () => {
    const id = randomUUID();
    const jpeg = await noiseJpeg();
    expect((await upload({ id, ownerType: 'finding', ownerId: findingId }, jpeg)).status).toBe(201);
    const other = await insertFindingTree(t.drizzle, { organisationId: orgId, inspectorId: await userId(t.drizzle, 'inspector@demo.test') });
    const res = await upload({ id, ownerType: 'finding', ownerId: other.finding.id }, jpeg);
    expect(res.status).toBe(409);
    expect((await json(res)).code).toBe('CONFLICT');
    expect((await rowsFor(id))[0].ownerId).toBe(findingId);
  });

  it('keeps identical bytes under two ids as two rows and ONE object, even when uploaded at once', async () => {
    const jpeg = await noiseJpeg();
    const ids = [randomUUID(), randomUUID(), randomUUID()];
    const before = await store.listKeys('photos/');
    const responses = await Promise.all(ids.map((id) => upload({ id, ownerType: 'finding', ownerId: findingId }, jpeg)));
    expect(responses.map((r) => r.status)).toEqual([201, 201, 201]);
    const hashes = new Set(await Promise.all(responses.map(async (r) => (await json(r)).contentHash)));
    expect(hashes.size).toBe(1);
    const [hash] = hashes;
    const rows = await t.drizzle.select().from(photos).where(eq(photos.contentHash, hash));
    expect(rows.map((r) => r.id).sort()).toEqual([...ids].sort());
    const after = await store.listKeys('photos/');
    expect(after.filter((k) => !before.includes(k))).toEqual([`photos/${hash}.jpg`]);
  });

  it('serves a thumbnail smaller than the photo, at most 320 px on its long edge', async () => {
    const res = await upload({ id: randomUUID(), ownerType: 'finding', ownerId: findingId }, await noiseJpeg(1200, 900));
    const body = await json(res);
    const thumb = await getWithToken(t.baseUrl, inspector, body.thumbnailUrl);
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toBe('image/jpeg');
    expect(thumb.headers.get('etag')).toBe(`"${body.contentHash}-thumbnail"`);
    const bytes = await bytesOf(thumb);
    const meta = await sharp(bytes).metadata();
    expect([meta.width, meta.height]).toEqual([320, 240]);
    expect(bytes.length).toBeLessThan(body.sizeBytes);
  });

  it('answers 304 when the client already holds the photo (If-None-Match)', async () => {
    const body = await json(await upload({ id: randomUUID(), ownerType: 'finding', ownerId: findingId }, await noiseJpeg()));
    const res = await getWithToken(t.baseUrl, inspector, body.url, { 'if-none-match': `"${body.contentHash}"` });
    expect(res.status).toBe(304);
  });

  it('lists the metadata of one owner’s photos, oldest first', async () => {
    const tree = await insertFindingTree(t.drizzle, { organisationId: orgId, inspectorId: await userId(t.drizzle, 'inspector@demo.test') });
    const ids = [randomUUID(), randomUUID()];
    for (const id of ids) await upload({ id, ownerType: 'finding', ownerId: tree.finding.id }, await noiseJpeg());
    const res = await getWithToken(t.baseUrl, inspector, `/api/photos?ownerType=finding&ownerId=${tree.finding.id}`);
    expect(res.status).toBe(200);
    expect((await json(res)).items.map((p: { id: string }) => p.id)).toEqual(ids);
  });

  it('answers 413 PAYLOAD_TOO_LARGE over MAX_UPLOAD_BYTES and stores nothing', async () => {
    const id = randomUUID();
    const huge = Buffer.concat([await noiseJpeg(), Buffer.alloc(MAX_UPLOAD_BYTES)]);
    const res = await upload({ id, ownerType: 'finding', ownerId: findingId }, huge);
    expect(res.status).toBe(413);
    const body = await json(res);
    expect(body.code).toBe('PAYLOAD_TOO_LARGE');
    expect(typeof body.message).toBe('string');
    expect(await rowsFor(id)).toEqual([]);
  });

  it.each([
    ['a missing ownerId', { ownerType: 'finding', ownerId: undefined }, 'ownerId'],
    ['an id that is not a uuid', { id: 'photo-1', ownerType: 'finding' }, 'id'],
    ['an unknown owner type', { ownerType: 'scaffold' }, 'ownerType'],
    ['a takenAt that is not a time', { ownerType: 'finding', takenAt: 'yesterday' }, 'takenAt'],
  ])('answers 400 VALIDATION_FAILED for %s', async (_name, fields, field) => {
    const res = await upload({ id: randomUUID(), ownerId: findingId, ...fields }, await noiseJpeg());
    expect(res.status).toBe(400);
    const body = await json(res);
    expect(body.code).toBe('VALIDATION_FAILED');
    expect(body.issues.map((i: { path: string[] }) => i.path[0])).toContain(field);
  });

  it('answers 400 when the file part is missing', async () => {
    const res = await upload({ id: randomUUID(), ownerType: 'finding', ownerId: findingId });
    expect(res.status).toBe(400);
    expect((await json(res)).issues[0].path).toEqual(['file']);
  });

  it('answers 400 for a second file in the same request', async () => {
    const form = photoForm({ id: randomUUID(), ownerType: 'finding', ownerId: findingId }, { bytes: await noiseJpeg() });
    form.append('file', new Blob([new Uint8Array(await noiseJpeg())], { type: 'image/jpeg' }), 'second.jpg');
    const res = await postPhoto(t.baseUrl, inspector, form);
    expect(res.status).toBe(400);
    expect((await json(res)).code).toBe('VALIDATION_FAILED');
  });

  it('answers 404 for a finding that does not exist, and 400 for a photo id that is not a uuid', async () => {
    const res = await upload({ id: randomUUID(), ownerType: 'finding', ownerId: randomUUID() }, await noiseJpeg());
    expect(res.status).toBe(404);
    expect((await json(res)).code).toBe('NOT_FOUND');
    expect((await getWithToken(t.baseUrl, inspector, `/api/photos/${randomUUID()}`)).status).toBe(404);
    expect((await getWithToken(t.baseUrl, inspector, '/api/photos/not-a-uuid')).status).toBe(400);
  });

  it('describes the photo routes in the OpenAPI document', async () => {
    const doc = await json(await fetch(`${t.baseUrl}/api/docs/openapi.json`));
    expect(Object.keys(doc.paths)).toEqual(expect.arrayContaining(['/api/photos', '/api/photos/{id}', '/api/photos/{id}/thumbnail']));
    expect(Object.keys(doc.paths['/api/photos'].post.requestBody.content)).toEqual(['multipart/form-data']);
  });

  it('answers 401 without a token', async () => {
    const res = await fetch(`${t.baseUrl}/api/photos`, { method: 'POST', body: photoForm({ id: randomUUID() }) });
    expect(res.status).toBe(401);
  });
});
