import type { ScaffoldStatusChange } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { db } from '../../local-db/db';
import { changeScaffoldStatus } from './scaffolds.store';

/** Sets the tag on this phone; the sync sends it when there is a connection. */
export function useChangeScaffoldStatusMutation() {
  return useMutation({
    mutationFn: ({ scaffoldId, change }: { scaffoldId: string; change: ScaffoldStatusChange }) => changeScaffoldStatus(db, scaffoldId, change),
    meta: { errorToast: 'The tag could not be saved on this phone.' },
  });
}
