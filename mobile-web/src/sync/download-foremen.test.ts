import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { readMeta } from '../local-db/db';
import { dropTestDatabases, freshDb } from '../local-db/testing';
import { downloadForemen, FOREMEN_META_KEY } from './download-foremen';

afterEach(dropTestDatabases);

const foreman = { id: '0b000000-0000-4000-8000-0000000000f1', name: 'Dev Castellano', position: 'Scaffolding foreman', phone: null };
const answering = (status: number, body: unknown) => async () => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

describe('keeping the organisation’s foremen on the phone', () => {
  it('stores the list for an inspector, so a finding can be given to a foreman offline', async () => {
    const database = freshDb();
    expect(await downloadForemen(database, answering(200, { items: [foreman] }), 'inspector')).toBe(true);
    expect(await readMeta(database, FOREMEN_META_KEY)).toEqual([foreman]);
  });

  it('keeps the last list when the server refuses or answers something else', async () => {
    const database = freshDb();
    await downloadForemen(database, answering(200, { items: [foreman] }), 'manager');
    expect(await downloadForemen(database, answering(503, { code: 'UNAVAILABLE' }), 'manager')).toBe(false);
    expect(await downloadForemen(database, answering(200, { items: [{ id: 'not-a-uuid' }] }), 'manager')).toBe(false);
    expect(await readMeta(database, FOREMEN_META_KEY)).toEqual([foreman]);
  });

  it('does not ask on a foreman’s phone', async () => {
    const database = freshDb();
    let asked = false;
    expect(await downloadForemen(database, async () => ((asked = true), new Response('{}')), 'foreman')).toBe(false);
    expect(asked).toBe(false);
  });
});
