import { useSyncExternalStore } from 'react';
import { isOnline, subscribeToConnectivity } from './connectivity';

/** True while the Plummet server can be reached (see connectivity.ts). */
export function useOnlineStatus(): boolean {
  return useSyncExternalStore(subscribeToConnectivity, isOnline, () => true);
}
