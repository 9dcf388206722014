import { IonButton } from '@ionic/react';
import { Spinner } from '../../../components/Spinner';
import type { ReactNode } from 'react';
import { formatDateTime } from '../../../lib/format-date';
import type { StoredSession } from '../session';
import { useSession } from '../session.queries';

/**
 * Renders its children with the session, or says why it cannot: still opening, nobody signed in,
 * or the sign-in ran out (data on the phone is kept; signing in again carries on with it).
 */
export function RequireSession({ children }: { children: (session: StoredSession) => ReactNode }) {
  const { status, session } = useSession();
  if (status === 'loading') {
    return (
      <div className="loading-note" role="status">
        <Spinner /> Opening…
      </div>
    );
  }
  if (status === 'signed-out' || !session) {
    return (
      <div className="empty-note" data-testid="needs-sign-in">
        <p>Sign in once with a connection; this screen then works offline.</p>
        <IonButton routerLink="/sign-in" expand="block">
          Sign in
        </IonButton>
      </div>
    );
  }
  if (status === 'expired') {
    return (
      <div className="empty-note" role="alert" data-testid="session-expired">
        <p>
          Your sign-in on this phone ran out on {formatDateTime(session.refreshExpiresAt)}. Everything recorded here is kept: connect and
          sign in again as {session.user.email} to carry on and send it.
        </p>
        <IonButton routerLink="/sign-in" expand="block">
          Sign in again
        </IonButton>
      </div>
    );
  }
  return <>{children(session)}</>;
}
