import { describe, expect, it } from 'vitest';
import { ROLE_VALUES, type Role } from '../auth/roles.js';
import { checkFindingTransition, FINDING_STATES, type FindingState, nextFindingStates } from './finding-state.js';

type Expect = 'ok' | 'illegal' | 'role' | 'scope';

/** Every (from, to) pair for each role, foreman in scope; "·" marks a move that does not exist. */
const TABLE: [FindingState, FindingState, Record<Role, Expect>][] = [
  ['open', 'made-safe', { inspector: 'ok', manager: 'ok', foreman: 'ok', admin: 'role' }],
  ['open', 'fixed', { inspector: 'ok', manager: 'ok', foreman: 'ok', admin: 'role' }],
  ['made-safe', 'fixed', { inspector: 'ok', manager: 'ok', foreman: 'ok', admin: 'role' }],
  ['fixed', 'verified', { inspector: 'ok', manager: 'ok', foreman: 'role', admin: 'role' }],
  ['fixed', 'open', { inspector: 'ok', manager: 'ok', foreman: 'role', admin: 'role' }],
  ['verified', 'open', { inspector: 'ok', manager: 'ok', foreman: 'role', admin: 'role' }],
];

describe('checkFindingTransition', () => {
  for (const [from, to, byRole] of TABLE) {
    for (const role of ROLE_VALUES) {
      it(`answers ${byRole[role]} when a ${role} moves a finding from ${from} to ${to}`, () => {
        const check = checkFindingTransition(from, to, role, true);
        expect(check.ok ? 'ok' : check.reason).toBe(byRole[role]);
      });
    }
  }

  it('refuses every move that is not in the table, for every role', () => {
    const legal = new Set(TABLE.map(([f, t]) => `${f}>${t}`));
    for (const from of FINDING_STATES) {
      for (const to of FINDING_STATES) {
        if (legal.has(`${from}>${to}`)) continue;
        for (const role of ROLE_VALUES) expect(checkFindingTransition(from, to, role, true)).toEqual({ ok: false, reason: 'illegal' });
      }
    }
  });

  it('lets a foreman fix only within their scaffolds and assignments', () => {
    expect(checkFindingTransition('open', 'fixed', 'foreman', false)).toEqual({ ok: false, reason: 'scope' });
    expect(checkFindingTransition('open', 'fixed', 'foreman', true).ok).toBe(true);
  });

  it('names what each move records', () => {
    const kind = (from: FindingState, to: FindingState) => {
      const c = checkFindingTransition(from, to, 'manager');
      return c.ok ? c.transition.kind : c.reason;
    };
    expect([kind('open', 'made-safe'), kind('made-safe', 'fixed'), kind('fixed', 'verified'), kind('verified', 'open')]).toEqual([
      'make-safe',
      'fix',
      'verify',
      'reopen',
    ]);
  });
});

describe('nextFindingStates', () => {
  it('offers a foreman a made-safe measure or the fix of an open finding, never a verification', () => {
    expect(nextFindingStates('open', 'foreman').sort()).toEqual(['fixed', 'made-safe']);
    expect(nextFindingStates('fixed', 'foreman')).toEqual([]);
  });

  it('offers an inspector verify or reopen of a fixed finding', () => {
    expect(nextFindingStates('fixed', 'inspector').sort()).toEqual(['open', 'verified']);
  });

  it('offers an admin nothing', () => {
    for (const s of FINDING_STATES) expect(nextFindingStates(s, 'admin')).toEqual([]);
  });
});
