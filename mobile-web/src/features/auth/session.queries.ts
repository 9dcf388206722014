import { useLiveQuery } from 'dexie-react-hooks';
import { db } from '../../local-db/db';
import { sessionStatus, type SessionStatus, type StoredSession } from './session';
import { readSession } from './session.store';
import { defaultWindUnitsFor } from '@plummet/shared';
import type { Units, WindUnits } from '../../lib/units';

export interface SessionState {
  status: 'loading' | SessionStatus;
  session?: StoredSession;
}

/** The session on this phone, live: signing in or out anywhere in the app updates every screen. */
export function useSession(): SessionState {
  const read = useLiveQuery(async () => ({ session: await readSession(db) }), []);
  if (!read) return { status: 'loading' };
  return { status: sessionStatus(read.session), session: read.session };
}

/** The signed-in user's display units (SI until known). */
export function useUnits(): Units {
  return useSession().session?.user.units ?? 'si';
}

/** The signed-in user's wind unit (a profile saved before it existed: the one that goes with the units). */
export function useWindUnits(): WindUnits {
  const user = useSession().session?.user;
  return user?.windUnits ?? defaultWindUnitsFor(user?.units ?? 'si');
}
