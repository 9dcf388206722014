import { decodeCursor, encodeCursor } from '@plummet/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api } from '../../test/request.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

/** Every keyset list, with a sort that is a timestamp, a number or text where the list has one. */
const LISTS = [
  '/findings?limit=1',
  '/findings?limit=1&sort=dueAt&order=asc',
  '/sites?limit=1',
  '/scaffolds?limit=1',
  '/inspections?limit=1',
  '/users?limit=1',
  '/audit?limit=1',
  '/catalogue?limit=1',
];

/** Values a forger might put in a well-formed cursor: wrong type, out of range, impossible dates. */
const FORGED_VALUES = ['garbage', '2026-02-30 00:00:00+00', '99999999999999999999', '1e999', 'nul\u0000inside', "'); DROP TABLE users; --"];
const FORGED_IDS = ['not-a-uuid', '99999999999999999999', ''];

describe('forged cursors and ids answer 400 with a code, never 500', () => {
  let t: TestApp;
  let admin: string;

  beforeAll(async () => {
    t = await startTestApp();
    admin = await t.tokenFor('admin@demo.test');
  });
  afterAll(async () => {
    await t?.close();
  });

  for (const list of LISTS) {
    it(`on GET ${list}`, async () => {
      const first = await api(t.baseUrl, 'GET', list, { token: admin });
      expect(first.status).toBe(200);
      const url = new URL(`http://x${list}`);
      const sort = url.searchParams.get('sort');
      const order = (url.searchParams.get('order') ?? 'desc') as 'asc' | 'desc';
      // Read the list's real cursor when there is one, to forge only its value or its id.
      const real = first.body.nextCursor ? decodeCursor(first.body.nextCursor, sort ?? '', order) : null;
      const base = real ?? { sort: sort ?? 'createdAt', order, value: '2026-01-01 00:00:00+00', id: '0b6f2a7e-3c1d-4f0e-9a8b-1c2d3e4f5a6b' };
      const cursors = [
        ...FORGED_VALUES.map((value) => encodeCursor({ ...base, value })),
        ...FORGED_IDS.map((id) => encodeCursor({ ...base, id })),
        'garbage',
        Buffer.from('[1,2,3,4]').toString('base64url'),
      ];
      for (const cursor of cursors) {
        const res = await api(t.baseUrl, 'GET', `${list}&cursor=${encodeURIComponent(cursor)}`, { token: admin });
        expect(res.status, `${list} ${Buffer.from(cursor, 'base64url').toString()}`).toBe(400);
        expect(res.body.code).toBe('VALIDATION_FAILED');
      }
    });
  }

  it('on GET /sync/pull with cursors beyond the database’s integer ranges', async () => {
    const inspector = await t.tokenFor('inspector@demo.test');
    for (const cursor of ['99999999999999999999.1', '1.99999999999999999999', '18446744073709551616.0', 'abc.def', '-1.1']) {
      const res = await api(t.baseUrl, 'GET', `/sync/pull?cursor=${encodeURIComponent(cursor)}`, { token: inspector });
      expect(res.status, cursor).toBe(400);
      expect(res.body.code).toBe('VALIDATION_FAILED');
    }
  });

  it('on routes with an id in the path', async () => {
    for (const path of ['/findings/not-a-uuid', '/sites/12', '/scaffolds/%00', '/inspections/99999999999999999999', '/catalogue/x', '/photos/zz']) {
      const res = await api(t.baseUrl, 'GET', path, { token: admin });
      expect(res.status, path).toBeGreaterThanOrEqual(400);
      expect(res.status, path).toBeLessThan(500);
      expect(typeof res.body.code, path).toBe('string');
    }
  });
});
