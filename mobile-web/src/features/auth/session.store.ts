import type { Units, WindUnits } from '@plummet/shared';
import { clearLocalData, readMeta, writeMeta, type PlummetDb } from '../../local-db/db';
import { enqueueChange } from '../../local-db/outbox';
import { restoreSession, type StoredSession } from './session';

export const SESSION_KEY = 'session';

/** The stored session, or undefined when there is none or what is stored is not a session. */
export async function readSession(database: PlummetDb): Promise<StoredSession | undefined> {
  return restoreSession(await readMeta(database, SESSION_KEY));
}

export async function saveSession(database: PlummetDb, session: StoredSession): Promise<void> {
  await writeMeta(database, SESSION_KEY, session);
}

/**
 * Signing in as someone else must not mix two people's records: when the phone holds another
 * user's data, it is cleared first (the sign-out warning has already covered unsent changes).
 */
export async function startSession(database: PlummetDb, session: StoredSession): Promise<void> {
  const previous = await readMeta<{ user?: { id?: string; organisation?: { id?: string } } }>(database, SESSION_KEY);
  const sameUser = previous?.user?.id === session.user.id && previous?.user?.organisation?.id === session.user.organisation.id;
  if (previous && !sameUser) await clearLocalData(database);
  await saveSession(database, session);
}

/** The user's display units: the local profile changes now, the server hears through the outbox. */
export async function changeUnits(database: PlummetDb, units: Units): Promise<void> {
  await database.transaction('rw', database.meta, database.outbox, async () => {
    const session = await readSession(database);
    if (!session) throw new Error('Sign in first.');
    await saveSession(database, { ...session, user: { ...session.user, units } });
    await enqueueChange(database, session.user.id, { entity: 'user', action: 'update', payload: { units } });
  });
}

/** The user's wind unit, apart from the display units; saved and sent the same way as the units. */
export async function changeWindUnits(database: PlummetDb, windUnits: WindUnits): Promise<void> {
  await database.transaction('rw', database.meta, database.outbox, async () => {
    const session = await readSession(database);
    if (!session) throw new Error('Sign in first.');
    await saveSession(database, { ...session, user: { ...session.user, windUnits } });
    await enqueueChange(database, session.user.id, { entity: 'user', action: 'update', payload: { windUnits } });
  });
}

/** Clears every local record, photo, waiting change and the session. */
export async function signOutLocally(database: PlummetDb): Promise<void> {
  await clearLocalData(database);
}
