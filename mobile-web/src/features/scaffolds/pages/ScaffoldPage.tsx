import type { ScaffoldRecord } from '../../../local-db/records';
import { IonButton, IonContent, IonFooter, IonPage, useIonRouter } from '@ionic/react';
import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { formatDate, formatDateTime, isPast } from '../../../lib/format-date';
import { AppHeader } from '../../../components/AppHeader';
import { CautionNote } from '../../../components/CautionNote';
import { RequireSession } from '../../auth/components/RequireSession';
import { useUnits, useWindUnits } from '../../auth/session.queries';
import { useFindingsOfScaffold } from '../../findings/findings.queries';
import { StartInspectionSheet } from '../../inspections/components/StartInspectionSheet';
import { useInspectionInProgress } from '../../inspections/inspections.queries';
import { useStartInspectionMutation } from '../../inspections/inspections.mutations';
import { ExclusionZoneSection } from '../../register/components/ExclusionZoneSection';
import { LastReportSection } from '../../register/components/LastReportSection';
import { TriggerCard } from '../../register/components/TriggerCard';
import { ScaffoldElevations } from '../components/ScaffoldElevations';
import { ScaffoldStatusTag } from '../components/ScaffoldStatusTag';
import { TagChangeSection } from '../components/TagChangeSection';
import { useScaffold } from '../scaffolds.queries';
import './ScaffoldPage.css';

export function ScaffoldPage() {
  const { scaffoldId } = useParams();
  const router = useIonRouter();
  const units = useUnits();
  const windUnits = useWindUnits();
  const scaffold = useScaffold(scaffoldId);
  const findings = useFindingsOfScaffold(scaffoldId);
  const walk = useInspectionInProgress(scaffoldId);
  const start = useStartInspectionMutation();
  const [starting, setStarting] = useState(false);

  return (
    <IonPage>
      <AppHeader title={scaffold ? `Scaffold ${scaffold.reference}` : 'Scaffold'} backHref={scaffold ? `/sites/${scaffold.siteId}` : '/'} />
      <IonContent className="ion-padding" data-testid="scaffold-page">
        <RequireSession>
          {(session) => (
            <div className="page-body">
              {scaffold === null && <p className="empty-note">This scaffold is not on this phone.</p>}
              {scaffold && (
                <>
                  <div className="scaffold-summary">
                    <ScaffoldStatusTag status={scaffold.status} recorded={tagRecordedWords(scaffold)} />
                    <dl className="data-list">
                      <dt>Last inspected</dt>
                      <dd data-testid="last-inspected">{formatDateTime(scaffold.lastInspectedAt)}</dd>
                      <dt>Next due</dt>
                      <dd className={isPast(scaffold.nextDueAt) ? 'scaffold-summary__overdue' : undefined} data-testid="next-due">
                        {formatDate(scaffold.nextDueAt)}
                        {isPast(scaffold.nextDueAt) ? ' (overdue)' : ''}
                      </dd>
                      <dt>Open findings</dt>
                      <dd>{findings?.filter((f) => f.state === 'open' || f.state === 'made-safe').length ?? '…'}</dd>
                    </dl>
                    <p className="muted scaffold-summary__description">{scaffold.description}</p>
                  </div>
                  {session.user.role !== 'foreman' && <TagChangeSection scaffold={scaffold} />}
                  <TriggerCard scaffold={scaffold} />
                  <LastReportSection scaffold={scaffold} />
                  <ExclusionZoneSection scaffoldId={scaffold.id} units={units} windUnits={windUnits} canEdit={session.user.role !== 'foreman'} />
                  <ScaffoldElevations scaffold={scaffold} findings={findings ?? []} units={units} />
                  <CautionNote />
                  <StartInspectionSheet
                    isOpen={starting}
                    scaffoldReference={scaffold.reference}
                    windUnits={windUnits}
                    onCancel={() => setStarting(false)}
                    onStart={({ reason, windSpeedMps }) =>
                      start.mutate(
                        { scaffold, inspectorId: session.user.id, reason, windSpeedMps },
                        {
                          onSuccess: (inspection) => {
                            setStarting(false);
                            router.push(`/inspections/${inspection.id}`, 'forward');
                          },
                        },
                      )
                    }
                  />
                </>
              )}
            </div>
          )}
        </RequireSession>
      </IonContent>
      {scaffold && walk !== undefined && (
        <IonFooter>
          <div className="bottom-actions">
            {walk ? (
              <IonButton routerLink={`/inspections/${walk.id}`} data-testid="continue-inspection">
                Continue the walk
              </IonButton>
            ) : (
              <IonButton onClick={() => setStarting(true)} data-testid="start-inspection">
                Start an inspection
              </IonButton>
            )}
          </div>
        </IonFooter>
      )}
    </IonPage>
  );
}

/** When the tag in place was set; from data before that was kept, the last inspection that recorded it. */
function tagRecordedWords(scaffold: Pick<ScaffoldRecord, 'statusSetAt' | 'lastInspectedAt'>): string | null {
  if (scaffold.statusSetAt) return `set ${formatDateTime(scaffold.statusSetAt)}`;
  return scaffold.lastInspectedAt ? `as recorded ${formatDateTime(scaffold.lastInspectedAt)}` : null;
}
