import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { photos } from '../db/schema/index.js';
import { insertFindingTree, organisationId, userId } from '../../test/domain-fixtures.js';
import { api } from '../../test/request.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

type Tree = Awaited<ReturnType<typeof insertFindingTree>>;
const ROLES = ['admin@demo.test', 'manager@demo.test', 'inspector@demo.test', 'foreman@demo.test'] as const;

describe('a foreman reads scaffolds, inspections and photos only within their scope, other roles the whole organisation', () => {
  let t: TestApp;
  const token: Record<string, string> = {};
  let mine: Tree;
  let assigned: Tree;
  let elsewhere: Tree;
  const photoOn: Record<'mine' | 'assigned' | 'elsewhere', string> = { mine: '', assigned: '', elsewhere: '' };

  async function insertPhoto(org: string, findingId: string, uploadedBy: string): Promise<string> {
    const id = randomUUID();
    await t.drizzle.insert(photos).values({
      id, organisationId: org, ownerType: 'finding', ownerId: findingId, contentHash: id, sizeBytes: 1,
      mediaType: 'image/jpeg', storageKey: `photos/${id}`, thumbnailKey: `thumbs/${id}`, uploadedBy,
    });
    return id;
  }

  beforeAll(async () => {
    t = await startTestApp();
    for (const email of ROLES) token[email] = await t.tokenFor(email);
    const org = await organisationId(t.drizzle, 'harrow-span');
    const inspectorId = await userId(t.drizzle, 'inspector@demo.test');
    const foremanId = await userId(t.drizzle, 'foreman@demo.test');
    // Looked after by the foreman; another foreman's scaffold with a finding assigned to them; one outside.
    mine = await insertFindingTree(t.drizzle, { organisationId: org, inspectorId, foremanId });
    assigned = await insertFindingTree(t.drizzle, { organisationId: org, inspectorId });
    await t.drizzle.execute(sql`UPDATE findings SET assignee_id = ${foremanId} WHERE id = ${assigned.finding.id}`);
    elsewhere = await insertFindingTree(t.drizzle, { organisationId: org, inspectorId });
    photoOn.mine = await insertPhoto(org, mine.finding.id, inspectorId);
    photoOn.assigned = await insertPhoto(org, assigned.finding.id, inspectorId);
    photoOn.elsewhere = await insertPhoto(org, elsewhere.finding.id, inspectorId);
  });
  afterAll(async () => {
    await t?.close();
  });

  const ids = async (who: string, path: string): Promise<string[]> => {
    const res = await api(t.baseUrl, 'GET', path, { token: token[who] });
    expect(res.status).toBe(200);
    return (res.body as { items: { id: string }[] }).items.map((i) => i.id);
  };

  it('lists scaffolds in scope only for the foreman', async () => {
    for (const who of ROLES) {
      const listed = await ids(who, '/scaffolds?limit=200');
      expect(listed).toEqual(expect.arrayContaining([mine.scaffold.id, assigned.scaffold.id]));
      if (who === 'foreman@demo.test') expect(listed).not.toContain(elsewhere.scaffold.id);
      else expect(listed).toContain(elsewhere.scaffold.id);
    }
  });

  it('answers 404 to the foreman for a scaffold or inspection outside the scope, 200 to everyone else', async () => {
    for (const who of ROLES) {
      const outside = who === 'foreman@demo.test' ? 404 : 200;
      expect((await api(t.baseUrl, 'GET', `/scaffolds/${mine.scaffold.id}`, { token: token[who] })).status).toBe(200);
      expect((await api(t.baseUrl, 'GET', `/scaffolds/${assigned.scaffold.id}`, { token: token[who] })).status).toBe(200);
      expect((await api(t.baseUrl, 'GET', `/scaffolds/${elsewhere.scaffold.id}`, { token: token[who] })).status).toBe(outside);
      expect((await api(t.baseUrl, 'GET', `/inspections/${mine.inspection.id}`, { token: token[who] })).status).toBe(200);
      expect((await api(t.baseUrl, 'GET', `/inspections/${elsewhere.inspection.id}`, { token: token[who] })).status).toBe(outside);
    }
  });

  it('lists inspections of scaffolds in scope only for the foreman', async () => {
    for (const who of ROLES) {
      const listed = await ids(who, '/inspections?limit=200');
      expect(listed).toEqual(expect.arrayContaining([mine.inspection.id, assigned.inspection.id]));
      if (who === 'foreman@demo.test') expect(listed).not.toContain(elsewhere.inspection.id);
      else expect(listed).toContain(elsewhere.inspection.id);
    }
  });

  it('lists photos of records in scope only for the foreman, and refuses the image of one outside', async () => {
    for (const who of ROLES) {
      for (const [tree, key] of [[mine, 'mine'], [assigned, 'assigned'], [elsewhere, 'elsewhere']] as const) {
        const listed = await ids(who, `/photos?ownerType=finding&ownerId=${tree.finding.id}`);
        const hidden = who === 'foreman@demo.test' && key === 'elsewhere';
        expect(listed).toEqual(hidden ? [] : [photoOn[key]]);
      }
    }
    const res = await api(t.baseUrl, 'GET', `/photos/${photoOn.elsewhere}`, { token: token['foreman@demo.test'] });
    expect(res.status).toBe(404);
  });
});
