/**
 * The pure rules of sync, shared by the server and the tests: how a batch's mutation ids
 * line up with what the server applied, how field patches merge, when a replaced value becomes a
 * conflict, how a state command resolves, and what settling a conflict writes.
 */
import type { Role } from '../auth/roles.js';
import { checkFindingTransition, FINDING_TRANSITIONS, type FindingState, type FindingTransition } from '../findings/finding-state.js';
import { FINDING_EXPOSURES } from '../findings/finding-estimate.js';
import { likelihoodFromAnswers, type LikelihoodAnswers } from '../risk/likelihood.js';
import { moreRestrictiveStatus, SCAFFOLD_STATUS_RESTRICTION, type ScaffoldStatus } from '../scaffolds/scaffold.schema.js';

/** The fields of a finding a phone may patch; `item` is one field (name, mass and shape travel together). */
export const FINDING_SYNC_FIELDS = ['elevation', 'lift', 'bay', 'heightM', 'item', 'exposure', 'likelihoodAnswers', 'notes'] as const;
export type FindingSyncField = (typeof FINDING_SYNC_FIELDS)[number];

/** The fields of an inspection a phone may patch while walking (the statutory report drafts among them). */
export const INSPECTION_SYNC_FIELDS = [
  'reason',
  'windSpeedMps',
  'reportFor',
  'location',
  'equipment',
  'mattersGivingRisk',
  'actionTaken',
  'furtherAction',
  'reporterName',
  'reporterPosition',
] as const;
/** The fields of a control check a phone may set. */
export const CONTROL_CHECK_SYNC_FIELDS = ['result', 'note'] as const;
/** The field of a scaffold a phone may set: its tag status (the rest is set up by managers over REST). */
export const SCAFFOLD_SYNC_FIELDS = ['status'] as const;
/** The user's own profile and settings a phone may patch. */
export const USER_SETTINGS_SYNC_FIELDS = ['name', 'position', 'units', 'windUnits'] as const;

/** Who last wrote a field: the record version after that write and the writing client (null: not through sync). */
export interface FieldStamp {
  v: number;
  c: string | null;
  /** The user who wrote it and when (ISO), so a conflict names them; absent on stamps written before these were kept. */
  u?: string | null;
  t?: string;
}
export type FieldStamps = Record<string, FieldStamp>;

/** A field never written through sync was last written when the record was made (version 1). */
export const UNSTAMPED: FieldStamp = { v: 1, c: null };

export type MutationOrder =
  | { kind: 'replay' }
  | { kind: 'next' }
  | { kind: 'gap'; expected: number };

/** Where mutation `id` stands after `lastApplied`: already applied, the next one, or past a gap. */
export function orderOfMutation(id: number, lastApplied: number): MutationOrder {
  if (id <= lastApplied) return { kind: 'replay' };
  if (id === lastApplied + 1) return { kind: 'next' };
  return { kind: 'gap', expected: lastApplied + 1 };
}

/** The batch's ids must rise by one each: a client never reorders or skips its own mutations. */
export function batchIsConsecutive(ids: readonly number[]): boolean {
  return ids.every((id, i) => i === 0 || id === ids[i - 1]! + 1);
}

/** JSON with sorted object keys, so values from jsonb (which reorders keys) compare equal. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value ?? null, (_key, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) : v,
  );
}

export function sameValue(a: unknown, b: unknown): boolean {
  return canonicalJson(a) === canonicalJson(b);
}

export interface FieldConflict {
  field: string;
  /** The value the patch left in place. */
  currentValue: unknown;
  /** The value it replaced, which its writer had not seen. */
  replacedValue: unknown;
  replacedStamp: FieldStamp;
}

export interface FieldMergeInput {
  /** The record's current field values. */
  current: Readonly<Record<string, unknown>>;
  stamps: Readonly<FieldStamps>;
  /** The fields the mutation sets. */
  patch: Readonly<Record<string, unknown>>;
  /** The record version the writer last saw. */
  baseVersion: number;
  /** The writing client; null for a write made on the server (a REST edit), which has seen every value. */
  clientId: string | null;
  /** The record's version after this write. */
  nextVersion: number;
  /** Who writes, and when (ISO): kept on the stamps so a later conflict names the replaced value's writer. */
  userId?: string | null;
  at?: string;
  /** How a clash on a field is settled until someone settles the conflict; a field without one: the later write. */
  policies?: Readonly<Record<string, FieldPolicy>>;
}

/**
 * How a clash between two unseen edits of one field stands until someone settles it:
 * - `safer`: the more restrictive value stands (`pick` returns it), whichever arrived last;
 * - `both-texts`: neither text is lost, the field keeps both.
 */
export type FieldPolicy = { kind: 'safer'; pick: (current: unknown, incoming: unknown) => unknown } | { kind: 'both-texts' };

