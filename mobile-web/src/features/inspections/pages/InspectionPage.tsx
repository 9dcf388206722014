import { IonButton, IonContent, IonFooter, IonPage, useIonRouter } from '@ionic/react';
import { CONTROLS } from '@plummet/shared';
import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { formatDateTime } from '../../../lib/format-date';
import { AppHeader } from '../../../components/AppHeader';
import { CautionNote } from '../../../components/CautionNote';
import { TabBar } from '../../../components/TabBar';
import { RequireSession } from '../../auth/components/RequireSession';
import { useUnits, useWindUnits } from '../../auth/session.queries';
import { FindingRow } from '../../findings/components/FindingRow';
import { useFindingsOfInspection, useFindingsOfScaffold } from '../../findings/findings.queries';
import { ScaffoldElevations } from '../../scaffolds/components/ScaffoldElevations';
import { useScaffold } from '../../scaffolds/scaffolds.queries';
import { formatWind } from '../../../lib/units';
import { ControlCheckList } from '../components/ControlCheckList';
import { REASON_WORDS } from '../inspection-words';
import { useControlChecks, useInspection } from '../inspections.queries';

type Tab = 'walk' | 'checks' | 'findings';

export function InspectionPage() {
  const { inspectionId } = useParams();
  const router = useIonRouter();
  const units = useUnits();
  const windUnits = useWindUnits();
  const inspection = useInspection(inspectionId);
  const scaffold = useScaffold(inspection?.scaffoldId);
  const scaffoldFindings = useFindingsOfScaffold(inspection?.scaffoldId);
  const walkFindings = useFindingsOfInspection(inspectionId);
  const checks = useControlChecks(inspectionId);
  const [tab, setTab] = useState<Tab>('walk');
  const finished = inspection?.status === 'finished';
  // What earlier walks left: still to fix, or fixed and not yet verified. Listed first so nothing is forgotten between walks.
  const carriedOver = (scaffoldFindings ?? []).filter((f) => f.inspectionId !== inspectionId && (f.state === 'open' || f.state === 'made-safe' || f.state === 'fixed'));

  return (
    <IonPage>
      <AppHeader title={scaffold ? `Inspecting ${scaffold.reference}` : 'Inspection'} backHref={inspection ? `/scaffolds/${inspection.scaffoldId}` : '/'}>
        <TabBar<Tab>
          label="Parts of the inspection"
          value={tab}
          onChange={setTab}
          tabs={[
            { value: 'walk', label: 'Walk' },
            { value: 'checks', label: `Checks ${checks?.length ?? 0}/${CONTROLS.length}` },
            { value: 'findings', label: `Findings ${walkFindings?.length ?? 0}` },
          ]}
        />
      </AppHeader>
      <IonContent className="ion-padding" data-testid="inspection-page" data-inspection-id={inspectionId}>
        <RequireSession>
          {() => (
            <div className="page-body">
              {inspection === null && <p className="empty-note">This inspection is not on this phone.</p>}
              {inspection && (
                <p className="muted" data-testid="inspection-summary">
                  {REASON_WORDS[inspection.reason].label} · started {formatDateTime(inspection.startedAt)}
                  {inspection.windSpeedMps !== null ? ` · wind ${formatWind(inspection.windSpeedMps, windUnits)}` : ' · wind not measured'}
                  {finished ? ` · finished ${formatDateTime(inspection.finishedAt)} by ${inspection.reporterName}` : ''}
                </p>
              )}
              {inspection && !finished && tab === 'walk' && carriedOver.length > 0 && (
                <details className="carried-over" open data-testid="carried-over">
                  <summary>
                    From earlier walks: {carriedOver.filter((f) => f.state !== 'fixed').length} still to fix, {carriedOver.filter((f) => f.state === 'fixed').length} fixed and waiting to be
                    verified
                  </summary>
                  {carriedOver.map((finding) => (
                    <FindingRow key={finding.id} finding={finding} units={units} />
                  ))}
                </details>
              )}
              {inspection && scaffold && tab === 'walk' && (
                <ScaffoldElevations
                  scaffold={scaffold}
                  findings={scaffoldFindings ?? []}
                  units={units}
                  onAddFinding={
                    finished
                      ? undefined
                      : (spot) => router.push(`/inspections/${inspection.id}/findings/new?elevation=${encodeURIComponent(spot.elevation)}&lift=${spot.lift}&bay=${spot.bay}`, 'forward')
                  }
                />
              )}
              {inspection && tab === 'checks' && checks && <ControlCheckList inspection={inspection} checks={checks} />}
              {inspection && tab === 'findings' && (
                <div className="inspection-findings" data-testid="inspection-findings">
                  {(walkFindings ?? []).length === 0 && <p className="empty-note">No findings yet. On the Walk tab, tap the bay where an item is.</p>}
                  {(walkFindings ?? []).map((finding) => (
                    <FindingRow key={finding.id} finding={finding} units={units} />
                  ))}
                </div>
              )}
              <CautionNote />
            </div>
          )}
        </RequireSession>
      </IonContent>
      {inspection && (
        <IonFooter>
          <div className="bottom-actions">
            {finished ? (
              <IonButton fill="outline" routerLink={`/scaffolds/${inspection.scaffoldId}`}>
                Back to the scaffold
              </IonButton>
            ) : (
              <IonButton routerLink={`/inspections/${inspection.id}/finish`} data-testid="go-finish">
                Finish and sign
              </IonButton>
            )}
          </div>
        </IonFooter>
      )}
    </IonPage>
  );
}
