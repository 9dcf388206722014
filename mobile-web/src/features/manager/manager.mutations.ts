import { useMutation, useQueryClient } from '@tanstack/react-query';
import { assignFinding, reopenFinding, retryMailJob, settleConflict } from './manager.api';
import { managerKeys } from './manager.queries';

/** After any manager action every manager figure may have moved: refetch them all. */
function useRefreshAll() {
  const client = useQueryClient();
  return () => client.invalidateQueries({ queryKey: managerKeys.all });
}

export function useAssignFindingsMutation() {
  const refresh = useRefreshAll();
  return useMutation({
    mutationFn: async (input: { ids: string[]; assigneeId: string | null; dueAt: string | null }) => {
      // One request per finding: each is its own command with its own audit event and checks.
      for (const id of input.ids) await assignFinding(id, input.assigneeId, input.dueAt);
    },
    onSettled: refresh,
    meta: { errorToast: 'Assigning failed; the list shows what was saved.' },
  });
}

export function useReopenFindingMutation() {
  const refresh = useRefreshAll();
  return useMutation({
    mutationFn: (input: { id: string; note: string }) => reopenFinding(input.id, input.note),
    onSettled: refresh,
  });
}

export function useSettleConflictMutation() {
  const refresh = useRefreshAll();
  return useMutation({
    mutationFn: (input: { id: string; keep: 'current' | 'replaced' }) => settleConflict(input.id, input.keep),
    onSettled: refresh,
  });
}

export function useRetryMailJobMutation() {
  const refresh = useRefreshAll();
  return useMutation({
    mutationFn: (id: string) => retryMailJob(id),
    onSettled: refresh,
  });
}
