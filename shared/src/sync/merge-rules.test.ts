import { describe, expect, it } from 'vitest';
import {
  backoffMs,
  batchIsConsecutive,
  compareCursors,
  bothTexts,
  CONTROL_CHECK_MERGE_POLICIES,
  decideStateCommand,
  FINDING_MERGE_POLICIES,
  mergeFieldPatch,
  SCAFFOLD_MERGE_POLICIES,
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

describe('safety first when unseen edits clash', () => {
  const finding = { exposure: 'public', heightM: 12, notes: 'loose clip', likelihoodAnswers: { securing: 'secured', edgeDistance: 'away', activity: 'none', wind: 'calm', footTraffic: 'none' } };
  const stamps = { exposure: { v: 2, c: A, u: 'user-a', t: '2026-03-01T08:00:00.000Z' }, heightM: { v: 2, c: A }, notes: { v: 2, c: A }, likelihoodAnswers: { v: 2, c: A } };
  const merge = (patch: Record<string, unknown>, baseVersion = 1) =>
    mergeFieldPatch({ current: finding, stamps, patch, baseVersion, clientId: B, nextVersion: 3, userId: 'user-b', at: '2026-03-01T09:00:00.000Z', policies: FINDING_MERGE_POLICIES });

  it('keeps the public below when a later unseen edit says hard hats, and keeps the milder value in the conflict with its writer', () => {
    const result = merge({ exposure: 'hard-hats' });
    expect(result.changes).toEqual({});
    expect(result.stamps.exposure).toEqual(stamps.exposure);
    expect(result.conflicts).toEqual([
      { field: 'exposure', currentValue: 'public', replacedValue: 'hard-hats', replacedStamp: { v: 3, c: B, u: 'user-b', t: '2026-03-01T09:00:00.000Z' } },
    ]);
  });

  it('lets a more restrictive later value stand and keeps the milder one it replaced', () => {
    const result = mergeFieldPatch({ current: { exposure: 'hard-hats' }, stamps, patch: { exposure: 'public' }, baseVersion: 1, clientId: B, nextVersion: 3, policies: FINDING_MERGE_POLICIES });
    expect(result.changes).toEqual({ exposure: 'public' });
    expect(result.conflicts).toEqual([{ field: 'exposure', currentValue: 'public', replacedValue: 'hard-hats', replacedStamp: stamps.exposure }]);
  });

  it('keeps the higher fall and the answers that make a strike likelier', () => {
    expect(merge({ heightM: 8 }).changes).toEqual({});
    expect(merge({ heightM: 20 }).changes).toEqual({ heightM: 20 });
    const likelier = { ...finding.likelihoodAnswers, securing: 'loose', edgeDistance: 'at-edge', footTraffic: 'frequent' };
    expect(merge({ likelihoodAnswers: likelier }).changes).toEqual({ likelihoodAnswers: likelier });
  });

  it('keeps both notes when they clash, the stored one first', () => {
    const result = merge({ notes: 'clip tied back' });
    expect(result.changes).toEqual({ notes: 'loose clip\n\nclip tied back' });
    expect(result.conflicts).toEqual([{ field: 'notes', currentValue: 'loose clip\n\nclip tied back', replacedValue: 'loose clip', replacedStamp: stamps.notes }]);
  });

  it('writes a seen edit as it is, whatever its policy', () => {
    expect(merge({ exposure: 'hard-hats', notes: 'new text' }, 2)).toMatchObject({ changes: { exposure: 'hard-hats', notes: 'new text' }, conflicts: [] });
  });

  it('keeps a text that holds the other as it is', () => {
    expect(bothTexts('loose clip', 'loose clip, tied back')).toBe('loose clip, tied back');
    expect(bothTexts('loose clip, tied back', 'tied back')).toBe('loose clip, tied back');
    expect(bothTexts('', 'new')).toBe('new');
  });

  it('keeps a closed tag over a limited one, and a failed control over a pass', () => {
    const tag = mergeFieldPatch({ current: { status: 'closed' }, stamps: { status: { v: 2, c: A } }, patch: { status: 'cleared' }, baseVersion: 1, clientId: B, nextVersion: 3, policies: SCAFFOLD_MERGE_POLICIES });
    expect(tag.changes).toEqual({});
    expect(tag.conflicts[0]).toMatchObject({ currentValue: 'closed', replacedValue: 'cleared' });
    const raised = mergeFieldPatch({ current: { status: 'cleared' }, stamps: { status: { v: 2, c: A } }, patch: { status: 'limited' }, baseVersion: 1, clientId: B, nextVersion: 3, policies: SCAFFOLD_MERGE_POLICIES });
    expect(raised.changes).toEqual({ status: 'limited' });
    const check = mergeFieldPatch({ current: { result: 'fail' }, stamps: { result: { v: 2, c: A } }, patch: { result: 'pass' }, baseVersion: 1, clientId: B, nextVersion: 3, policies: CONTROL_CHECK_MERGE_POLICIES });
    expect(check.changes).toEqual({});
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
