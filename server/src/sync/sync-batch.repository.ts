import { Injectable } from '@nestjs/common';
import { asc, eq, sql } from 'drizzle-orm';
import type { DbExecutor } from '../db/db.tokens.js';
import { findings, fixes, scaffolds, syncConflicts, verifications } from '../db/schema/index.js';
import type { FindingRow } from '../findings/finding.mapper.js';
import type { FindingWithScope } from '../findings/findings.repository.js';
import type { ConflictInsert, FixInsert, VerificationInsert } from '../findings/finding-store.js';

/** Rows per statement: keeps every multi-row insert well under PostgreSQL's 65,535 parameters. */
const CHUNK = 1000;

function chunks<T>(rows: T[]): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < rows.length; i += CHUNK) out.push(rows.slice(i, i + CHUNK));
  return out;
}

/** Columns a sync write may change on an existing finding (id, organisation, author and creation time never change). */
const UPDATABLE = [
  'inspectionId', 'scaffoldId', 'elevation', 'lift', 'bay', 'heightM', 'catalogueItemId', 'itemName', 'massKg', 'shape', 'exposure',
  'likelihoodAnswers', 'likelihood', 'estimate', 'estimateRow', 'severity', 'riskScore', 'riskBand', 'state', 'assigneeId', 'dueAt', 'notes',
  'madeSafeNote', 'madeSafeControl', 'zoneRadiusM', 'madeSafePhotoIds', 'madeSafeUntil', 'handBack', 'version', 'syncFields',
] as const;

/** A new finding's columns: the database sets the creation time and the change-feed stamp. */
const INSERTED = ['id', 'organisationId', 'createdBy', ...UPDATABLE] as const;

type FindingColumn = (typeof INSERTED)[number];

/** Rows as a JSON array keyed by column name (timestamps as ISO text, json and jsonb columns as JSON). */
function asJson(rows: FindingRow[], columns: readonly FindingColumn[]): string {
  const names = columns.map((c) => [c, findings[c].name] as const);
  const out: Record<string, unknown>[] = new Array(rows.length);
  // A plain loop: a thousand rows of thirty columns, without a pair array per cell.
  for (let i = 0; i < rows.length; i += 1) {
    const row = rows[i]!;
    const record: Record<string, unknown> = {};
    for (const [key, name] of names) record[name] = row[key] ?? null;
    out[i] = record;
  }
  return JSON.stringify(out);
}

/**
 * `findings.id` is one of `ids`, the list as ONE array parameter: a push names up to thousands of
 * findings, and a parameter per id costs the query's building, binding and planning each time.
 */
export function idIn(ids: string[]) {
  return sql`${findings.id} = any(${sql.param(ids)}::uuid[])`;
}

/** A finding of the batch with what its answer and scope need from its scaffold. */
export interface BatchFinding extends FindingWithScope {
  siteId: string;
}

/** The API columns PostgreSQL might store differently from what was computed (json values are compared by the merge itself). */
export const CHECKED = [
  'organisationId', 'inspectionId', 'scaffoldId', 'elevation', 'lift', 'bay', 'heightM', 'catalogueItemId', 'itemName', 'massKg',
  'exposure', 'likelihood', 'severity', 'riskScore', 'riskBand', 'state', 'assigneeId', 'notes', 'madeSafeNote', 'createdBy', 'version',
] as const;

/** What the batch's writes return to be checked: the checked columns and the times, no JSON to parse. */
const CHECK_COLUMNS = ['id', ...CHECKED, 'createdAt', 'updatedAt', 'dueAt'] as const;

export type CheckedFinding = Pick<FindingRow, (typeof CHECK_COLUMNS)[number]>;

/** The checked columns as a write's RETURNING list, of the findings row aliased `f`. */
const RETURNING_CHECKED = sql.raw(CHECK_COLUMNS.map((c) => `f.${findings[c].name}`).join(', '));

/** Rows a write returned (RETURNING_CHECKED) as a select reads them: each value through its column's mapping. */
function asChecked(rows: Record<string, unknown>[]): CheckedFinding[] {
  return rows.map((raw) => {
    const out: Record<string, unknown> = {};
    for (const c of CHECK_COLUMNS) {
      const value = raw[findings[c].name];
      out[c] = value === null || value === undefined ? null : findings[c].mapFromDriverValue(value);
    }
    return out as CheckedFinding;
  });
}

