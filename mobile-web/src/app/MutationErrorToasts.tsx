import { useIonToast } from '@ionic/react';
import { alertCircleOutline } from 'ionicons/icons';
import { useEffect } from 'react';
import { setErrorNotifier } from './query-client';

/** Connects the query client's mutation errors to an Ionic toast. Renders nothing itself. */
export function MutationErrorToasts() {
  const [presentToast] = useIonToast();

  useEffect(
    () =>
      setErrorNotifier((message) => {
        void presentToast({
          message,
          icon: alertCircleOutline,
          color: 'danger',
          position: 'bottom',
          duration: 6000,
          buttons: [{ text: 'Dismiss', role: 'cancel' }],
        });
      }),
    [presentToast],
  );

  return null;
}
