/**
 * The life of a finding: open → made safe → fixed → verified, and back to open when a fix does not
 * hold. Written as data so the phone, the server and the tests read the same table.
 */
import type { Role } from '../auth/roles.js';

export const FINDING_STATES = ['open', 'made-safe', 'fixed', 'verified'] as const;
export type FindingState = (typeof FINDING_STATES)[number];

/** Plummet's words for each state, in full (a finding's page, the report, the e-mail). */
export const FINDING_STATE_WORDS: Readonly<Record<FindingState, string>> = {
  open: 'Open',
  'made-safe': 'Made safe for now',
  fixed: 'Fixed, waiting to be verified',
  verified: 'Verified',
};

/** The same in a word or two, for rows, table cells and filters. */
export const FINDING_STATE_SHORT: Readonly<Record<FindingState, string>> = {
  open: 'Open',
  'made-safe': 'Made safe',
  fixed: 'Fixed',
  verified: 'Verified',
};

/** What a transition records besides the new state: a fix row, a verification row, a note. */
export type FindingTransitionKind = 'make-safe' | 'fix' | 'verify' | 'reopen';

export interface FindingTransition {
  from: FindingState;
  to: FindingState;
  kind: FindingTransitionKind;
  roles: readonly Role[];
}

export const FINDING_TRANSITIONS: readonly FindingTransition[] = [
  // Secured on the spot: by the inspector, by the foreman on their scaffolds, or recorded by a manager.
  { from: 'open', to: 'made-safe', kind: 'make-safe', roles: ['inspector', 'foreman', 'manager'] },
  // A fix: the foreman's job, or recorded by an inspector or manager who saw it done.
  { from: 'open', to: 'fixed', kind: 'fix', roles: ['foreman', 'inspector', 'manager'] },
  { from: 'made-safe', to: 'fixed', kind: 'fix', roles: ['foreman', 'inspector', 'manager'] },
  // Only someone other than the fixer's trade checks the fix.
  { from: 'fixed', to: 'verified', kind: 'verify', roles: ['inspector', 'manager'] },
  { from: 'fixed', to: 'open', kind: 'reopen', roles: ['inspector', 'manager'] },
  { from: 'verified', to: 'open', kind: 'reopen', roles: ['inspector', 'manager'] },
];

export type FindingTransitionCheck =
  | { ok: true; transition: FindingTransition }
  /** `illegal`: no such edge; `role`: the edge exists but not for this role; `scope`: a foreman outside their scaffolds and assignments. */
  | { ok: false; reason: 'illegal' | 'role' | 'scope' };

/**
 * Whether `role` may move a finding from `from` to `to`. A foreman acts only on findings on
 * scaffolds where they are the foreman, or assigned to them (`foremanInScope`).
 */
export function checkFindingTransition(from: FindingState, to: FindingState, role: Role, foremanInScope = false): FindingTransitionCheck {
  const transition = FINDING_TRANSITIONS.find((t) => t.from === from && t.to === to);
  if (!transition) return { ok: false, reason: 'illegal' };
  if (!transition.roles.includes(role)) return { ok: false, reason: 'role' };
  if (role === 'foreman' && !foremanInScope) return { ok: false, reason: 'scope' };
  return { ok: true, transition };
}

/** The states a role may move a finding to from `from` (for the buttons a screen shows). */
export function nextFindingStates(from: FindingState, role: Role): FindingState[] {
  return FINDING_TRANSITIONS.filter((t) => t.from === from && t.roles.includes(role)).map((t) => t.to);
}

/** Open and made-safe findings still need a fix; past their due time they are overdue. */
export const UNFIXED_STATES: readonly FindingState[] = ['open', 'made-safe'];
