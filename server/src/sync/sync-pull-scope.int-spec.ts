import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogueBody, created, DEMO, type DataApi, findingBody, scaffoldBody, startDataApi, type Who } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

interface Change {
  type: string;
  record: { id: string; recordType?: string; reason?: string } & Record<string, unknown>;
}

/**
 * Every change after `cursor`, page by page, until `until` holds (the feed holds back rows while an
 * older transaction anywhere on the shared test cluster is still open).
 */
async function pullAll(who: Who, cursor?: string, until: (changes: Change[]) => boolean = () => true, query = '') {
  const changes: Change[] = [];
  const deadline = Date.now() + 10_000;
  for (;;) {
    const res = await api.call(who, 'GET', `/sync/pull?limit=200${cursor ? `&cursor=${cursor}` : ''}${query}`);
    expect(res.status).toBe(200);
    changes.push(...(res.body.changes as Change[]));
    cursor = res.body.cursor as string;
    if (res.body.hasMore) continue;
    if (until(changes) || Date.now() > deadline) return { changes, cursor };
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

const idsOf = (changes: Change[], type: string) => new Set(changes.filter((c) => c.type === type).map((c) => c.record.id));
const hasTombstone = (changes: Change[], recordType: string, id: string) =>
  changes.some((c) => c.type === 'tombstone' && c.record.recordType === recordType && c.record.id === id);

describe('the pull carries every record a phone holds, scoped per role', () => {
  it('gives a manager the sites, scaffolds, inspections, findings, own catalogue items and own profile of their organisation only', async () => {
    const item = await created(api, 'demo:admin', 'POST', '/catalogue', catalogueBody());
    const { changes } = await pullAll('demo:manager', undefined, (c) => idsOf(c, 'catalogue-item').has(item.id));
    expect(idsOf(changes, 'site')).toEqual(new Set([DEMO.quaysideSite, DEMO.fennelSite]));
    for (const id of [DEMO.foremansScaffold, DEMO.unmannedScaffold, DEMO.preShiftScaffold, DEMO.loadingBayScaffold]) expect(idsOf(changes, 'scaffold').has(id)).toBe(true);
    expect(idsOf(changes, 'scaffold').has(DEMO.otherScaffold)).toBe(false);
    expect(idsOf(changes, 'inspection').has(DEMO.finishedInspection)).toBe(true);
    for (const id of DEMO.demoFindings) expect(idsOf(changes, 'finding').has(id)).toBe(true);
    for (const id of DEMO.otherFindings) expect(idsOf(changes, 'finding').has(id)).toBe(false);
    expect(idsOf(changes, 'catalogue-item').has(item.id)).toBe(true);
    // Built-in catalogue items are in the app already; only the organisation's own travel.
    expect(changes.filter((c) => c.type === 'catalogue-item').every((c) => c.record.builtIn === false)).toBe(true);
    expect([...idsOf(changes, 'user')]).toEqual([api.userIds['demo:manager']]);
  });

  it('gives the other organisation none of the first one’s records, whatever the role', async () => {
    for (const who of ['other:manager', 'other:inspector', 'other:foreman'] as Who[]) {
      const { changes } = await pullAll(who);
      const ids = new Set(changes.map((c) => c.record.id));
      for (const id of [DEMO.quaysideSite, DEMO.fennelSite, DEMO.foremansScaffold, DEMO.unmannedScaffold, ...DEMO.demoFindings]) expect(ids.has(id)).toBe(false);
      expect([...idsOf(changes, 'user')]).toEqual([api.userIds[who]]);
    }
  });

  it('gives a foreman only the scaffolds they look after, their sites and findings, and no conflicts', async () => {
    const { changes } = await pullAll('demo:foreman');
    const scaffolds = idsOf(changes, 'scaffold');
    expect(scaffolds.has(DEMO.foremansScaffold)).toBe(true);
    expect(scaffolds.has(DEMO.unmannedScaffold)).toBe(false);
    expect(scaffolds.has(DEMO.loadingBayScaffold)).toBe(false);
    expect(changes.some((c) => c.type === 'conflict')).toBe(false);
    const findings = changes.filter((c) => c.type === 'finding');
    expect(findings.every((c) => scaffolds.has(c.record.scaffoldId as string) || c.record.assigneeId === api.userIds['demo:foreman'])).toBe(true);
  });
});

describe('tombstones', () => {
  it('a foreman assigned a finding receives it with its scaffold, and a reassignment away removes both from their phone', async () => {
    const finding = await created(api, 'demo:inspector', 'POST', '/findings', findingBody(DEMO.loadingBayScaffold, { elevation: 'West', lift: 1, bay: 1, heightM: 2 }));
    const start = await pullAll('demo:foreman');
    expect(idsOf(start.changes, 'finding').has(finding.id)).toBe(false);

    await created(api, 'demo:manager', 'POST', `/findings/${finding.id}/assign`, { assigneeId: api.userIds['demo:foreman'] });
    const assigned = await pullAll('demo:foreman', start.cursor, (c) => idsOf(c, 'finding').has(finding.id));
    expect(idsOf(assigned.changes, 'finding').has(finding.id)).toBe(true);
    expect(idsOf(assigned.changes, 'scaffold').has(DEMO.loadingBayScaffold)).toBe(true);
    expect(idsOf(assigned.changes, 'site').has(DEMO.fennelSite)).toBe(true);

    await created(api, 'demo:manager', 'POST', `/findings/${finding.id}/assign`, { assigneeId: null });
    const away = await pullAll('demo:foreman', assigned.cursor, (c) => hasTombstone(c, 'finding', finding.id));
    expect(hasTombstone(away.changes, 'finding', finding.id)).toBe(true);
    expect(hasTombstone(away.changes, 'scaffold', DEMO.loadingBayScaffold)).toBe(true);
    expect(away.changes.find((c) => c.type === 'tombstone' && c.record.id === finding.id)?.record.reason).toBe('out-of-scope');
    // Nobody else's phone is told to drop it.
    const inspector = await pullAll('demo:inspector', start.cursor);
    expect(hasTombstone(inspector.changes, 'finding', finding.id)).toBe(false);
  });

  it('an archived scaffold leaves every phone of the organisation and is no longer pulled', async () => {
    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite));
    const before = await pullAll('demo:inspector', undefined, (c) => idsOf(c, 'scaffold').has(scaffold.id));
    expect(idsOf(before.changes, 'scaffold').has(scaffold.id)).toBe(true);

    expect((await api.call('demo:inspector', 'POST', `/scaffolds/${scaffold.id}/archive`)).status).toBe(403);
    expect((await api.call('demo:manager', 'POST', `/scaffolds/${scaffold.id}/archive`)).status).toBe(200);
    expect((await api.call('demo:manager', 'POST', `/scaffolds/${scaffold.id}/archive`)).status).toBe(200);
    expect((await api.call('other:manager', 'POST', `/scaffolds/${scaffold.id}/archive`)).status).toBe(404);

    const after = await pullAll('demo:inspector', before.cursor, (c) => hasTombstone(c, 'scaffold', scaffold.id));
    expect(after.changes.filter((c) => c.type === 'tombstone' && c.record.id === scaffold.id).map((c) => c.record.reason)).toEqual(['archived']);
    const fresh = await pullAll('demo:inspector');
    expect(idsOf(fresh.changes, 'scaffold').has(scaffold.id)).toBe(false);
    const other = await pullAll('other:inspector');
    expect(hasTombstone(other.changes, 'scaffold', scaffold.id)).toBe(false);
  });
});

