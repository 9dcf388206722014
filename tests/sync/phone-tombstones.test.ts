/**
 * Records leave the phone through the pull: the real client sync engine over fake-indexeddb
 * against the real server and PostgreSQL. An archived scaffold leaves every phone with its
 * findings; a foreman reassigned away from a finding loses it (and the scaffold it brought) from
 * their phone, while the inspector's phone keeps both. And a scaffold's tag set offline reaches
 * the server after reconnecting, the more restrictive tag standing against one set meanwhile.
 */
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { created, DEMO, type DataApi, findingBody, scaffoldBody, startDataApi, type Who } from '../../server/test/data-api.js';
import { loadMobile, Phone, prng } from './sync-harness.js';

let api: DataApi;
let m: Awaited<ReturnType<typeof loadMobile>>;
const opened: Phone[] = [];

beforeAll(async () => {
  m = await loadMobile();
  api = await startDataApi();
});
afterAll(async () => {
  for (const phone of opened) phone.close();
  await api?.t.close();
});

function phoneOf(who: Who): Phone {
  const phone = new Phone(m, {
    name: `tombstones-${randomUUID()}`,
    token: api.tokens[who],
    network: { servers: [api.t.baseUrl], late: [], requests: 0 },
    random: prng(7),
    pullLimit: 200,
    onResult: () => undefined,
  });
  opened.push(phone);
  return phone;
}

/**
 * Syncs until `done` holds: the feed holds back rows while an older transaction anywhere on the
 * shared test cluster is still open, so a change may need a pull or two more to arrive.
 */
async function syncUntil(phone: Phone, done: () => Promise<boolean>): Promise<void> {
  const deadline = Date.now() + 15_000;
  for (;;) {
    expect(await phone.engine.sync()).toBe('done');
    if ((await done()) || Date.now() > deadline) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

describe('records leave the phone through the pull', () => {
  it('drops an archived scaffold and its findings from an inspector’s phone after the next pull', async () => {
    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite));
    const finding = await created(api, 'demo:inspector', 'POST', '/findings', findingBody(scaffold.id));
    const phone = phoneOf('demo:inspector');
    await syncUntil(phone, async () => !!(await phone.db.findings.get(finding.id)));
    expect(await phone.db.scaffolds.get(scaffold.id)).toBeDefined();
    expect(await phone.db.findings.get(finding.id)).toBeDefined();

    expect((await api.call('demo:manager', 'POST', `/scaffolds/${scaffold.id}/archive`)).status).toBe(200);
    await syncUntil(phone, async () => !(await phone.db.scaffolds.get(scaffold.id)));
    expect(await phone.db.scaffolds.get(scaffold.id)).toBeUndefined();
    expect(await phone.db.findings.get(finding.id)).toBeUndefined();
    // The rest of the site stays.
    expect(await phone.db.sites.get(DEMO.quaysideSite)).toBeDefined();
    expect(await phone.db.scaffolds.get(DEMO.foremansScaffold)).toBeDefined();
    expect(await phone.db.outbox.count()).toBe(0);
  });

  it('drops a finding from a foreman’s phone once it is assigned to someone else, with the scaffold it brought', async () => {
    const finding = await created(api, 'demo:inspector', 'POST', '/findings', findingBody(DEMO.loadingBayScaffold, { elevation: 'West', lift: 1, bay: 3, heightM: 2 }));
    const foreman = phoneOf('demo:foreman');
    const inspector = phoneOf('demo:inspector');
    await syncUntil(foreman, async () => (await foreman.db.scaffolds.get(DEMO.foremansScaffold)) !== undefined);
    // Not theirs yet: on a scaffold without a foreman, assigned to nobody.
    expect(await foreman.db.findings.get(finding.id)).toBeUndefined();
    expect(await foreman.db.scaffolds.get(DEMO.loadingBayScaffold)).toBeUndefined();

    await created(api, 'demo:manager', 'POST', `/findings/${finding.id}/assign`, { assigneeId: api.userIds['demo:foreman'] });
    await syncUntil(foreman, async () => !!(await foreman.db.findings.get(finding.id)));
    expect(await foreman.db.findings.get(finding.id)).toMatchObject({ assigneeId: api.userIds['demo:foreman'] });
    expect(await foreman.db.scaffolds.get(DEMO.loadingBayScaffold)).toBeDefined();

    // Reassigned away (here to nobody, back to the scaffold's own care): it leaves their phone.
    await created(api, 'demo:manager', 'POST', `/findings/${finding.id}/assign`, { assigneeId: null });
    await syncUntil(foreman, async () => !(await foreman.db.findings.get(finding.id)));
    expect(await foreman.db.findings.get(finding.id)).toBeUndefined();
    expect(await foreman.db.scaffolds.get(DEMO.loadingBayScaffold)).toBeUndefined();
    // Their own scaffold stays; the inspector's phone keeps the finding and its scaffold.
    expect(await foreman.db.scaffolds.get(DEMO.foremansScaffold)).toBeDefined();
    await syncUntil(inspector, async () => !!(await inspector.db.findings.get(finding.id)));
    expect(await inspector.db.findings.get(finding.id)).toMatchObject({ assigneeId: null });
    expect(await inspector.db.scaffolds.get(DEMO.loadingBayScaffold)).toBeDefined();
  });
});

describe('a scaffold’s tag set offline', () => {
  it('reaches the server after reconnecting; against a tag set meanwhile, the more restrictive stands and the phone gets the conflict', async () => {
    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite));
    const phone = phoneOf('demo:inspector');
    await syncUntil(phone, async () => !!(await phone.db.scaffolds.get(scaffold.id)));
    expect(await phone.db.scaffolds.get(scaffold.id)).toMatchObject({ status: 'closed', version: 1 });

    phone.online = false;
    await m.changeScaffoldStatus(phone.db, scaffold.id, { status: 'limited', note: 'Lifts 1–3 only' });
    expect(await phone.engine.sync()).toBe('offline');
    expect(await phone.db.outbox.count()).toBe(1);
    // Meanwhile, unseen by the phone, a manager clears it.
    expect((await api.call('demo:manager', 'POST', `/scaffolds/${scaffold.id}/status`, { status: 'cleared', note: 'Handover' })).status).toBe(200);

    phone.online = true;
    await syncUntil(phone, async () => (await phone.db.scaffolds.get(scaffold.id))?.version === 3);
    expect(await phone.db.outbox.count()).toBe(0);
    expect((await api.call('demo:manager', 'GET', `/scaffolds/${scaffold.id}`)).body).toMatchObject({ status: 'limited', version: 3 });
    expect(await phone.db.scaffolds.get(scaffold.id)).toMatchObject({ status: 'limited', version: 3 });
    const conflicts = Object.values(((await phone.db.meta.get(m.SYNC_META.conflicts))?.value ?? {}) as Record<string, Record<string, unknown>>);
    expect(conflicts).toEqual([
      expect.objectContaining({ entity: 'scaffold', entityId: scaffold.id, field: 'status', currentValue: 'limited', replacedValue: 'cleared', replacedUserId: api.userIds['demo:manager'] }),
    ]);
  });
});
