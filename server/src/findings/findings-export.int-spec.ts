import { metresToFeet } from '@plummet/shared';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { type DataApi, type Who, startDataApi } from '../../test/data-api.js';
import { insertFinding, insertScaffold, insertSite, orgIdOf } from '../../test/manager-fixtures.js';

let api: DataApi;
let site: string;

beforeAll(async () => {
  api = await startDataApi();
  const db = api.t.drizzle;
  const org = await orgIdOf(db, 'harrow-span');
  site = await insertSite(db, org, 'Export Test Yard');
  const scaffold = await insertScaffold(db, org, site, 'cleared', null);
  // Cells a spreadsheet would run as formulas, and text that needs quoting.
  await insertFinding(db, org, scaffold, { band: 'High', state: 'open', itemName: '=HYPERLINK("http://example.test","x")', notes: '+SUM(A1:A9)' });
  await insertFinding(db, org, scaffold, { band: 'Medium', state: 'open', itemName: '@cmd', notes: '-2+3' });
  await insertFinding(db, org, scaffold, { band: 'Low', state: 'made-safe', itemName: 'Tab\tstart', notes: '\tcalc' });
  await insertFinding(db, org, scaffold, { band: 'Low', state: 'fixed', itemName: 'Board, offcut', notes: 'Said "mind your head"\nthen left' });
  // More than one export batch of 500, so the keyset paging between batches is exercised.
  for (let i = 0; i < 620; i++) {
    await insertFinding(db, org, scaffold, { band: (['Low', 'Medium', 'High'] as const)[i % 3], state: 'open', itemName: `Bulk item ${i}`, raisedHoursAgo: i % 90 });
  }
});
afterAll(async () => {
  await api?.t.close();
});

/** The list route, every page, as `who`. */
async function listAll(who: Who, filter: string) {
  const items: Record<string, unknown>[] = [];
  let cursor: string | null = null;
  do {
    const res = await api.call(who, 'GET', `/findings?limit=200&${filter}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`);
    expect(res.status).toBe(200);
    items.push(...res.body.items);
    cursor = res.body.nextCursor;
  } while (cursor);
  return items as { id: string; heightM: number; itemName: string; riskBand: string; state: string; createdAt: string }[];
}

const exportCsv = async (who: Who, filter: string) => {
  const res = await api.call(who, 'GET', `/findings/export.csv?${filter}`);
  expect(res.status).toBe(200);
  expect(res.headers.get('content-type')).toContain('text/csv');
  return parse(res.body as string, { columns: true, relax_column_count: false }) as Record<string, string>[];
};

describeAccessMatrix('findings export: by every role of both organisations', () => api, [
  { route: 'GET /findings/export.csv', request: async () => ({ path: '/findings/export.csv?riskBand=High' }), expect: [200, 200, 200, 403, 200, 200, 200, 403] },
]);

describe('the findings export', () => {
  it('holds exactly the list route’s rows, in its order, for the same filters and sort', async () => {
    const filter = `siteId=${site}&sort=createdAt&order=asc`;
    const listed = await listAll('demo:manager', filter);
    const rows = await exportCsv('demo:manager', filter);
    expect(listed.length).toBe(624);
    expect(rows.map((r) => r['Finding id'])).toEqual(listed.map((f) => f.id));
    rows.forEach((row, i) => {
      expect(row.Band).toBe(listed[i].riskBand);
      expect(row.State).toBe(listed[i].state);
      expect(row['Raised (UTC)']).toBe(listed[i].createdAt);
      expect(Number(row['Height (m)'])).toBeCloseTo(listed[i].heightM, 2);
      expect(row.Site).toBe('Export Test Yard');
    });
  });

  it('neutralises every cell that starts like a formula and keeps quoted text whole', async () => {
    const rows = await exportCsv('demo:manager', `siteId=${site}&q=${encodeURIComponent('MIND YOUR')}`);
    const byItem = new Map((await exportCsv('demo:manager', `siteId=${site}`)).map((r) => [r.Item, r]));
    expect(byItem.get(`'=HYPERLINK("http://example.test","x")`)?.Notes).toBe(`'+SUM(A1:A9)`);
    expect(byItem.get(`'@cmd`)?.Notes).toBe(`'-2+3`);
    expect(byItem.get(`Tab\tstart`)?.Notes).toBe(`'\tcalc`);
    expect(byItem.get('Board, offcut')?.Notes).toBe('Said "mind your head"\nthen left');
    // Free text looks in the item and the note, whatever the case: one note holds these words.
    expect(rows.map((r) => r.Item)).toEqual(['Board, offcut']);
    for (const row of byItem.values()) for (const cell of Object.values(row)) expect(cell).not.toMatch(/^[=+@\t\r]/);
  });

  it('writes figures in the user’s units, saying so in the header row', async () => {
    expect((await api.call('demo:inspector', 'PATCH', '/users/me', { units: 'imperial' })).status).toBe(200);
    const listed = await listAll('demo:inspector', `siteId=${site}&riskBand=High`);
    const rows = await exportCsv('demo:inspector', `siteId=${site}&riskBand=High`);
    expect(Object.keys(rows[0])).toContain('Height (ft)');
    expect(Object.keys(rows[0])).toContain('Mass (lb)');
    expect(Number(rows[0]['Height (ft)'])).toBeCloseTo(metresToFeet(listed[0].heightM), 2);
  });

  it('answers a header row alone when nothing matches', async () => {
    const res = await api.call('demo:manager', 'GET', `/findings/export.csv?siteId=${site}&q=nothing-matches-this`);
    expect(res.status).toBe(200);
    expect(res.body).toBe(`${(res.body as string).split('\r\n')[0]}\r\n`);
    expect((res.body as string).startsWith('Finding id,Site,Scaffold')).toBe(true);
  });

  it('refuses a bad filter with a 400 before writing anything', async () => {
    const res = await api.call('demo:manager', 'GET', '/findings/export.csv?raisedFrom=yesterday');
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('VALIDATION_FAILED');
  });
});

describe('the list’s new filters', () => {
  it('keeps findings raised between two instants', async () => {
    const from = new Date(Date.now() - 10.5 * 3_600_000).toISOString();
    const to = new Date(Date.now() - 4.5 * 3_600_000).toISOString();
    const listed = await listAll('demo:manager', `siteId=${site}&raisedFrom=${from}&raisedTo=${to}`);
    // Bulk items are raised i % 90 hours ago: hours 5–10 hold i = 5..10, 95..100, … (every i with i % 90 in 5..10).
    const expected = Array.from({ length: 620 }, (_, i) => i).filter((i) => i % 90 >= 5 && i % 90 <= 10).length;
    expect(listed.length).toBe(expected);
  });

  it('treats % and _ in the free text as letters', async () => {
    expect(await listAll('demo:manager', `siteId=${site}&q=${encodeURIComponent('%')}`)).toEqual([]);
  });
});
