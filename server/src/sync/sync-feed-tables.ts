/**
 * The change feed's tables besides findings and conflicts: one reader per record type, each a
 * keyset scan of its feed index `(organisation_id, sync_xid, sync_seq)` inside the pull's window,
 * scoped to what the caller's phone holds. A foreman's scope is the scaffolds they look after or
 * that carry findings assigned to them (and what hangs off those); everyone else sees the
 * organisation's records. Every reader runs in the pull's one REPEATABLE READ transaction.
 */
import type { SyncChange } from '@plummet/shared';
import { and, asc, eq, isNull, or, sql, type SQL } from 'drizzle-orm';
import type { PgColumn, PgTable } from 'drizzle-orm/pg-core';
import type { DbExecutor } from '../db/db.tokens.js';
import type { RawJson } from './raw-json.js';
import {
  catalogueItems,
  controlChecks,
  fixes,
  inspections,
  memberships,
  organisations,
  photos,
  scaffolds,
  sites,
  syncTombstones,
  users,
  verifications,
} from '../db/schema/index.js';
import { toCatalogueItem } from '../catalogue/catalogue.mapper.js';
import { toControlCheck, toInspection } from '../inspections/inspection.mapper.js';
import { toPhoto } from '../photos/photo.mapper.js';
import { toScaffold } from '../scaffolds/scaffold.mapper.js';
import { toSite } from '../sites/site.mapper.js';
import { findingsInScope, type PullScope, scaffoldsInScope, sitesInScope } from './sync-site-scope.js';

/**
 * A finding as JSON text PostgreSQL wrote (sync-finding-json.ts), sent unparsed: its record, or with
 * `format=rows` its row (shared/src/sync/finding-rows.ts).
 */
export type RawFindingChange = { type: 'finding'; record: RawJson } | { type: 'finding'; row: RawJson };

/** A change as a pull page carries it. */
export type FeedChange = SyncChange | RawFindingChange;

/** One change of the feed with its stamp. */
export interface StampedChange {
  xid: string;
  seq: number;
  change: FeedChange;
  /** The version of a raw record handed to the phone (the other records carry theirs in `change`). */
  given?: { id: string; version: number };
}

export interface FeedScope extends PullScope {
  organisationId: string;
  userId: string;
}

type Window = (xid: PgColumn, seq: PgColumn) => SQL;

/** Scaffolds in a foreman's scope (not archived). */
export function foremanScaffolds(foremanId: string): SQL {
  return sql`(select s.id from scaffolds s where s.archived_at is null and (s.foreman_id = ${foremanId}
    or exists (select 1 from findings f where f.scaffold_id = s.id and f.assignee_id = ${foremanId})))`;
}

/** Findings in a foreman's scope: on scaffolds they look after, or assigned to them. */
export function foremanFindings(foremanId: string): SQL {
  return sql`(select f.id from findings f join scaffolds s on s.id = f.scaffold_id
    where s.archived_at is null and (s.foreman_id = ${foremanId} or f.assignee_id = ${foremanId}))`;
}

/** A fix's or verification's photo ids: photos owned by the record (the upload names its owner). */
const photoIdsOf = (ownerType: 'fix' | 'verification', id: PgColumn) =>
  sql<string[]>`coalesce((select array_agg(p.id order by p.created_at, p.id) from photos p where p.owner_type = ${ownerType} and p.owner_id = ${id}), '{}')`;

/** Reads a column the fix-loop schema may add later (fixes.control); absent: null. */
function optional<T>(row: object, key: string): T | null {
  return ((row as Record<string, unknown>)[key] as T | undefined) ?? null;
}

/**
 * A reader: `read` runs its query when called (one statement at a time on the pull's connection);
 * `changed` is an EXISTS over the table's rows in the window (the organisation's, whatever the
 * scope: it may say yes for nothing, never no for something). The pull asks every table's
 * `changed` in one statement and reads only those that answer yes, so a page of findings, or a feed
 * with nothing new, costs one round trip instead of one per table.
 */
export interface Reader {
  changed: SQL;
  read: () => Promise<StampedChange[]>;
}

function read<T extends { syncXid: string; syncSeq: number }>(
  table: PgTable,
  inWindow: SQL | undefined,
  rows: PromiseLike<T[]>,
  toChange: (row: T) => SyncChange,
): Reader {
  return {
    changed: sql`exists (select 1 from ${table} where ${inWindow})`,
    read: async () => (await rows).map((row) => ({ xid: row.syncXid, seq: row.syncSeq, change: toChange(row) })),
  };
}

const order = (table: { syncXid: PgColumn; syncSeq: PgColumn }) => [asc(table.syncXid), asc(table.syncSeq)];

