import { describe, expect, it } from 'vitest';
import { attentionWords, lastSyncWords, pendingWords } from './sync-words';

describe('sync words', () => {
  it('names the last sync by its time today and by its day before', () => {
    const now = new Date(2026, 2, 5, 15, 0);
    expect(lastSyncWords({ state: 'idle', lastSyncAt: new Date(2026, 2, 5, 9, 12).toISOString() }, now)).toBe('Synced 09:12');
    expect(lastSyncWords({ state: 'idle', lastSyncAt: new Date(2026, 2, 3, 9, 12).toISOString() }, now)).toBe('Synced 3 Mar, 09:12');
    expect(lastSyncWords({ state: 'offline', lastSyncAt: null }, now)).toBe('Not synced yet (no connection)');
    expect(lastSyncWords({ state: 'syncing', lastSyncAt: null }, now)).toBe('Syncing…');
  });

  it('counts what waits and what needs the user', () => {
    expect(pendingWords(0)).toBe('All changes sent');
    expect(pendingWords(2)).toBe('2 changes waiting to send');
    expect(attentionWords({ openConflicts: [], rejected: [] })).toBeUndefined();
    expect(attentionWords({ openConflicts: [{} as never], rejected: [{} as never, {} as never] })).toBe('1 conflict to settle, 2 changes refused');
  });
});
