import { IonButton, IonContent, IonPage } from '@ionic/react';
import { useState } from 'react';
import { formatDateTime } from '../../../lib/format-date';
import { AppHeader } from '../../../components/AppHeader';
import { FormSection } from '../../../components/FormSection';
import { Spinner } from '../../../components/Spinner';
import { db } from '../../../local-db/db';
import type { SyncRunOutcome } from '../../../sync/sync-engine';
import { dismissRejected } from '../../../sync/sync-state';
import { useAppSyncEngine, useSyncStatus } from '../sync-hooks';
import { lastSyncWords, pendingWords, UNSYNCED_WARNING_TEXT } from '../../../sync/sync-words';
import { RequireSession } from '../../auth/components/RequireSession';
import { OverdueFixes } from '../../fix-loop/components/OverdueFixes';
import { ConflictCard } from '../components/ConflictCard';
import './SyncStatusPage.css';

const OUTCOME_WORDS: Record<SyncRunOutcome, string> = {
  done: 'Sync finished.',
  offline: 'No connection to the Plummet server: your changes stay on this phone and go when it connects.',
  error: 'Sync stopped with an error; it tries again by itself.',
};

/** What this phone has sent and not sent, what the server refused, and the conflicts to settle. */
export function SyncStatusPage() {
  const engine = useAppSyncEngine();
  const status = useSyncStatus(engine, 2000);
  const [outcome, setOutcome] = useState<SyncRunOutcome>();
  const syncNow = async () => {
    if (!engine) return;
    setOutcome(undefined);
    setOutcome(await engine.sync());
  };

  return (
    <IonPage>
      <AppHeader title="Sync status" backHref="/" />
      <IonContent className="ion-padding" data-testid="sync-page">
        <RequireSession>
          {(session) =>
            !status ? (
              <div className="loading-note" role="status">
                <Spinner /> Opening…
              </div>
            ) : (
              <div className="page-body">
                {status.unsyncedWarning && (
                  <p className="sync-warning" role="alert" data-testid="unsynced-warning">
                    {UNSYNCED_WARNING_TEXT} The oldest is from {formatDateTime(status.oldestPendingAt)}.
                  </p>
                )}
                <FormSection title="This phone">
                  <p data-testid="sync-last">{lastSyncWords(status)}</p>
                  <p data-testid="sync-pending" data-count={status.pending}>
                    {pendingWords(status.pending)}
                  </p>
                  {session.user.role === 'foreman' && <OverdueFixes userId={session.user.id} />}
                  {status.lastError && status.state !== 'idle' && <p className="muted">{status.lastError}</p>}
                  <IonButton expand="block" disabled={status.state === 'syncing'} onClick={() => void syncNow()} data-testid="sync-now">
                    {status.state === 'syncing' ? 'Syncing…' : 'Sync now'}
                  </IonButton>
                  {outcome && (
                    <p role="status" data-testid="sync-outcome" data-outcome={outcome}>
                      {OUTCOME_WORDS[outcome]}
                    </p>
                  )}
                </FormSection>
                {session.user.role !== 'foreman' && (
                  <FormSection title="Conflicts to settle" testId="conflicts">
                    {status.openConflicts.length === 0 ? (
                      <p className="muted" data-testid="no-conflicts">
                        No conflicts: nobody’s change has replaced another they had not seen.
                      </p>
                    ) : (
                      status.openConflicts.map((conflict) => <ConflictCard key={conflict.id} conflict={conflict} userId={session.user.id} units={session.user.units} windUnits={session.user.windUnits} />)
                    )}
                  </FormSection>
                )}
                <FormSection title="Changes the server refused" testId="rejected">
                  {status.rejected.length === 0 ? (
                    <p className="muted" data-testid="no-rejected">
                      None.
                    </p>
                  ) : (
                    <ul className="rejected-list">
                      {status.rejected.map((rejected, index) => (
                        <li key={`${rejected.at}-${index}`} data-testid="rejected-change">
                          <strong>
                            {rejected.entity} {rejected.action}
                          </strong>{' '}
                          ({formatDateTime(rejected.at)}): {rejected.reason}
                          <IonButton size="small" fill="clear" onClick={() => void dismissRejected(db, index).then(() => engine?.sync())}>
                            Dismiss
                          </IonButton>
                        </li>
                      ))}
                    </ul>
                  )}
                </FormSection>
              </div>
            )
          }
        </RequireSession>
      </IonContent>
    </IonPage>
  );
}
