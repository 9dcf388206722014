import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, type DataApi, findingBody, startDataApi } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

const create = (notes: string) => {
  const body = findingBody(DEMO.foremansScaffold, { notes });
  return { entity: 'finding', entityId: body.id, action: 'create', baseVersion: 0, payload: body };
};
const update = (id: string, baseVersion: number, payload: Record<string, unknown>) => ({ entity: 'finding', entityId: id, action: 'update', baseVersion, payload });

async function push(clientId: string, mutations: Record<string, unknown>[]) {
  return api.call('demo:inspector', 'POST', '/sync/push', { clientId, mutations: mutations.map((m, i) => ({ id: i + 1, ...m })) });
}

async function stored(ids: string[]) {
  const rows = await api.t.drizzle.execute<{ id: string; notes: string; version: number }>(
    sql`select id, notes, version from findings where id = any(${`{${ids.join(',')}}`}::uuid[])`,
  );
  return new Map(rows.rows.map((r) => [r.id, r]));
}

async function auditActions(id: string): Promise<string[]> {
  const rows = await api.t.drizzle.execute<{ action: string }>(sql`select action from audit_events where entity_id = ${id} order by id`);
  return rows.rows.map((r) => r.action);
}

// A long batch is written in parts while the next part is computed (sync-push.service.ts): a
// finding made in one part and edited in a later one, and a part PostgreSQL refuses, must come
// out exactly as a batch written in one go.
describe('a long batch, written in parts as it is computed', () => {
  it('edits in a later part a finding made in an earlier one, and writes every row and audit event once', async () => {
    const creates = Array.from({ length: 600 }, (_, i) => create(`Part test ${i}`));
    const first = creates[3]!.entityId;
    const mutations = [...creates, update(first, 1, { notes: 'Edited three parts later' }), update(first, 2, { lift: 4 })];
    const res = await push(randomUUID(), mutations);
    expect(res.status).toBe(200);
    expect(res.body.results).toHaveLength(602);
    expect(res.body.results.every((r: { outcome: string }) => r.outcome === 'applied')).toBe(true);
    const rows = await stored(creates.map((c) => c.entityId));
    expect(rows.size).toBe(600);
    expect(rows.get(first)).toMatchObject({ notes: 'Edited three parts later', version: 3 });
    expect(rows.get(creates[599]!.entityId)).toMatchObject({ notes: 'Part test 599', version: 1 });
    expect(await auditActions(first)).toEqual(['create', 'update', 'update']);
    expect(await auditActions(creates[599]!.entityId)).toEqual(['create']);
    const answered = res.body.records.find((r: { id: string }) => r.id === first);
    expect(answered).toMatchObject({ notes: 'Edited three parts later', lift: 4, version: 3 });
  });

  it('rejects only the mutation PostgreSQL refuses when its part fails while the next part is computed', async () => {
    const creates = Array.from({ length: 520 }, (_, i) => create(`Refused part ${i}`));
    // PostgreSQL refuses a NUL in text: the first part cannot be written.
    creates[7] = create('nul \u0000 inside');
    const edited = creates[2]!.entityId;
    const clientId = randomUUID();
    const res = await push(clientId, [...creates, update(edited, 1, { notes: 'Edited after the refused one' })]);
    expect(res.status).toBe(200);
    const outcomes = res.body.results.map((r: { outcome: string }) => r.outcome);
    expect(outcomes.filter((o: string) => o === 'rejected')).toHaveLength(1);
    expect(outcomes[7]).toBe('rejected');
    const rows = await stored(creates.map((c) => c.entityId));
    expect(rows.size).toBe(519);
    expect(rows.has(creates[7]!.entityId)).toBe(false);
    expect(rows.get(edited)).toMatchObject({ notes: 'Edited after the refused one', version: 2 });
    expect(await auditActions(edited)).toEqual(['create', 'update']);
    const log = await api.t.drizzle.execute<{ n: number }>(sql`select count(*)::int as n from sync_mutations where client_id = ${clientId}`);
    expect(log.rows[0]!.n).toBe(521);
  });

  it('goes one by one, and answers and audits what was stored, when PostgreSQL stores a finding otherwise than computed', async () => {
    // A trigger stands for whatever might change a row on its way in (a rule added in SQL later).
    await api.t.drizzle.execute(sql.raw(`
      create function test_stored_otherwise() returns trigger language plpgsql as $$
      begin new.notes := new.notes || ' (as stored)'; return new; end $$;
      create trigger test_stored_otherwise before insert on findings for each row
        when (new.notes like 'Stored otherwise%') execute function test_stored_otherwise()`));
    try {
      const creates = [create('Stored as sent'), create('Stored otherwise'), create('Also as sent')];
      const res = await push(randomUUID(), [...creates, update(creates[0]!.entityId, 1, { notes: 'Edited in the same batch' })]);
      expect(res.status).toBe(200);
      expect(res.body.results.map((r: { outcome: string }) => r.outcome)).toEqual(['applied', 'applied', 'applied', 'applied']);
      const notesOf = (id: string) => res.body.records.find((r: { id: string }) => r.id === id)?.notes;
      expect(notesOf(creates[1]!.entityId)).toBe('Stored otherwise (as stored)');
      expect(notesOf(creates[0]!.entityId)).toBe('Edited in the same batch');
      expect(notesOf(creates[2]!.entityId)).toBe('Also as sent');
      const audited = await api.t.drizzle.execute<{ after: { notes: string } }>(sql`select after from audit_events where entity_id = ${creates[1]!.entityId}`);
      expect(audited.rows.map((r) => r.after.notes)).toEqual(['Stored otherwise (as stored)']);
    } finally {
      await api.t.drizzle.execute(sql.raw('drop trigger test_stored_otherwise on findings; drop function test_stored_otherwise()'));
    }
  });
});
