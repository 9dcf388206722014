import type { ExclusionZonePut } from '@plummet/shared';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useOnlineStatus } from '../../lib/use-online-status';
import { fetchExclusionZones, putExclusionZone } from './exclusion-zone.api';

export const exclusionZoneKeys = {
  ofScaffold: (scaffoldId: string) => ['exclusion-zones', scaffoldId] as const,
};

/** The exclusion zones of a scaffold, from the server (online only: the suggestion is worked out there). */
export function useExclusionZones(scaffoldId: string) {
  const online = useOnlineStatus();
  return useQuery({ queryKey: exclusionZoneKeys.ofScaffold(scaffoldId), queryFn: () => fetchExclusionZones(scaffoldId), enabled: online, networkMode: 'online' });
}

export function useSaveExclusionZoneMutation(scaffoldId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ elevation, body }: { elevation: string; body: ExclusionZonePut }) => putExclusionZone(scaffoldId, elevation, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: exclusionZoneKeys.ofScaffold(scaffoldId) }),
    meta: { errorToast: 'The exclusion zone could not be saved. Check the connection and try again.' },
  });
}
