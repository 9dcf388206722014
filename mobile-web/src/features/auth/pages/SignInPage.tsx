import {
  IonBackButton,
  IonButton,
  IonButtons,
  IonContent,
  IonHeader,
  IonInput,
  IonNote,
  IonPage,
  IonTitle,
  IonToolbar,
  useIonRouter,
} from '@ionic/react';
import { useEffect, useState, type FormEvent } from 'react';
import { homePathFor } from '../../../app/role-home';
import { describeSignInError } from '../auth.api';
import { useSignInMutation } from '../auth.mutations';
import { useSession } from '../session.queries';
import './SignInPage.css';

export function SignInPage() {
  const router = useIonRouter();
  const signIn = useSignInMutation();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [formError, setFormError] = useState<string | null>(null);
  const { session } = useSession();

  // Signing in again after the session ran out: the same account, so the phone's records carry on.
  useEffect(() => {
    if (session) setEmail((typed) => typed || session.user.email);
  }, [session]);

  function submit(event: FormEvent) {
    event.preventDefault();
    if (!email.trim() || !password) {
      setFormError('Enter your email and password.');
      return;
    }
    setFormError(null);
    signIn.mutate({ email: email.trim(), password }, { onSuccess: (session) => router.push(homePathFor(session.user.role), 'root', 'replace') });
  }

  const error = formError ?? (signIn.isError ? describeSignInError(signIn.error) : null);

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
        <form className="sign-in" onSubmit={submit} noValidate>
          <p className="sign-in__intro">Sign in once with a connection; Plummet then keeps working offline.</p>
          <IonInput
            label="Email"
            labelPlacement="stacked"
            fill="outline"
            type="email"
            name="email"
            autocomplete="username"
            inputmode="email"
            value={email}
            onIonInput={(event) => setEmail(String(event.detail.value ?? ''))}
            data-testid="sign-in-email"
          />
          <IonInput
            label="Password"
            labelPlacement="stacked"
            fill="outline"
            type="password"
            name="password"
            autocomplete="current-password"
            value={password}
            onIonInput={(event) => setPassword(String(event.detail.value ?? ''))}
            data-testid="sign-in-password"
          />
          {error && (
            <IonNote color="danger" role="alert" className="sign-in__error" data-testid="sign-in-error">
              {error}
            </IonNote>
          )}
          <IonButton type="submit" expand="block" disabled={signIn.isPending} data-testid="sign-in-submit">
            {signIn.isPending ? 'Signing in…' : 'Sign in'}
          </IonButton>
        </form>
      </IonContent>
    </IonPage>
  );
}
