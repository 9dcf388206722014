import { IonButton, IonContent, IonHeader, IonInput, IonNote, IonPage, IonTitle, IonToolbar, useIonRouter } from '@ionic/react';
import { PASSWORD_MIN_LENGTH, PasswordSchema } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { useSearchParams } from 'react-router-dom';
import { homePathFor } from '../../../app/role-home';
import { apiFetch, ApiError } from '../../../api/http';
import { db } from '../../../local-db/db';
import { sessionFromResponse } from '../session-response';
import { startSession } from '../session.store';
import '../components/SignInForm.css';

/** The invitation e-mail's link: choose a password, and the new member is signed in. */
export function AcceptInvitePage() {
  const router = useIonRouter();
  const [search] = useSearchParams();
  const token = search.get('token') ?? '';
  const [password, setPassword] = useState('');
  const [again, setAgain] = useState('');
  const [formError, setFormError] = useState<string | null>(null);
  const accept = useMutation({
    mutationFn: async () => {
      const session = sessionFromResponse(await apiFetch<unknown>('/auth/accept-invite', { method: 'POST', body: { token, password } }), new Date());
      await startSession(db, session);
      return session;
    },
    onSuccess: (session) => router.push(homePathFor(session.user.role), 'root', 'replace'),
    onError: (error) =>
      setFormError(
        error instanceof ApiError && error.isOffline
          ? 'No connection to the Plummet server. Try again when you have signal.'
          : error instanceof Error
            ? error.message
            : 'The password could not be set.',
      ),
    meta: { errorToast: false },
  });

  function submit(event: FormEvent) {
    event.preventDefault();
    const checked = PasswordSchema.safeParse(password);
    if (!checked.success) return setFormError(checked.error.issues[0]?.message ?? 'Choose another password.');
    if (password !== again) return setFormError('The two passwords differ; type the same one twice.');
    setFormError(null);
    accept.mutate();
  }

  return (
    <IonPage data-testid="accept-invite-page">
      <IonHeader>
        <IonToolbar>
          <IonTitle>Join Plummet</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <form className="sign-in" onSubmit={submit} noValidate>
          {token ? (
            <p className="sign-in__intro">Choose a password of at least {PASSWORD_MIN_LENGTH} characters. You sign in with your e-mail address and this password.</p>
          ) : (
            <p className="sign-in__intro">This link has no invitation in it. Open the link from the e-mail again, or ask your admin to send a new one.</p>
          )}
          <IonInput
            label="New password"
            labelPlacement="stacked"
            fill="outline"
            type="password"
            autocomplete="new-password"
            value={password}
            onIonInput={(event) => setPassword(String(event.detail.value ?? ''))}
            data-testid="accept-password"
          />
          <IonInput
            label="The same password again"
            labelPlacement="stacked"
            fill="outline"
            type="password"
            autocomplete="new-password"
            value={again}
            onIonInput={(event) => setAgain(String(event.detail.value ?? ''))}
            data-testid="accept-password-again"
          />
          {formError && (
            <IonNote color="danger" role="alert" className="sign-in__error" data-testid="accept-error">
              {formError}
            </IonNote>
          )}
          <IonButton type="submit" expand="block" disabled={!token || accept.isPending} data-testid="accept-submit">
            {accept.isPending ? 'Setting the password…' : 'Set the password and sign in'}
          </IonButton>
        </form>
      </IonContent>
    </IonPage>
  );
}
