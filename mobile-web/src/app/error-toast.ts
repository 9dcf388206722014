import { defineCustomElement as defineIonToast } from '@ionic/core/components/ion-toast.js';
import { toastController } from '@ionic/core/components';
import { alertCircleOutline } from 'ionicons/icons';

/**
 * A failed change's message as an Ionic toast, the same one MutationErrorToasts shows in the full
 * app, for the home drawn on its own (start-home.tsx). Loaded only when a change fails.
 */
export async function presentErrorToast(message: string): Promise<void> {
  // toastController creates the element by tag name: it has to be defined first.
  defineIonToast();
  const toast = await toastController.create({
    message,
    icon: alertCircleOutline,
    color: 'danger',
    position: 'bottom',
    duration: 6000,
    buttons: [{ text: 'Dismiss', role: 'cancel' }],
  });
  await toast.present();
}
