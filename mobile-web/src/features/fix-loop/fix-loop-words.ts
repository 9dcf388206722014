import type { FindingControl, HandBackReason } from '@plummet/shared';

/** The controls in plain words, for the choice and for the history. */
export const CONTROL_WORDS: Record<FindingControl, string> = {
  tether: 'Tied on (tethered)',
  'move-back': 'Moved back from the edge',
  lower: 'Lowered to the ground',
  remove: 'Removed from the scaffold',
  'close-zone': 'Zone below closed',
  'fit-toe-board': 'Toe board fitted',
  'fit-brick-guard': 'Brick guard fitted',
  'fit-netting': 'Netting fitted',
  'fit-fan': 'Fan fitted',
};

export const HAND_BACK_WORDS: Record<HandBackReason, string> = {
  'needs-scaffolders': 'Needs the scaffolders',
  'not-my-area': 'Not in my area',
  'cannot-fix': 'Cannot fix it',
};

/** Why an alteration is not the foreman's own job, in words a foreman reads on site. */
export const ALTERATION_WORDS =
  'This changes the scaffold itself: it is an alteration for the scaffold contractor’s people (in the US made under a competent person, OSHA 29 CFR 1926.451(f)(7)). Once recorded, the scaffold needs inspecting before anyone uses it again.';