describe('a first pull scoped to one site (making it available offline)', () => {
  it('gives that site with its scaffolds, inspections, checks and findings, the catalogue and the profile, and nothing of another site', async () => {
    const { changes } = await pullAll('demo:inspector', undefined, undefined, `&siteId=${DEMO.quaysideSite}`);
    expect([...idsOf(changes, 'site')]).toEqual([DEMO.quaysideSite]);
    const scaffolds = changes.filter((c) => c.type === 'scaffold');
    expect(scaffolds.every((c) => c.record.siteId === DEMO.quaysideSite)).toBe(true);
    for (const id of [DEMO.foremansScaffold, DEMO.unmannedScaffold]) expect(idsOf(changes, 'scaffold').has(id)).toBe(true);
    for (const id of [DEMO.preShiftScaffold, DEMO.loadingBayScaffold]) expect(idsOf(changes, 'scaffold').has(id)).toBe(false);
    const findings = changes.filter((c) => c.type === 'finding');
    expect(findings.length).toBeGreaterThan(0);
    expect(findings.every((c) => c.record.siteId === DEMO.quaysideSite)).toBe(true);
    const onSite = idsOf(changes, 'scaffold');
    expect(changes.filter((c) => c.type === 'inspection').every((c) => onSite.has(c.record.scaffoldId as string))).toBe(true);
    const inspections = idsOf(changes, 'inspection');
    expect(changes.filter((c) => c.type === 'control-check').every((c) => inspections.has(c.record.inspectionId as string))).toBe(true);
    const findingIds = idsOf(changes, 'finding');
    expect(changes.filter((c) => c.type === 'fix' || c.type === 'verification').every((c) => findingIds.has(c.record.findingId as string))).toBe(true);
    expect([...idsOf(changes, 'user')]).toEqual([api.userIds['demo:inspector']]);
  });

  it('gives a foreman only their part of the site, and another organisation nothing of it', async () => {
    const foreman = await pullAll('demo:foreman', undefined, undefined, `&siteId=${DEMO.fennelSite}`);
    expect(idsOf(foreman.changes, 'scaffold').has(DEMO.preShiftScaffold)).toBe(true);
    expect(idsOf(foreman.changes, 'scaffold').has(DEMO.loadingBayScaffold)).toBe(false);
    expect(idsOf(foreman.changes, 'scaffold').has(DEMO.foremansScaffold)).toBe(false);
    expect([...idsOf(foreman.changes, 'site')]).toEqual([DEMO.fennelSite]);

    const other = await pullAll('other:manager', undefined, undefined, `&siteId=${DEMO.quaysideSite}`);
    expect(other.changes.filter((c) => !['user', 'catalogue-item', 'tombstone', 'conflict'].includes(c.type))).toEqual([]);
  });

  it('refuses a site that is not an id', async () => {
    const res = await api.call('demo:inspector', 'GET', '/sync/pull?siteId=quayside');
    expect(res.status).toBe(400);
  });
});
