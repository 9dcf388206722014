import { Button, Icon } from '../../../components/ionic-elements';
import { keyOutline } from 'ionicons/icons';
import { formatDateTime } from '../../../lib/format-date';
import type { StoredSession } from '../session';

const SOON_MS = 3 * 86_400_000;

/** Who is signed in, and until when the phone can work offline without signing in again. */
export function SessionNote({ session, now = new Date() }: { session: StoredSession; now?: Date }) {
  if (Date.parse(session.refreshExpiresAt) <= now.getTime()) {
    return (
      <div className="session-note session-note--soon" role="alert" data-testid="session-expiry" data-expired="true">
        <Icon icon={keyOutline} aria-hidden="true" />
        <div>
          <p className="session-note__text">
            Your sign-in on this phone ended on <strong>{formatDateTime(session.refreshExpiresAt)}</strong>. Everything recorded here is kept;
            connect and sign in again as {session.user.email} to carry on and send it.
          </p>
          <Button routerLink="/sign-in" size="default">
            Sign in again
          </Button>
        </div>
      </div>
    );
  }
  const soon = Date.parse(session.refreshExpiresAt) - now.getTime() < SOON_MS;
  return (
    <p className={`session-note ${soon ? 'session-note--soon' : ''}`} data-testid="session-expiry">
      <Icon icon={keyOutline} aria-hidden="true" />
      <span>
        Signed in as <strong>{session.user.name}</strong> ({session.user.organisation.name}). Works offline until{' '}
        <strong>{formatDateTime(session.refreshExpiresAt)}</strong>
        {soon ? ': connect before then to stay signed in.' : '; each time you are online this moves on.'}
      </span>
    </p>
  );
}
