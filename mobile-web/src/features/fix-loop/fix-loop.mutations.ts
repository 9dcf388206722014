import type { OrganisationSettings } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { db } from '../../local-db/db';
import { newId } from '../../local-db/ids';
import { preparePhotoRecords } from '../photos/photos.store';
import type { FixActionValues } from './components/FixActionForm';
import { handBackFinding, recordFix, recordMadeSafe, recordVerification, type Actor } from './fix-loop.store';

/**
 * One action on a finding, saved on the phone (the sync sends it). Photos are turned into records
 * before the transaction: reading a Blob would end a Dexie transaction early.
 */
export async function applyFixAction(findingId: string, values: FixActionValues, actor: Actor, settings: OrganisationSettings): Promise<void> {
  const recordId = newId();
  const ownerType = values.kind === 'made-safe' ? 'finding' : values.kind === 'fixed' ? 'fix' : 'verification';
  const photos = await preparePhotoRecords(db, values.photos, { ownerType, ownerId: ownerType === 'finding' ? findingId : recordId });
  const action = { note: values.note, control: values.control, zoneRadiusM: values.zoneRadiusM, recordId, photos };
  switch (values.kind) {
    case 'made-safe':
      await recordMadeSafe(db, findingId, action, actor, settings);
      return;
    case 'fixed':
      await recordFix(db, findingId, action, actor, settings);
      return;
    case 'verify':
    case 'reopen':
      await recordVerification(db, findingId, { outcome: values.kind === 'verify' ? 'verified' : 'reopened', note: values.note, recordId, photos }, actor, settings);
      return;
    case 'hand-back':
      await handBackFinding(db, findingId, { reason: values.reason!, note: values.note }, actor);
  }
}

/** Refusals (FixLoopRefusal) are shown in the form itself, so no toast here. */
export function useFixActionMutation() {
  return useMutation({
    mutationFn: (input: { findingId: string; values: FixActionValues; actor: Actor; settings: OrganisationSettings }) =>
      applyFixAction(input.findingId, input.values, input.actor, input.settings),
    meta: { errorToast: false },
  });
}
