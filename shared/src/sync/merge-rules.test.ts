import { describe, expect, it } from 'vitest';
import {
  backoffMs,
  batchIsConsecutive,
  compareCursors,
  decideStateCommand,
  mergeFieldPatch,
  orderOfMutation,
  sameValue,
  settleConflict,
  stampsOfCreate,
  unsyncedTooOld,
} from './merge-rules.js';

const A = 'client-a';
const B = 'client-b';

describe('mutation order', () => {
  it('calls an id at or below the last applied one a replay', () => {
    expect(orderOfMutation(3, 5)).toEqual({ kind: 'replay' });
    expect(orderOfMutation(5, 5)).toEqual({ kind: 'replay' });
  });

  it('accepts exactly the next id and names the expected id after a gap', () => {
    expect(orderOfMutation(6, 5)).toEqual({ kind: 'next' });
    expect(orderOfMutation(8, 5)).toEqual({ kind: 'gap', expected: 6 });
  });

  it('wants the ids of a batch to rise by one each', () => {
    expect(batchIsConsecutive([4, 5, 6])).toBe(true);
    expect(batchIsConsecutive([4, 6])).toBe(false);
    expect(batchIsConsecutive([5, 4])).toBe(false);
  });
});

describe('per-field merge', () => {
  const current = { notes: 'cracked board', heightM: 4, lift: 2 };

  it('merges edits of different fields from different devices without a conflict', () => {
    const stamps = { notes: { v: 2, c: A } };
    const result = mergeFieldPatch({ current, stamps, patch: { heightM: 6 }, baseVersion: 1, clientId: B, nextVersion: 3 });
    expect(result.changes).toEqual({ heightM: 6 });
    expect(result.conflicts).toEqual([]);
    expect(result.stamps).toEqual({ notes: { v: 2, c: A }, heightM: { v: 3, c: B } });
  });

  it('lets the later arrival win the same field and keeps the value its writer had not seen', () => {
    const stamps = { notes: { v: 2, c: A } };
    const result = mergeFieldPatch({ current, stamps, patch: { notes: 'board replaced' }, baseVersion: 1, clientId: B, nextVersion: 3 });
    expect(result.changes).toEqual({ notes: 'board replaced' });
    expect(result.conflicts).toEqual([{ field: 'notes', currentValue: 'board replaced', replacedValue: 'cracked board', replacedStamp: { v: 2, c: A } }]);
  });

  it('sees no conflict when the writer had seen the value it replaces', () => {
    const stamps = { notes: { v: 2, c: A } };
    const result = mergeFieldPatch({ current, stamps, patch: { notes: 'board replaced' }, baseVersion: 2, clientId: B, nextVersion: 3 });
    expect(result.conflicts).toEqual([]);
  });

  it('sees no conflict when a client overwrites its own earlier write', () => {
    const stamps = { notes: { v: 5, c: A } };
    const result = mergeFieldPatch({ current, stamps, patch: { notes: 'again' }, baseVersion: 1, clientId: A, nextVersion: 6 });
    expect(result.conflicts).toEqual([]);
    expect(result.changes).toEqual({ notes: 'again' });
  });

  it('changes nothing and records no conflict when the value is already there', () => {
    const stamps = { notes: { v: 4, c: A } };
    const result = mergeFieldPatch({ current, stamps, patch: { notes: 'cracked board' }, baseVersion: 1, clientId: B, nextVersion: 5 });
    expect(result).toEqual({ changes: {}, stamps, conflicts: [] });
  });

  it('treats a field never written through sync as written at version 1', () => {
    const seen = mergeFieldPatch({ current, stamps: {}, patch: { lift: 3 }, baseVersion: 1, clientId: B, nextVersion: 2 });
    expect(seen.conflicts).toEqual([]);
    const unseen = mergeFieldPatch({ current, stamps: {}, patch: { lift: 3 }, baseVersion: 0, clientId: B, nextVersion: 2 });
    expect(unseen.conflicts.map((c) => c.field)).toEqual(['lift']);
  });

  it('compares objects whatever their key order', () => {
    expect(sameValue({ a: 1, b: { c: 2, d: 3 } }, { b: { d: 3, c: 2 }, a: 1 })).toBe(true);
    expect(sameValue({ a: 1 }, { a: 2 })).toBe(false);
  });

  it('stamps every field of a new record with its maker', () => {
    expect(stampsOfCreate(['notes', 'lift'], A)).toEqual({ notes: { v: 1, c: A }, lift: { v: 1, c: A } });
  });
});

