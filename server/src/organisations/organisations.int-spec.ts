import { DEFAULT_ORGANISATION_SETTINGS, DEFAULT_SEVERITY_TABLE } from '@plummet/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { type DataApi, startDataApi } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

describeAccessMatrix('organisation settings: every route by every role of both organisations', () => api, [
  { route: 'GET /organisation/settings', request: async () => ({ path: '/organisation/settings' }), expect: [200, 200, 200, 200, 200, 200, 200, 200] },
  {
    route: 'PATCH /organisation/settings',
    request: async () => ({ path: '/organisation/settings', body: { digestHour: 7 } }),
    expect: [200, 403, 403, 403, 200, 403, 403, 403],
  },
]);

describe('organisation settings', () => {
  it('answers the defaults for what an organisation has not set', async () => {
    const res = await api.call('other:inspector', 'GET', '/organisation/settings');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ ...DEFAULT_ORGANISATION_SETTINGS, digestHour: expect.any(Number) });
  });

  it('changes only the fields sent and keeps the others', async () => {
    await api.call('demo:admin', 'PATCH', '/organisation/settings', { clientCopyOfReports: false });
    const res = await api.call('demo:admin', 'PATCH', '/organisation/settings', { fixDueHours: { High: 8, Medium: 48 }, timeZone: 'America/Chicago' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ clientCopyOfReports: false, fixDueHours: { High: 8, Medium: 48 }, timeZone: 'America/Chicago', proofPhotoRequiredForHigh: true });
    expect((await api.call('demo:foreman', 'GET', '/organisation/settings')).body.fixDueHours).toEqual({ High: 8, Medium: 48 });
    // The other organisation is untouched.
    expect((await api.call('other:admin', 'GET', '/organisation/settings')).body.clientCopyOfReports).toBe(true);
  });

  it('answers each bad value with a message on its field and changes nothing', async () => {
    const before = (await api.call('demo:admin', 'GET', '/organisation/settings')).body;
    const res = await api.call('demo:admin', 'PATCH', '/organisation/settings', {
      digestHour: 24,
      timeZone: 'Mars/Olympus',
      shiftEndsAt: '5pm',
      fixDueHours: { High: 0, Medium: 72 },
      proofPhotoRequiredForHigh: 'yes',
    });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('VALIDATION_FAILED');
    const paths = res.body.issues.map((i: { path: (string | number)[] }) => i.path.join('.')).sort();
    expect(paths).toEqual(['digestHour', 'fixDueHours.High', 'proofPhotoRequiredForHigh', 'shiftEndsAt', 'timeZone']);
    expect(res.body.issues.every((i: { message: string }) => i.message.length > 0)).toBe(true);
    expect((await api.call('demo:admin', 'GET', '/organisation/settings')).body).toEqual(before);
  });

  it('refuses an unknown setting and an empty change', async () => {
    expect((await api.call('demo:admin', 'PATCH', '/organisation/settings', { colour: 'green' })).status).toBe(400);
    expect((await api.call('demo:admin', 'PATCH', '/organisation/settings', {})).status).toBe(400);
  });

  it("checks a severity table with the physics' validator, naming the threshold at fault", async () => {
    const broken = structuredClone(DEFAULT_SEVERITY_TABLE) as unknown as Record<string, { atLeast: number }[]>;
    const exposure = Object.keys(broken)[0]!;
    broken[exposure]![1]!.atLeast = -3;
    const res = await api.call('demo:admin', 'PATCH', '/organisation/settings', { severityTable: broken });
    expect(res.status).toBe(400);
    expect(res.body.issues[0]).toMatchObject({ path: ['severityTable', exposure, 1, 'atLeast'], code: 'invalid_severity_table' });
    const ok = await api.call('demo:admin', 'PATCH', '/organisation/settings', { severityTable: DEFAULT_SEVERITY_TABLE });
    expect(ok.status).toBe(200);
    const reset = await api.call('demo:admin', 'PATCH', '/organisation/settings', { severityTable: null });
    expect(reset.body.severityTable).toBeUndefined();
  });
});
