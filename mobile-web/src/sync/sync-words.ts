/** The words the app uses about sync (pure, so they are tested without a browser). */
import { lazyFormat } from '../lib/lazy-format';
import type { SyncStatus } from './sync-status';

const timeOnly = lazyFormat(() => new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' }));
const dayAndTime = lazyFormat(() => new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' }));

/** "Synced 09:12" today, "Synced 3 Mar, 09:12" before; what is happening when there is no finished sync to name. */
export function lastSyncWords(status: Pick<SyncStatus, 'state' | 'lastSyncAt'> | undefined, now: Date = new Date()): string {
  if (!status) return 'Sync starting';
  if (status.state === 'syncing') return 'Syncing…';
  if (!status.lastSyncAt) return status.state === 'offline' ? 'Not synced yet (no connection)' : 'Not synced yet';
  const at = new Date(status.lastSyncAt);
  const sameDay = at.toDateString() === now.toDateString();
  return `Synced ${sameDay ? timeOnly(at) : dayAndTime(at)}`;
}

export function pendingWords(count: number): string {
  return count === 0 ? 'All changes sent' : count === 1 ? '1 change waiting to send' : `${count} changes waiting to send`;
}

/** What needs the user: conflicts to settle and changes the server refused. Undefined when nothing does. */
export function attentionWords(status: Pick<SyncStatus, 'openConflicts' | 'rejected'> | undefined): string | undefined {
  if (!status) return undefined;
  const parts: string[] = [];
  const conflicts = status.openConflicts.length;
  const rejected = status.rejected.length;
  if (conflicts) parts.push(conflicts === 1 ? '1 conflict to settle' : `${conflicts} conflicts to settle`);
  if (rejected) parts.push(rejected === 1 ? '1 change refused' : `${rejected} changes refused`);
  return parts.length ? parts.join(', ') : undefined;
}

export const UNSYNCED_WARNING_TEXT =
  'Some changes on this phone are more than three days old and have not reached the server. Some phone browsers delete the data of a site not used for a week: connect and sync soon.';