export interface FieldMergeResult {
  /** Fields whose value changes. */
  changes: Record<string, unknown>;
  stamps: FieldStamps;
  conflicts: FieldConflict[];
}

/**
 * Per-field merge: a patch changes only the fields it names (so edits of different fields on
 * different devices both survive). On the same field the later arrival wins; when its writer had
 * not seen the value it replaces (the field was written after the writer's base version, by
 * another client), the replaced value is returned as a conflict so nothing is lost. Safety first:
 * a field with a `safer` policy keeps the more restrictive of the two clashing values (the other
 * waits in the conflict, naming its writer), and a `both-texts` field keeps both texts. Setting a
 * field to the value it already has changes nothing and is never a conflict.
 */
export function mergeFieldPatch(input: FieldMergeInput): FieldMergeResult {
  const changes: Record<string, unknown> = {};
  const stamps: FieldStamps = { ...input.stamps };
  const conflicts: FieldConflict[] = [];
  const mine: FieldStamp = { v: input.nextVersion, c: input.clientId, ...(input.userId !== undefined ? { u: input.userId } : {}), ...(input.at ? { t: input.at } : {}) };
  for (const [field, value] of Object.entries(input.patch)) {
    if (value === undefined || sameValue(input.current[field], value)) continue;
    const stamp = input.stamps[field] ?? UNSTAMPED;
    const before = input.current[field] ?? null;
    const unseen = stamp.v > input.baseVersion && stamp.c !== input.clientId;
    const policy = unseen ? input.policies?.[field] : undefined;
    if (policy?.kind === 'safer' && sameValue(policy.pick(before, value), before)) {
      // The stored value is the more restrictive: it stands, and the incoming one waits in the conflict.
      conflicts.push({ field, currentValue: before, replacedValue: value, replacedStamp: mine });
      continue;
    }
    const written = policy?.kind === 'both-texts' ? bothTexts(before, value) : value;
    if (unseen) conflicts.push({ field, currentValue: written, replacedValue: before, replacedStamp: stamp });
    changes[field] = written;
    stamps[field] = mine;
  }
  return { changes, stamps, conflicts };
}

/** Two texts written apart: both kept, the stored one first (one that holds the other already is kept as it is). */
export function bothTexts(current: unknown, incoming: unknown): string {
  const a = typeof current === 'string' ? current.trim() : '';
  const b = typeof incoming === 'string' ? incoming.trim() : '';
  if (!a || b.includes(a)) return b;
  if (!b || a.includes(b)) return a;
  return `${a}\n\n${b}`;
}

const higherIndex = (order: readonly string[]) => (current: unknown, incoming: unknown) =>
  order.indexOf(String(incoming)) > order.indexOf(String(current)) ? incoming : current;

/** Who could be struck: the public without head protection is the worst case, a closed zone the mildest. */
export const moreExposed = higherIndex([...FINDING_EXPOSURES].reverse());

/** The greater number stands (a higher fall, a stronger wind). */
export const greaterNumber = (current: unknown, incoming: unknown) => (Number(incoming) > Number(current) ? incoming : current);

/** The heavier item stands (more energy at the same height). */
export const heavierItem = (current: unknown, incoming: unknown) => {
  const mass = (v: unknown) => Number((v as { massKg?: unknown } | null)?.massKg ?? 0);
  return mass(incoming) > mass(current) ? incoming : current;
};

/** The answers that make a strike more likely stand. */
export const likelierAnswers = (current: unknown, incoming: unknown) => {
  const level = (v: unknown) => {
    try {
      return likelihoodFromAnswers(v as LikelihoodAnswers).level;
    } catch {
      return 0;
    }
  };
  return level(incoming) > level(current) ? incoming : current;
};

/** A failed control stands against a pass or "not applicable". */
export const failedControl = (current: unknown, incoming: unknown) => (current === 'fail' ? current : incoming);

/** A scaffold's tag status: the more restrictive stands (an unknown code counts as closed). */
export const moreRestrictiveTag = (current: unknown, incoming: unknown) => {
  const known = (v: unknown): ScaffoldStatus => (typeof v === 'string' && v in SCAFFOLD_STATUS_RESTRICTION ? (v as ScaffoldStatus) : 'closed');
  const [a, b] = [known(current), known(incoming)];
  return a !== b && moreRestrictiveStatus(a, b) === b ? incoming : current;
};

const safer = (pick: (current: unknown, incoming: unknown) => unknown): FieldPolicy => ({ kind: 'safer', pick });
const BOTH_TEXTS: FieldPolicy = { kind: 'both-texts' };

/** A finding: who is below and the band's inputs keep the safer value; notes keep both texts. */
export const FINDING_MERGE_POLICIES: Readonly<Record<string, FieldPolicy>> = {
  exposure: safer(moreExposed),
  heightM: safer(greaterNumber),
  item: safer(heavierItem),
  likelihoodAnswers: safer(likelierAnswers),
  notes: BOTH_TEXTS,
};

