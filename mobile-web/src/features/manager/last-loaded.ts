/**
 * The last answer of each manager query, kept in localStorage so the screens stay readable with no
 * connection (with a note that the figures may be stale). Entries carry the user's id: another
 * user signing in on the same browser never sees them, and they are dropped on the next write.
 */
const PREFIX = 'plummet.last-loaded.';

interface Entry {
  userId: string;
  at: number;
  data: unknown;
}

const storageKey = (key: readonly unknown[]) => PREFIX + JSON.stringify(key);

function storage(): Storage | undefined {
  try {
    return typeof localStorage === 'undefined' ? undefined : localStorage;
  } catch {
    return undefined;
  }
}

export function readLastLoaded(userId: string, key: readonly unknown[]): { data: unknown; at: number } | undefined {
  const raw = storage()?.getItem(storageKey(key));
  if (!raw) return undefined;
  try {
    const entry = JSON.parse(raw) as Entry;
    return entry.userId === userId ? { data: entry.data, at: entry.at } : undefined;
  } catch {
    return undefined;
  }
}

export function writeLastLoaded(userId: string, key: readonly unknown[], data: unknown, at = Date.now()): void {
  const store = storage();
  if (!store) return;
  try {
    for (let i = store.length - 1; i >= 0; i--) {
      const k = store.key(i);
      if (k?.startsWith(PREFIX) && !store.getItem(k)?.includes(`"userId":"${userId}"`)) store.removeItem(k);
    }
    store.setItem(storageKey(key), JSON.stringify({ userId, at, data } satisfies Entry));
  } catch {
    // Full or blocked storage: the screen still works online, it just cannot be read offline later.
  }
}
