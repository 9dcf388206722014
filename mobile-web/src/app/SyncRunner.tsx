import { useEffect } from 'react';
import { useSession } from '../features/auth/session.queries';
import { startAppSync, stopAppSync } from '../sync/app-sync';
import { whenIdle } from './after-first-screen';

/**
 * Keeps the sync engine running while a session is active (loaded lazily by App, so the local
 * database stays out of the first download). An expired sign-in stops it until the user signs in again.
 */
export function SyncRunner() {
  const { status, session } = useSession();
  const userId = status === 'active' ? session?.user.id : undefined;
  useEffect(() => {
    if (status === 'loading') return;
    if (!userId) {
      void stopAppSync();
      return;
    }
    // The screen that has just read the same session draws first; the first run waits for a quiet moment.
    return whenIdle(() => startAppSync(userId));
  }, [status, userId]);
  return null;
}
