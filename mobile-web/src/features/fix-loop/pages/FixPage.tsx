import { IonContent, IonPage, IonButton } from '@ionic/react';
import { describeDue, isAlterationControl, nextFindingStates } from '@plummet/shared';
import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { formatDateTime } from '../../../lib/format-date';
import { AppHeader } from '../../../components/AppHeader';
import { FormSection } from '../../../components/FormSection';
import { Spinner } from '../../../components/Spinner';
import { RequireSession } from '../../auth/components/RequireSession';
import { useSession, useUnits } from '../../auth/session.queries';
import { useFinding } from '../../findings/findings.queries';
import { useForeman } from '../../findings/foremen.queries';
import { PhotoThumb } from '../../photos/components/PhotoThumb';
import { photoBlob } from '../../photos/photo-data';
import { usePhotos } from '../../photos/photos.queries';
import { ElevationGrid } from '../../scaffolds/components/ElevationGrid';
import { useScaffold } from '../../scaffolds/scaffolds.queries';
import { FindingFacts } from '../components/FindingFacts';
import { FixActionForm, type FixActionKind, type FixActionValues } from '../components/FixActionForm';
import { useFixActionMutation } from '../fix-loop.mutations';
import { useFixHistory, useSitesById } from '../fix-loop.queries';
import { useOrganisationSettings } from '../organisation-settings.queries';
import { dueAtOf, FixLoopRefusal, proofPhotoRequired, suggestControls } from '../fix-loop-rules';
import { ALTERATION_WORDS, CONTROL_WORDS } from '../fix-loop-words';
import '../fix-loop.css';

const ACTION_LABELS: Record<FixActionKind, string> = {
  'made-safe': 'Made safe for now',
  fixed: 'Fixed for good',
  'hand-back': 'Hand back',
  verify: 'Verify the fix',
  reopen: 'Reopen',
};

/**
 * One finding of the fix loop: where it is on the scaffold's drawing, the photos, the estimate,
 * the suggested controls, its fixes so far, then what the signed-in person may do about it.
 */
