import { IonButton, IonContent, IonPage, useIonRouter } from '@ionic/react';
import { useState } from 'react';
import { useLiveQuery } from 'dexie-react-hooks';
import { AppHeader } from '../../../components/AppHeader';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { FormSection } from '../../../components/FormSection';
import { Sheet } from '../../../components/Sheet';
import { db, readMeta } from '../../../local-db/db';
import { useWaitingChangeCount } from '../../../local-db/outbox.queries';
import { describeStorage, estimateStorage, type StorageReport } from '../../../sync/storage';
import { useSignOutMutation } from '../../auth/auth.mutations';
import { RequireSession } from '../../auth/components/RequireSession';
import { SessionNote } from '../../auth/components/SessionNote';
import { STORAGE_REPORT_KEY } from '../../sites/sites.mutations';
import { useChangeUnitsMutation, useChangeWindUnitsMutation } from '../settings.mutations';
import { signOutWarning } from '../sign-out-warning';
import { defaultWindUnitsFor } from '@plummet/shared';
import type { Units, WindUnits } from '../../../lib/units';

export function SettingsPage() {
  const router = useIonRouter();
  const [confirming, setConfirming] = useState(false);
  const waiting = useWaitingChangeCount() ?? 0;
  const changeUnits = useChangeUnitsMutation();
  const changeWindUnits = useChangeWindUnitsMutation();
  const signOut = useSignOutMutation();
  const storage = useLiveQuery(async () => {
    const last = await readMeta<StorageReport>(db, STORAGE_REPORT_KEY);
    return { ...(last ?? { persistence: 'unsupported' as const }), ...(await estimateStorage()) };
  }, []);

  return (
    <IonPage>
      <AppHeader title="Settings" backHref="/" />
      <IonContent className="ion-padding" data-testid="settings-page">
        <RequireSession>
          {(session) => {
            const words = storage ? describeStorage(storage) : undefined;
            return (
              <div className="page-body">
                <SessionNote session={session} />
                <FormSection title="Units">
                  <ChoiceGroup<Units>
                    legend="Show values in"
                    layout="stack"
                    value={session.user.units}
                    onChange={(units) => changeUnits.mutate(units)}
                    choices={[
                      { value: 'si', label: 'Metric (SI)', hint: 'kg, m, m/s, J, kN' },
                      { value: 'imperial', label: 'Imperial', hint: 'lb, ft, mph, ft·lbf, lbf' },
                    ]}
                    testId="units"
                  />
                  {/* Its own choice: UK sites give wind in mph while measuring in metres. */}
                  <ChoiceGroup<WindUnits>
                    legend="Wind speed in"
                    layout="stack"
                    value={session.user.windUnits ?? defaultWindUnitsFor(session.user.units)}
                    onChange={(windUnits) => changeWindUnits.mutate(windUnits)}
                    choices={[
                      { value: 'mps', label: 'Metres per second', hint: 'm/s' },
                      { value: 'kmh', label: 'Kilometres per hour', hint: 'km/h' },
                      { value: 'mph', label: 'Miles per hour', hint: 'mph' },
                    ]}
                    testId="wind-units"
                  />
                  <p className="muted">Values are always stored in SI; this only changes what you see and type.</p>
                </FormSection>
                <FormSection title="Storage on this phone">
                  {words && (
                    <>
                      <p>{words.used}</p>
                      <p>{words.persistence}</p>
                    </>
                  )}
                </FormSection>
                <FormSection title="Account">
                  <p>
                    {session.user.email} · {session.user.position}
                  </p>
                  <p>{waiting === 0 ? 'Every change has been sent.' : `${waiting} change${waiting === 1 ? '' : 's'} wait to be sent.`}</p>
                  <IonButton expand="block" color="danger" fill="outline" onClick={() => setConfirming(true)} data-testid="sign-out">
                    Sign out
                  </IonButton>
                </FormSection>
              </div>
            );
          }}
        </RequireSession>
        <SignOutSheet
          open={confirming}
          waiting={waiting}
          onClose={() => setConfirming(false)}
          onConfirm={() =>
            signOut.mutate(undefined, {
              onSuccess: () => {
                setConfirming(false);
                router.push('/', 'root', 'replace');
              },
            })
          }
        />
      </IonContent>
    </IonPage>
  );
}

function SignOutSheet({ open, waiting, onClose, onConfirm }: { open: boolean; waiting: number; onClose(): void; onConfirm(): void }) {
  const words = signOutWarning(waiting);
  return (
    <Sheet
      open={open}
      title={words.header}
      onClose={onClose}
      testId="sign-out-sheet"
      footer={
        <>
          <IonButton fill="outline" onClick={onClose}>
            Keep {waiting > 0 ? 'them' : 'signed in'}
          </IonButton>
          <IonButton color="danger" onClick={onConfirm} data-testid="confirm-sign-out">
            {words.confirm}
          </IonButton>
        </>
      }
    >
      <p className="sign-out-warning" role="alert" data-testid="sign-out-warning">
        {words.message}
      </p>
    </Sheet>
  );
}