/** Every reader of the feed besides findings and conflicts, each limited to `limit` rows. */
export function readOtherTables(tx: DbExecutor, scope: FeedScope, window: Window, limit: number): Reader[] {
  const { organisationId: org } = scope;
  const inOrg = (table: PgTable & { organisationId: PgColumn; syncXid: PgColumn; syncSeq: PgColumn }, extra?: SQL) =>
    and(eq(table.organisationId, org), window(table.syncXid, table.syncSeq), extra);
  // A foreman's scope, a site's first pull, or both (sync-site-scope.ts); undefined: the whole organisation.
  const scopedScaffolds = scaffoldsInScope(scope);
  const scopedFindings = findingsInScope(scope);
  const scopedSites = sitesInScope(scope);

  return [
    read(
      sites,
      inOrg(sites),
      tx.select().from(sites).where(inOrg(sites, scopedSites ? sql`${sites.id} in ${scopedSites}` : undefined)).orderBy(...order(sites)).limit(limit),
      (row) => ({ type: 'site', record: toSite(row) }),
    ),
    read(
      scaffolds,
      inOrg(scaffolds),
      tx
        .select()
        .from(scaffolds)
        .where(inOrg(scaffolds, scopedScaffolds ? sql`${scaffolds.id} in ${scopedScaffolds}` : isNull(scaffolds.archivedAt)))
        .orderBy(...order(scaffolds))
        .limit(limit),
      (row) => ({ type: 'scaffold', record: toScaffold(row) }),
    ),
    read(
      inspections,
      inOrg(inspections),
      tx
        .select()
        .from(inspections)
        .where(inOrg(inspections, scopedScaffolds ? sql`${inspections.scaffoldId} in ${scopedScaffolds}` : undefined))
        .orderBy(...order(inspections))
        .limit(limit),
      (row) => ({ type: 'inspection', record: toInspection(row) }),
    ),
    read(
      controlChecks,
      inOrg(controlChecks),
      tx
        .select()
        .from(controlChecks)
        .where(
          inOrg(controlChecks, scopedScaffolds ? sql`${controlChecks.inspectionId} in (select id from inspections where scaffold_id in ${scopedScaffolds})` : undefined),
        )
        .orderBy(...order(controlChecks))
        .limit(limit),
      (row) => ({ type: 'control-check', record: toControlCheck(row) }),
    ),
    read(
      fixes,
      inOrg(fixes),
      tx
        .select({ row: fixes, photoIds: photoIdsOf('fix', fixes.id), syncXid: fixes.syncXid, syncSeq: fixes.syncSeq })
        .from(fixes)
        .where(inOrg(fixes, scopedFindings ? sql`${fixes.findingId} in ${scopedFindings}` : undefined))
        .orderBy(...order(fixes))
        .limit(limit),
      ({ row, photoIds }) => ({
        type: 'fix',
        record: {
          id: row.id,
          findingId: row.findingId,
          fixedBy: row.fixedBy,
          fixedAt: row.fixedAt.toISOString(),
          note: row.note,
          control: optional(row, 'control'),
          photoIds,
        },
      }),
    ),
    read(
      verifications,
      inOrg(verifications),
      tx
        .select({ row: verifications, photoIds: photoIdsOf('verification', verifications.id), syncXid: verifications.syncXid, syncSeq: verifications.syncSeq })
        .from(verifications)
        .where(inOrg(verifications, scopedFindings ? sql`${verifications.findingId} in ${scopedFindings}` : undefined))
        .orderBy(...order(verifications))
        .limit(limit),
      ({ row, photoIds }) => ({
        type: 'verification',
        record: {
          id: row.id,
          findingId: row.findingId,
          verifiedBy: row.verifiedBy,
          verifiedAt: row.verifiedAt.toISOString(),
          outcome: row.outcome,
          note: row.note,
          photoIds,
        },
      }),
    ),
    read(
      photos,
      inOrg(photos),
      tx
        .select()
        .from(photos)
        .where(
          inOrg(
            photos,
            scopedFindings && scopedScaffolds
              ? sql`((${photos.ownerType} = 'finding' and ${photos.ownerId} in ${scopedFindings})
                  or (${photos.ownerType} = 'fix' and ${photos.ownerId} in (select id from fixes where finding_id in ${scopedFindings}))
                  or (${photos.ownerType} = 'verification' and ${photos.ownerId} in (select id from verifications where finding_id in ${scopedFindings}))
                  or (${photos.ownerType} = 'control-check' and ${photos.ownerId} in (select c.id from control_checks c join inspections i on i.id = c.inspection_id where i.scaffold_id in ${scopedScaffolds})))`
              : undefined,
          ),
        )
        .orderBy(...order(photos))
        .limit(limit),
      (row) => ({ type: 'photo', record: toPhoto(row) }),
    ),
    read(
      catalogueItems,
      inOrg(catalogueItems),
      tx.select().from(catalogueItems).where(inOrg(catalogueItems)).orderBy(...order(catalogueItems)).limit(limit),
      (row) => ({ type: 'catalogue-item', record: toCatalogueItem(row) }),
    ),
    read(
      users,
      and(eq(users.id, scope.userId), window(users.syncXid, users.syncSeq)),
      tx
        .select({
          id: users.id,
          email: users.email,
          name: users.name,
          position: users.position,
          units: users.units,
          windUnits: users.windUnits,
          version: users.version,
          role: memberships.role,
          organisationName: organisations.name,
          syncXid: users.syncXid,
          syncSeq: users.syncSeq,
        })
        .from(users)
        .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.organisationId, org)))
        .innerJoin(organisations, eq(organisations.id, org))
        .where(and(eq(users.id, scope.userId), window(users.syncXid, users.syncSeq))),
      (row) => ({
        type: 'user',
        record: { id: row.id, email: row.email, name: row.name, position: row.position, units: row.units, windUnits: row.windUnits, role: row.role, organisation: { id: org, name: row.organisationName }, version: row.version },
      }),
    ),
    read(
      syncTombstones,
      inOrg(syncTombstones),
      tx
        .select()
        .from(syncTombstones)
        .where(inOrg(syncTombstones, or(isNull(syncTombstones.userId), eq(syncTombstones.userId, scope.userId))))
        .orderBy(...order(syncTombstones))
        .limit(limit),
      (row) => ({ type: 'tombstone', record: { recordType: row.recordType as never, id: row.recordId, reason: row.reason } }),
    ),
  ];
}
