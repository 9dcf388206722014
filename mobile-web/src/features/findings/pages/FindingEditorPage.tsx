import { IonContent, IonPage } from '@ionic/react';
import { Spinner } from '../../../components/Spinner';
import { useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { AppHeader } from '../../../components/AppHeader';
import { newId } from '../../../local-db/ids';
import { RequireSession } from '../../auth/components/RequireSession';
import { useSession, useUnits } from '../../auth/session.queries';
import { useCatalogue } from '../../catalogue/catalogue.queries';
import { useInspection } from '../../inspections/inspections.queries';
import { usePhotos } from '../../photos/photos.queries';
import { useScaffold } from '../../scaffolds/scaffolds.queries';
import { FindingEditor } from '../components/FindingEditor';
import { findingLock } from '../finding-lock';
import { formOfFinding, newFindingForm } from '../finding-form';
import { useFinding } from '../findings.queries';
import { useForemen } from '../foremen.queries';

/**
 * A new finding (`/inspections/:id/findings/new?elevation=&lift=&bay=`, from a tap on the grid)
 * or a saved one (`/findings/:id`). Loads what the form needs, then hands over to FindingEditor.
 */
export function FindingEditorPage() {
  const { inspectionId: routeInspectionId, findingId } = useParams();
  const [search] = useSearchParams();
  const [newFindingId] = useState(newId);
  const units = useUnits();
  const { session } = useSession();
  const existing = useFinding(findingId);
  const inspectionId = routeInspectionId ?? existing?.inspectionId ?? undefined;
  const inspection = useInspection(inspectionId);
  const scaffold = useScaffold(existing?.scaffoldId ?? inspection?.scaffoldId);
  const catalogue = useCatalogue();
  const storedPhotos = usePhotos('finding', existing?.id);
  const foremen = useForemen();

  const loading =
    (findingId && existing === undefined) ||
    (inspectionId && inspection === undefined) ||
    scaffold === undefined ||
    catalogue === undefined ||
    storedPhotos === undefined ||
    !session;
  const missing = !loading && (!scaffold || (findingId && !existing) || (routeInspectionId && !inspection));
  // A downloaded finding may belong to a walk that is not on this phone: then back leads to its scaffold.
  const backHref = inspection ? `/inspections/${inspection.id}` : routeInspectionId ? `/inspections/${routeInspectionId}` : scaffold ? `/scaffolds/${scaffold.id}` : '/';
  const windSpeedMps = inspection?.windSpeedMps ?? null;

  if (loading || missing || !scaffold || !session || !catalogue || !storedPhotos) {
    return (
      <IonPage>
        <AppHeader title={findingId ? 'Finding' : 'New finding'} backHref={backHref} />
        <IonContent className="ion-padding">
          <RequireSession>
            {() =>
              missing ? (
                <p className="empty-note">This finding, or its scaffold, is not on this phone.</p>
              ) : (
                <div className="loading-note" role="status">
                  <Spinner /> Opening…
                </div>
              )
            }
          </RequireSession>
        </IonContent>
      </IonPage>
    );
  }

  const spot = {
    elevation: search.get('elevation') ?? scaffold.elevations[0] ?? '',
    lift: Math.min(scaffold.lifts, Math.max(1, Number(search.get('lift')) || 1)),
    bay: Math.min(scaffold.baysPerElevation, Math.max(1, Number(search.get('bay')) || 1)),
  };
  const initialForm = existing ? formOfFinding(existing, { units, liftHeightM: scaffold.liftHeightM, liftHeightsM: scaffold.liftHeightsM }) : newFindingForm(spot, windSpeedMps);

  return (
    <IonPage>
      <FindingEditor
        key={existing?.id ?? newFindingId}
        initialForm={initialForm}
        existing={existing ?? undefined}
        owner={{
          id: existing?.id ?? newFindingId,
          organisationId: session.user.organisation.id,
          siteId: scaffold.siteId,
          scaffoldId: scaffold.id,
          inspectionId: existing ? existing.inspectionId : (inspection?.id ?? null),
          createdBy: existing?.createdBy ?? session.user.id,
        }}
        scaffold={scaffold}
        catalogue={catalogue}
        storedPhotos={storedPhotos}
        windSpeedMps={windSpeedMps}
        units={units}
        backHref={backHref}
        lock={findingLock({ role: session.user.role, findingId: existing?.id, inspectionSigned: inspection?.status === 'finished' || !!inspection?.signedAt })}
        foremen={session.user.role === 'foreman' ? [] : (foremen ?? [])}
      />
    </IonPage>
  );
}
