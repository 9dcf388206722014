import { useLiveQuery } from 'dexie-react-hooks';
import { db } from './db';
import { countWaitingChanges } from './outbox';

/** How many changes wait in the outbox, live (undefined while loading). */
export function useWaitingChangeCount(): number | undefined {
  return useLiveQuery(() => countWaitingChanges(db), []);
}
