import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, photos } from '../db/schema/index.js';
import {
  insertControlCheck,
  insertFindingTree,
  insertFix,
  insertVerification,
  organisationId,
  userId,
} from '../../test/domain-fixtures.js';
import { addOtherOrgRoles } from '../../test/fixtures.js';
import { json } from '../../test/http.js';
import { noiseJpeg } from '../../test/images.js';
import { getWithToken, photoForm, postPhoto } from '../../test/photo-requests.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';
import { startTestObjectStore, type TestObjectStore } from '../../test/test-object-store.js';

describe('who may upload, read and delete photos (two organisations, every role)', () => {
  let t: TestApp;
  let store: TestObjectStore;
  const token: Record<string, string> = {};
  const ids: Record<string, string> = {};
  let ours: Awaited<ReturnType<typeof insertFindingTree>>;
  let theirs: Awaited<ReturnType<typeof insertFindingTree>>;

  const upload = async (who: string, ownerType: string, ownerId: string, bytes?: Buffer, id = randomUUID()) =>
    postPhoto(t.baseUrl, token[who], photoForm({ id, ownerType, ownerId }, { bytes: bytes ?? (await noiseJpeg()) }));
  const get = (who: string, path: string) => getWithToken(t.baseUrl, token[who], path);
  const del = (who: string, id: string) =>
    fetch(`${t.baseUrl}/api/photos/${id}`, { method: 'DELETE', headers: { authorization: `Bearer ${token[who]}` } });

  beforeAll(async () => {
    store = await startTestObjectStore();
    t = await startTestApp({ env: store.env });
    await addOtherOrgRoles(t.drizzle);
    for (const email of ['admin@demo.test', 'manager@demo.test', 'inspector@demo.test', 'foreman@demo.test', 'inspector@other.test', 'manager@other.test', 'foreman@other.test']) {
      token[email] = await t.tokenFor(email);
      ids[email] = await userId(t.drizzle, email);
    }
    const org = await organisationId(t.drizzle, 'harrow-span');
    ours = await insertFindingTree(t.drizzle, { organisationId: org, inspectorId: ids['inspector@demo.test'], foremanId: ids['foreman@demo.test'] });
    theirs = await insertFindingTree(t.drizzle, { organisationId: await organisationId(t.drizzle, 'other-build'), inspectorId: ids['inspector@other.test'] });
  });
  afterAll(async () => {
    await t?.close();
    await store?.close();
  });

  it('shows a photo, its thumbnail and its owner’s list to every role of the organisation', async () => {
    const photo = await json(await upload('inspector@demo.test', 'finding', ours.finding.id));
    for (const who of ['admin@demo.test', 'manager@demo.test', 'inspector@demo.test', 'foreman@demo.test']) {
      expect((await get(who, photo.url)).status).toBe(200);
      expect((await get(who, photo.thumbnailUrl)).status).toBe(200);
      const list = await get(who, `/api/photos?ownerType=finding&ownerId=${ours.finding.id}`);
      expect((await json(list)).items.map((p: { id: string }) => p.id)).toContain(photo.id);
    }
  });

  it('answers 404 to every role of another organisation: read, thumbnail, list, upload, delete', async () => {
    const photo = await json(await upload('inspector@demo.test', 'finding', ours.finding.id));
    for (const who of ['inspector@other.test', 'manager@other.test', 'foreman@other.test']) {
      expect((await get(who, photo.url)).status).toBe(404);
      expect((await get(who, photo.thumbnailUrl)).status).toBe(404);
      expect((await get(who, `/api/photos?ownerType=finding&ownerId=${ours.finding.id}`)).status).toBe(404);
      expect((await del(who, photo.id)).status).toBe(404);
    }
    const id = randomUUID();
    const res = await upload('manager@other.test', 'finding', ours.finding.id, undefined, id);
    expect(res.status).toBe(404);
    expect((await json(res)).code).toBe('NOT_FOUND');
    expect(await t.drizzle.select().from(photos).where(eq(photos.id, id))).toEqual([]);
  });

  it('lets inspectors attach photos to control checks and verifications', async () => {
    const check = await insertControlCheck(t.drizzle, { organisationId: ours.finding.organisationId, inspectionId: ours.inspection.id });
    const verification = await insertVerification(t.drizzle, {
      organisationId: ours.finding.organisationId,
      findingId: ours.finding.id,
      verifiedBy: ids['inspector@demo.test'],
    });
    expect((await upload('inspector@demo.test', 'control-check', check.id)).status).toBe(201);
    expect((await upload('inspector@demo.test', 'verification', verification.id)).status).toBe(201);
  });

  it('refuses a foreman a photo on a finding with 403', async () => {
    const res = await upload('foreman@demo.test', 'finding', ours.finding.id);
    expect(res.status).toBe(403);
    expect((await json(res)).code).toBe('FORBIDDEN');
  });

  it('lets a foreman add proof to a fix on their scaffold, but not to a fix that is not theirs', async () => {
    const org = ours.finding.organisationId;
    const onTheirScaffold = await insertFix(t.drizzle, { organisationId: org, findingId: ours.finding.id, fixedBy: ids['manager@demo.test'] });
    expect((await upload('foreman@demo.test', 'fix', onTheirScaffold.id)).status).toBe(201);

    const elsewhere = await insertFindingTree(t.drizzle, { organisationId: org, inspectorId: ids['inspector@demo.test'] });
    const notTheirs = await insertFix(t.drizzle, { organisationId: org, findingId: elsewhere.finding.id, fixedBy: ids['manager@demo.test'] });
    expect((await upload('foreman@demo.test', 'fix', notTheirs.id)).status).toBe(403);
    expect((await upload('inspector@demo.test', 'fix', notTheirs.id)).status).toBe(403);
    expect((await upload('manager@demo.test', 'fix', notTheirs.id)).status).toBe(201);
  });

  it('lets the uploader and managers delete, refuses others with 403, and records the deletion', async () => {
    const first = await json(await upload('inspector@demo.test', 'finding', ours.finding.id));
    expect((await del('foreman@demo.test', first.id)).status).toBe(403);
    expect((await del('inspector@demo.test', first.id)).status).toBe(204);
    expect((await get('inspector@demo.test', first.url)).status).toBe(404);
    const audits = await t.drizzle.select().from(auditEvents).where(eq(auditEvents.entityId, first.id));
    expect(audits.map((a) => a.action).sort()).toEqual(['create', 'delete']);

    const second = await json(await upload('inspector@demo.test', 'finding', ours.finding.id));
    expect((await del('manager@demo.test', second.id)).status).toBe(204);
    expect((await del('manager@demo.test', second.id)).status).toBe(404);
  });

  it('removes the object only when the last row of any organisation that shares its content is deleted', async () => {
    const jpeg = await noiseJpeg();
    const a = await json(await upload('inspector@demo.test', 'finding', ours.finding.id, jpeg));
    const b = await json(await upload('inspector@demo.test', 'finding', ours.finding.id, jpeg));
    const c = await json(await upload('inspector@other.test', 'finding', theirs.finding.id, jpeg));
    expect(new Set([a.contentHash, b.contentHash, c.contentHash]).size).toBe(1);
    const keys = [`photos/${a.contentHash}.jpg`, `thumbs/${a.contentHash}.jpg`];
    const stored = async () => (await store.listKeys()).filter((k) => keys.includes(k));

    expect((await del('inspector@demo.test', a.id)).status).toBe(204);
    expect((await del('inspector@demo.test', b.id)).status).toBe(204);
    expect(await stored()).toEqual(keys);
    expect((await get('inspector@other.test', c.url)).status).toBe(200);

    expect((await del('inspector@other.test', c.id)).status).toBe(204);
    expect(await stored()).toEqual([]);
  });

  it('stores the same content again after its object was removed', async () => {
    const jpeg = await noiseJpeg();
    const first = await json(await upload('inspector@demo.test', 'finding', ours.finding.id, jpeg));
    expect((await del('inspector@demo.test', first.id)).status).toBe(204);
    const again = await json(await upload('inspector@demo.test', 'finding', ours.finding.id, jpeg));
    expect(again.contentHash).toBe(first.contentHash);
    expect((await get('inspector@demo.test', again.url)).status).toBe(200);
  });
});
