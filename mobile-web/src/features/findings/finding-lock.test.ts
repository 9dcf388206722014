import { describe, expect, it } from 'vitest';
import { findingLock } from './finding-lock';

const ID = '0f000000-0000-4000-8000-000000000001';

describe('when the finding editor is read-only', () => {
  it('lets an inspector edit a finding of a walk still under way, and record new ones in it', () => {
    expect(findingLock({ role: 'inspector', findingId: ID, inspectionSigned: false })).toBeNull();
    expect(findingLock({ role: 'inspector', inspectionSigned: false })).toBeNull();
  });

  it('keeps a signed inspection’s findings as signed, and sends the inspector to the fix list to make safe or fix', () => {
    expect(findingLock({ role: 'inspector', findingId: ID, inspectionSigned: true })).toEqual({ reason: expect.stringMatching(/signed inspection/), fixHref: `/fix-list/${ID}` });
    expect(findingLock({ role: 'inspector', inspectionSigned: true })?.reason).toMatch(/new inspection/);
  });

  it('never leaves a foreman without a way to act: a finding of a signed inspection or not, the fix list makes it safe or fixes it', () => {
    for (const inspectionSigned of [true, false]) {
      expect(findingLock({ role: 'foreman', findingId: ID, inspectionSigned })).toEqual({ reason: expect.stringMatching(/fix list/), fixHref: `/fix-list/${ID}` });
    }
  });
});
