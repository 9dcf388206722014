import { defineCustomElement as defineIonToast } from '@ionic/core/components/ion-toast.js';
import { toastController, type ToastOptions } from '@ionic/core/components';
import { alertCircleOutline } from 'ionicons/icons';

/**
 * A failed change's message as an Ionic toast, for the home drawn on its own (start-home.tsx),
 * which loads this only when a change fails; the full app shows the same through useIonToast.
 */
export async function presentErrorToast(message: string): Promise<void> {
  // toastController creates the element by tag name: it has to be defined first.
  defineIonToast();
  const toast = await toastController.create(errorToastOptions(message));
  await toast.present();
}

/** How a failed change is shown, in the full app and on the home drawn on its own alike. */
export function errorToastOptions(message: string): ToastOptions {
  return { message, icon: alertCircleOutline, color: 'danger', position: 'bottom', duration: 6000, buttons: [{ text: 'Dismiss', role: 'cancel' }] };
}
