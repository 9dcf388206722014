import { Icon } from './ionic-elements';
import { alertCircleOutline, syncOutline, warningOutline } from 'ionicons/icons';
import { Link } from 'react-router-dom';
import { useAppSyncEngine, useSyncStatus } from '../features/sync/sync-hooks';
import { attentionWords, lastSyncWords } from '../sync/sync-words';
import { OutboxBadge } from './OutboxBadge';

/**
 * The header's sync status: changes waiting, when the phone last synced, and what needs the
 * user (conflicts, refused changes, old unsent data). A tap opens the Sync status screen.
 */
export function SyncBadge() {
  const engine = useAppSyncEngine();
  const status = useSyncStatus(engine);
  const attention = attentionWords(status);
  return (
    <Link to="/sync" className="sync-badge" data-testid="sync-badge" aria-label="Sync status">
      <OutboxBadge />
      {engine && (
        <span className="status-chip" data-testid="last-sync" data-state={status?.state ?? 'starting'} role="status">
          <Icon icon={syncOutline} aria-hidden="true" />
          {lastSyncWords(status)}
        </span>
      )}
      {attention && (
        <span className="status-chip status-chip--waiting" data-testid="sync-attention">
          <Icon icon={alertCircleOutline} aria-hidden="true" />
          {attention}
        </span>
      )}
      {status?.unsyncedWarning && (
        <span className="status-chip status-chip--waiting" data-testid="unsynced-warning-chip">
          <Icon icon={warningOutline} aria-hidden="true" />
          Unsent for over 3 days
        </span>
      )}
    </Link>
  );
}