describe('state commands', () => {
  it('makes marking an already fixed finding fixed a no-op', () => {
    expect(decideStateCommand('fixed', 'fixed', 'foreman', true)).toEqual({ kind: 'noop' });
  });

  it('applies a legal move through the shared state machine', () => {
    const decision = decideStateCommand('open', 'fixed', 'foreman', true);
    expect(decision.kind).toBe('apply');
    if (decision.kind === 'apply') expect(decision.transition.kind).toBe('fix');
  });

  it('rejects an illegal move with a reason', () => {
    expect(decideStateCommand('open', 'verified', 'inspector', false)).toEqual({
      kind: 'reject',
      code: 'illegal',
      reason: 'A finding cannot move from open to verified',
    });
  });

  it('rejects a move the role may not make and a foreman outside their scope', () => {
    expect(decideStateCommand('fixed', 'verified', 'foreman', true)).toMatchObject({ kind: 'reject', code: 'role' });
    expect(decideStateCommand('open', 'fixed', 'foreman', false)).toMatchObject({ kind: 'reject', code: 'scope' });
  });

  it('refuses the state a finding is already in to a caller who could never move it there', () => {
    expect(decideStateCommand('verified', 'verified', 'foreman', true)).toMatchObject({ kind: 'reject', code: 'role' });
    expect(decideStateCommand('fixed', 'fixed', 'foreman', false)).toMatchObject({ kind: 'reject', code: 'scope' });
    expect(decideStateCommand('open', 'open', 'admin', false)).toMatchObject({ kind: 'reject', code: 'role' });
    expect(decideStateCommand('open', 'open', 'manager', false)).toEqual({ kind: 'noop' });
  });
});

describe('settling a conflict', () => {
  it('writes nothing to keep the current value, the replaced value or a typed one otherwise', () => {
    expect(settleConflict('current', 'old')).toEqual({ write: false });
    expect(settleConflict('replaced', 'old')).toEqual({ write: true, value: 'old' });
    expect(settleConflict('custom', 'old', 'typed')).toEqual({ write: true, value: 'typed' });
  });
});

describe('client timing rules', () => {
  it('warns about unsynced changes older than three days, and not before', () => {
    const now = new Date('2026-03-10T12:00:00Z');
    expect(unsyncedTooOld('2026-03-07T11:59:00Z', now)).toBe(true);
    expect(unsyncedTooOld('2026-03-07T12:01:00Z', now)).toBe(false);
    expect(unsyncedTooOld(null, now)).toBe(false);
  });

  it('backs off from one second, doubling, to at most five minutes plus jitter', () => {
    expect(backoffMs(1, 0)).toBe(1000);
    expect(backoffMs(3, 0)).toBe(4000);
    expect(backoffMs(30, 0)).toBe(300_000);
    expect(backoffMs(30, 0.999)).toBeLessThanOrEqual(360_000);
  });

  it('orders cursors by transaction id, then sequence, as numbers', () => {
    expect(compareCursors('10.5', '9.99')).toBe(1);
    expect(compareCursors('10.5', '10.6')).toBe(-1);
    expect(compareCursors('18446744073709551615.1', '18446744073709551614.9')).toBe(1);
    expect(compareCursors('3.3', '3.3')).toBe(0);
  });
});
