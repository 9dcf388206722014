import { useIonToast } from '@ionic/react';
import { useEffect } from 'react';
import { errorToastOptions } from './error-toast';
import { setErrorNotifier } from './query-client';

/** Connects the query client's mutation errors to an Ionic toast. Renders nothing itself. */
export function MutationErrorToasts() {
  const [presentToast] = useIonToast();
  useEffect(() => setErrorNotifier((message) => void presentToast(errorToastOptions(message))), [presentToast]);
  return null;
}
