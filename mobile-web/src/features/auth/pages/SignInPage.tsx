import { IonBackButton, IonButtons, IonContent, IonHeader, IonPage, IonTitle, IonToolbar, useIonRouter } from '@ionic/react';
import { homePathFor } from '../../../app/role-home';
import { SignInForm } from '../components/SignInForm';
import { useSession } from '../session.queries';

/** Sign-in inside the app (from the home or after the session ran out); the form is the standalone one's. */
export function SignInPage() {
  const router = useIonRouter();
  const { session } = useSession();

  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonButtons slot="start">
            <IonBackButton defaultHref="/" text="" aria-label="Back" />
          </IonButtons>
          <IonTitle>Sign in</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <SignInForm initialEmail={session?.user.email} onSignedIn={(signedIn) => router.push(homePathFor(signedIn.user.role), 'root', 'replace')} />
      </IonContent>
    </IonPage>
  );
}