export function FixPage() {
  const { findingId } = useParams();
  const { session } = useSession();
  const units = useUnits();
  const finding = useFinding(findingId);
  const scaffold = useScaffold(finding?.scaffoldId);
  const photos = usePhotos('finding', finding?.id);
  const history = useFixHistory(finding?.id);
  const sites = useSitesById();
  const assignee = useForeman(finding?.assigneeId);
  const settings = useOrganisationSettings();
  const action = useFixActionMutation();
  const [kind, setKind] = useState<FixActionKind>();
  const [refusal, setRefusal] = useState<string>();
  const [done, setDone] = useState<string>();

  if (!finding || !session) {
    return (
      <IonPage>
        <AppHeader title="Finding" backHref="/fix-list" />
        <IonContent className="ion-padding">
          <RequireSession>{() => (finding === null ? <p className="empty-note">This finding is not on this phone.</p> : <Spinner />)}</RequireSession>
        </IonContent>
      </IonPage>
    );
  }

  const role = session.user.role;
  const next = nextFindingStates(finding.state, role);
  const actions: FixActionKind[] = [
    ...(next.includes('made-safe') ? (['made-safe'] as const) : []),
    ...(next.includes('fixed') ? (['fixed'] as const) : []),
    ...(role === 'foreman' && (finding.state === 'open' || finding.state === 'made-safe') && !finding.handBack ? (['hand-back'] as const) : []),
    ...(next.includes('verified') ? (['verify'] as const) : []),
    ...(next.includes('open') ? (['reopen'] as const) : []),
  ];
  const lastFix = history?.fixes.at(-1);
  const lastReopen = history?.verifications.filter((v) => v.outcome === 'reopened').at(-1);
  const dueAt = dueAtOf(finding, scaffold ?? undefined, settings);
  const entry = { finding, scaffold: scaffold ?? undefined, dueAt, due: describeDue(dueAt, new Date()) };
  const ownFix = lastFix?.fixedBy === session.user.id && settings.verifierMustDifferFromFixer;

  function submit(values: FixActionValues) {
    setRefusal(undefined);
    action.mutate(
      { findingId: finding!.id, values, actor: { userId: session!.user.id, role }, settings },
      {
        onSuccess: () => {
          setKind(undefined);
          setDone(`${ACTION_LABELS[values.kind]}: saved on this phone; it is sent when there is signal.`);
        },
        onError: (error) => setRefusal(error instanceof FixLoopRefusal ? error.message : 'It could not be saved on this phone; nothing was sent. Try again.'),
      },
    );
  }

  return (
    <IonPage>
      <AppHeader title={finding.item.name} backHref={role === 'foreman' ? '/fix-list' : '/to-verify'} />
      <IonContent className="ion-padding" data-testid="fix-page">
        <div className="page-body fix-page__columns">
          <div>
            <FindingFacts entry={entry} site={sites?.get(finding.siteId)} scaffold={scaffold ?? undefined} assignee={assignee} selfId={session.user.id} units={units} />
            {lastReopen && finding.state === 'open' && (
              <p className="fix-notice" role="note" data-testid="reopen-reason">
                Reopened {formatDateTime(lastReopen.verifiedAt)}: {lastReopen.note}
              </p>
            )}
            <FormSection title="Photos">
              {photos && photos.length > 0 ? (
                <div className="photo-picker__thumbs">
                  {photos.map((photo, index) => (
                    <PhotoThumb key={photo.id} blob={photoBlob(photo)} alt={`Inspector’s photo ${index + 1}`} />
                  ))}
                </div>
              ) : (
                <p className="muted">No photo of it on this phone.</p>
              )}
            </FormSection>
            <FormSection title="Where on the scaffold">
              {scaffold ? (
                <div className="fix-pin">
                  <ElevationGrid
                    elevation={finding.elevation}
                    lifts={scaffold.lifts}
                    bays={scaffold.baysPerElevation}
                    liftHeightM={scaffold.liftHeightM}
                    liftHeightsM={scaffold.liftHeightsM}
                    findings={[finding]}
                    selected={{ elevation: finding.elevation, lift: finding.lift, bay: finding.bay }}
                    onSelect={() => undefined}
                    units={units}
                  />
                </div>
              ) : (
                <p className="muted">The scaffold’s drawing is not on this phone yet; it comes with the next sync.</p>
              )}
            </FormSection>
          </div>
          <div>
            <FormSection title="Suggested controls">
              <ul data-testid="suggested-controls">
                {suggestControls(finding).map((control) => (
                  <li key={control}>
                    {CONTROL_WORDS[control]}
                    {isAlterationControl(control) ? ' (an alteration: the scaffolders’ job)' : ''}
                  </li>
                ))}
              </ul>
            </FormSection>
            {lastFix && (
              <FormSection title="Fixed">
                <p data-testid="last-fix">
                  {formatDateTime(lastFix.fixedAt)}: {lastFix.control ? CONTROL_WORDS[lastFix.control] : 'fixed'}
                  {lastFix.note ? `, “${lastFix.note}”` : ''}
                </p>
                {isAlterationControl(lastFix.control) && <p className="fix-notice">{ALTERATION_WORDS}</p>}
              </FormSection>
            )}
            {done && (
              <p className="fix-notice" role="status" data-testid="fix-done">
                {done}
              </p>
            )}
            {kind ? (
              <FixActionForm
                key={kind}
                kind={kind}
                units={units}
                photoRequired={proofPhotoRequired(finding, settings)}
                busy={action.isPending}
                refusal={refusal}
                onSubmit={submit}
                onCancel={() => {
                  setKind(undefined);
                  setRefusal(undefined);
                }}
              />
            ) : (
              <FormSection title="What was done">
                {ownFix && next.includes('verified') && (
                  <p className="fix-notice fix-notice--refusal" data-testid="own-fix-note">
                    You marked this finding fixed, so someone else must verify it.
                  </p>
                )}
                {actions.length === 0 ? (
                  <p className="muted">Nothing for you to record on this finding now.</p>
                ) : (
                  <div className="fix-actions">
                    {actions.map((a) => (
                      <IonButton key={a} expand="block" fill={a === 'fixed' || a === 'verify' ? 'solid' : 'outline'} onClick={() => { setDone(undefined); setKind(a); }} data-testid={`action-${a}`}>
                        {ACTION_LABELS[a]}
                      </IonButton>
                    ))}
                  </div>
                )}
              </FormSection>
            )}
          </div>
        </div>
      </IonContent>
    </IonPage>
  );
}
