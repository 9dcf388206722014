import { describe, expect, it } from 'vitest';
import { findingLock } from './finding-lock';

const ID = '0f000000-0000-4000-8000-000000000001';

describe('when the finding editor is read-only (the server’s rules for finding commands)', () => {
  it('lets an inspector change a finding’s details, of a walk under way or of a signed inspection, as the server does', () => {
    expect(findingLock({ role: 'inspector', findingId: ID, inspectionSigned: false })).toBeNull();
    expect(findingLock({ role: 'inspector', findingId: ID, inspectionSigned: true })).toBeNull();
    expect(findingLock({ role: 'inspector', inspectionSigned: false })).toBeNull();
  });

  it('records no new finding in a signed inspection', () => {
    expect(findingLock({ role: 'inspector', inspectionSigned: true })?.reason).toMatch(/new inspection/);
  });

  it('never leaves a foreman without a way to act: a finding of a signed inspection or not, the fix list makes it safe or fixes it', () => {
    for (const inspectionSigned of [true, false]) {
      expect(findingLock({ role: 'foreman', findingId: ID, inspectionSigned })).toEqual({ reason: expect.stringMatching(/fix list/), fixHref: `/fix-list/${ID}` });
    }
  });
});
