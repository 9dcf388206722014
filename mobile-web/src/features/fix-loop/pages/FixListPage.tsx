import { IonButton, IonContent, IonFooter, IonPage } from '@ionic/react';
import { AppHeader } from '../../../components/AppHeader';
import { VirtualList } from '../../../components/VirtualList';
import { RequireSession } from '../../auth/components/RequireSession';
import { useSession, useUnits } from '../../auth/session.queries';
import { FIX_ROW_HEIGHT, FixListRow } from '../components/FixListRow';
import { useFixList, useSitesById } from '../fix-loop.queries';
import { useOrganisationSettings } from '../organisation-settings.queries';
import '../fix-loop.css';

/**
 * The foreman's home: the findings to deal with, from the phone's database (works with no
 * signal), High first, then the soonest due, then the highest up.
 */
export function FixListPage() {
  const { session } = useSession();
  const units = useUnits();
  const settings = useOrganisationSettings();
  const entries = useFixList(session?.user.id, settings);
  const sites = useSitesById();
  const overdue = entries?.filter((entry) => entry.due.overdue).length ?? 0;

  return (
    <IonPage>
      <AppHeader title="Fix list" />
      <IonContent scrollY={false} data-testid="fix-list-page">
        <RequireSession>
          {() => (
            <div className="fix-layout">
              <div className="fix-summary" data-testid="fix-list-summary">
                <span>
                  {entries === undefined ? 'Opening…' : `${entries.length} to fix`}
                </span>
                <span className={overdue ? 'fix-summary__overdue' : 'muted'} data-testid="fix-list-overdue">
                  {overdue === 0 ? 'none overdue' : `${overdue} overdue`}
                </span>
              </div>
              <div className="fix-layout__list">
                {entries && entries.length === 0 ? (
                  <p className="empty-note ion-margin">Nothing to fix on this phone. New findings arrive when the phone syncs.</p>
                ) : (
                  <VirtualList
                    items={entries ?? []}
                    rowHeight={FIX_ROW_HEIGHT}
                    rowKey={(entry) => entry.finding.id}
                    renderRow={(entry) => <FixListRow entry={entry} site={sites?.get(entry.finding.siteId)} units={units} />}
                    label="Findings to fix, highest risk and soonest due first"
                    testId="fix-list"
                  />
                )}
              </div>
            </div>
          )}
        </RequireSession>
      </IonContent>
      <IonFooter>
        <div className="bottom-actions">
          <IonButton fill="outline" routerLink="/shift" data-testid="open-shift">
            Shift start
          </IonButton>
          <IonButton fill="outline" routerLink="/sync" data-testid="open-sync">
            Sync
          </IonButton>
          <IonButton fill="outline" routerLink="/settings" data-testid="open-settings">
            Settings
          </IonButton>
        </div>
      </IonFooter>
    </IonPage>
  );
}