/** The multi-row reads and writes of a push applied as one batch (BatchSyncStore). */
@Injectable()
export class SyncBatchRepository {
  /** The transaction's clock (`now()`), read as a timestamp column is, so rows made in memory match stored ones. */
  async now(tx: DbExecutor): Promise<Date> {
    const [row] = await tx.select({ now: sql`now()`.mapWith(findings.updatedAt) }).from(sql`(select 1) one`);
    return row!.now as Date;
  }

  /** Every finding with one of `ids` (any organisation), locked until the transaction ends, in id order (fewer deadlocks). */
  async lockFindings(ids: string[], tx: DbExecutor): Promise<BatchFinding[]> {
    if (!ids.length) return [];
    return tx
      .select({ finding: findings, scaffoldForemanId: scaffolds.foremanId, siteId: scaffolds.siteId })
      .from(findings)
      .innerJoin(scaffolds, eq(scaffolds.id, findings.scaffoldId))
      .where(idIn(ids))
      .orderBy(asc(findings.id))
      .for('update', { of: findings });
  }

  /**
   * Inserts new findings; returns the compared columns of those inserted, as stored (fewer rows when
   * an id appeared meanwhile). The rows travel as one JSON parameter (json_populate_recordset): far
   * cheaper to send and plan than thirty thousand bind parameters.
   */
  async insertFindings(rows: FindingRow[], tx: DbExecutor): Promise<CheckedFinding[]> {
    if (!rows.length) return [];
    const cols = sql.raw(INSERTED.map((c) => findings[c].name).join(', '));
    const result = await tx.execute<Record<string, unknown>>(sql`
      insert into findings as f (${cols}) select ${cols} from json_populate_recordset(null::findings, ${asJson(rows, INSERTED)}::json)
      on conflict (id) do nothing returning ${RETURNING_CHECKED}`);
    return asChecked(result.rows);
  }

  /**
   * Writes the new state of existing (locked) findings, bumping version stamp and change-feed stamp;
   * returns the compared columns of those written, as stored.
   */
  async updateFindings(rows: FindingRow[], tx: DbExecutor): Promise<CheckedFinding[]> {
    if (!rows.length) return [];
    const set = sql.raw(UPDATABLE.map((c) => `${findings[c].name} = r.${findings[c].name}`).join(', '));
    const result = await tx.execute<Record<string, unknown>>(sql`
      update findings f set ${set}, updated_at = now(), sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq')
      from json_populate_recordset(null::findings, ${asJson(rows, ['id', ...UPDATABLE])}::json) r
      where f.id = r.id returning ${RETURNING_CHECKED}`);
    return asChecked(result.rows);
  }

  /** An alteration recorded in the batch: the scaffold is marked altered and its inspection falls due (before use). */
  async markScaffoldAltered(scaffoldId: string, at: Date, tx: DbExecutor): Promise<void> {
    await tx
      .update(scaffolds)
      .set({ alteredAt: at, nextDueAt: at, version: sql`${scaffolds.version} + 1`, updatedAt: sql`now()` })
      .where(eq(scaffolds.id, scaffoldId));
  }

  async insertConflicts(rows: ConflictInsert[], tx: DbExecutor): Promise<void> {
    for (const part of chunks(rows)) await tx.insert(syncConflicts).values(part);
  }

  /** Returns how many were inserted (fewer when a record id is taken). */
  async insertFixes(rows: FixInsert[], tx: DbExecutor): Promise<number> {
    let count = 0;
    for (const part of chunks(rows)) count += (await tx.insert(fixes).values(part).onConflictDoNothing().returning({ id: fixes.id })).length;
    return count;
  }

  async insertVerifications(rows: VerificationInsert[], tx: DbExecutor): Promise<number> {
    let count = 0;
    for (const part of chunks(rows)) count += (await tx.insert(verifications).values(part).onConflictDoNothing().returning({ id: verifications.id })).length;
    return count;
  }
}