/** An inspection: the stronger wind stands (it carries items further); the report texts keep both. */
export const INSPECTION_MERGE_POLICIES: Readonly<Record<string, FieldPolicy>> = {
  windSpeedMps: safer(greaterNumber),
  mattersGivingRisk: BOTH_TEXTS,
  actionTaken: BOTH_TEXTS,
  furtherAction: BOTH_TEXTS,
};

export const CONTROL_CHECK_MERGE_POLICIES: Readonly<Record<string, FieldPolicy>> = { result: safer(failedControl), note: BOTH_TEXTS };

/** A scaffold: the more restrictive tag stands (closed before limited before cleared). */
export const SCAFFOLD_MERGE_POLICIES: Readonly<Record<string, FieldPolicy>> = { status: safer(moreRestrictiveTag) };

/** Stamps for a record made by `clientId`: every given field written at version 1. */
export function stampsOfCreate(fields: readonly string[], clientId: string | null, userId?: string, at?: string): FieldStamps {
  const who = { ...(userId !== undefined ? { u: userId } : {}), ...(at ? { t: at } : {}) };
  return Object.fromEntries(fields.map((field) => [field, { v: 1, c: clientId, ...who }]));
}

export type StateCommandDecision =
  | { kind: 'noop' }
  | { kind: 'apply'; transition: FindingTransition }
  | { kind: 'reject'; reason: string; code: 'illegal' | 'role' | 'scope' };

/**
 * A state change is a command, checked by the one state machine (the same for REST and sync).
 * Asking for the state the finding is already in (two phones marking it fixed) changes nothing and
 * is answered as applied with a reason, through REST and push alike, provided the caller could have
 * moved it there (a role with some transition into that state, a foreman in scope); otherwise it is
 * refused like any move that role may not make. An illegal or forbidden move is rejected with a
 * reason the phone shows.
 */
export function decideStateCommand(from: FindingState, to: FindingState, role: Role, foremanInScope: boolean): StateCommandDecision {
  if (from === to) {
    const couldReach = FINDING_TRANSITIONS.some((t) => t.to === to && t.roles.includes(role));
    if (!couldReach) return { kind: 'reject', reason: `Your role cannot move a finding to ${to}`, code: 'role' };
    if (role === 'foreman' && !foremanInScope) return { kind: 'reject', reason: 'The finding is not on your scaffolds or assigned to you', code: 'scope' };
    return { kind: 'noop' };
  }
  const check = checkFindingTransition(from, to, role, foremanInScope);
  if (check.ok) return { kind: 'apply', transition: check.transition };
  const reason = {
    illegal: `A finding cannot move from ${from} to ${to}`,
    role: `Your role cannot move a finding from ${from} to ${to}`,
    scope: 'The finding is not on your scaffolds or assigned to you',
  }[check.reason];
  return { kind: 'reject', reason, code: check.reason };
}

export type ConflictKeep = 'current' | 'replaced' | 'custom';

/** What settling a conflict writes to the field: nothing (keep current), the replaced value, or the typed one. */
export function settleConflict(keep: ConflictKeep, replacedValue: unknown, customValue?: unknown): { write: false } | { write: true; value: unknown } {
  if (keep === 'current') return { write: false };
  if (keep === 'replaced') return { write: true, value: replacedValue };
  return { write: true, value: customValue };
}

/** Unsynced changes older than this get a warning: some mobile browsers evict storage after a week unused. */
export const UNSYNCED_WARNING_MS = 3 * 24 * 60 * 60 * 1000;

export function unsyncedTooOld(oldestPendingAt: string | null | undefined, now: Date): boolean {
  if (!oldestPendingAt) return false;
  const at = Date.parse(oldestPendingAt);
  return Number.isFinite(at) && now.getTime() - at > UNSYNCED_WARNING_MS;
}

/** Retry delay after `attempts` failures: 1 s doubling to 5 minutes, with up to 20 % jitter (random in [0,1)). */
export function backoffMs(attempts: number, random: number): number {
  const base = Math.min(300_000, 1000 * 2 ** Math.max(0, attempts - 1));
  return Math.round(base * (1 + 0.2 * random));
}

/** Cursor order: `<xid>.<seq>` compared as numbers (bigint: xids pass 2^53 on long-lived clusters). */
export function compareCursors(a: string, b: string): number {
  const [ax, as] = a.split('.').map(BigInt) as [bigint, bigint];
  const [bx, bs] = b.split('.').map(BigInt) as [bigint, bigint];
  return ax === bx ? (as === bs ? 0 : as < bs ? -1 : 1) : ax < bx ? -1 : 1;
}
