import type { ScaffoldTriggerCreate } from '@plummet/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { db } from '../../local-db/db';
import type { ScaffoldRecord } from '../../local-db/records';
import { postTrigger } from './register.api';
import { registerKeys } from './register.queries';

/**
 * Records "altered" or "adverse weather" on the server (online only: it changes the tag for
 * everyone at once), then keeps the closed scaffold on this phone without waiting for the sync.
 */
export function useRecordTriggerMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ scaffold, body }: { scaffold: ScaffoldRecord; body: ScaffoldTriggerCreate }) => {
      const result = await postTrigger(scaffold.id, body);
      const local = await db.scaffolds.get(scaffold.id);
      if (!local || result.scaffold.version >= local.version) await db.scaffolds.put({ ...result.scaffold, organisationId: scaffold.organisationId });
      return result;
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: registerKeys.all }),
    meta: { errorToast: 'The scaffold could not be closed from here. Check the connection and try again.' },
  });
}
