import { lazy, Suspense, useDeferredValue } from 'react';
import { Navigate } from 'react-router-dom';
import { buildSchemasInSteps, HOME_SCHEMAS } from '../../../api/building-schemas';
import { homePathFor } from '../../../app/role-home';
import { loadCollation } from '../../../lib/collation';
import { CautionNote } from '../../../components/CautionNote';
import { Button, definePageElements } from '../../../components/ionic-elements';
import { OnlineStatusBadge } from '../../../components/OnlineStatusBadge';
import { SyncBadge } from '../../../components/SyncBadge';
import { useSession } from '../../auth/session.queries';
import '../pages/HomePage.css';

/**
 * The signed-in body, on demand and preloaded (SignedInHome.tsx says why), after the schemas it
 * checks the server's answers with, built a few at a time (api/building-schemas.ts), and the
 * collation data its site list is sorted with, each in tasks of their own.
 */
const SignedInHome = lazy(() =>
  buildSchemasInSteps(HOME_SCHEMAS)
    .then(loadCollation)
    .then(() => import('./SignedInHome'))
    .then((module) => ({ default: module.SignedInHome })),
);

/**
 * The home's header, body and footer, drawn with the Ionic elements themselves (no @ionic/react):
 * inside the full app's IonPage (pages/HomePage.tsx), and on its own when a start opens at the
 * home (app/start-home.tsx). Signed out: what Plummet is, and the way in. Signed in: the sites, for the walk.
 */
export function HomeScreen() {
  definePageElements();
  const current = useSession();
  // The signed-in body is the biggest render of a start: React does it at low priority, in slices
  // between which the phone can answer a tap, rather than as one long task.
  const status = useDeferredValue(current.status);
  const session = useDeferredValue(current.session);
  const signedIn = session && status !== 'signed-out';
  // Only inspectors start here; everyone else has a home of their own.
  const home = signedIn ? homePathFor(session.user.role) : '/';
  if (home !== '/') return <Navigate to={home} replace />;
  // Until the phone has read its session, draw only the frame: neither the signed-out welcome
  // (a flash of the wrong screen for someone signed in) nor a guess at the sites.
  const loading = status === 'loading';

  return (
    <>
      <ion-header>
        <ion-toolbar>
          <ion-title>Plummet</ion-title>
          {/* The same compact status as every page's header (components/AppHeader.tsx). */}
          <div slot="end" className="app-status">
            <OnlineStatusBadge />
            {signedIn && <SyncBadge />}
          </div>
        </ion-toolbar>
      </ion-header>
      <ion-content className="ion-padding" data-testid="app-shell">
        {loading ? null : signedIn ? (
          <Suspense fallback={null}>
            <SignedInHome session={session} expired={status === 'expired'} />
          </Suspense>
        ) : (
          <div className="home-page">
            <img className="home-page__mark" src="/icons/plummet.svg" alt="" width="96" height="96" />
            <h1 className="home-page__heading">What could fall, and how hard it would land</h1>
            <p className="home-page__lead">
              Plummet is the safety team&rsquo;s field tool for objects falling from scaffolds: walk the scaffold lift by
              lift, record each unsecured item with photos, get an estimate of its impact on the spot &mdash; with or
              without signal &mdash; and turn the walk into the signed inspection record and a fix list.
            </p>
            <CautionNote />
            <Button expand="block" routerLink="/sign-in" className="home-page__action" data-testid="home-sign-in">
              Sign in
            </Button>
            <Button expand="block" fill="outline" routerLink="/calculator" className="home-page__action--secondary">
              Try a quick estimate
            </Button>
          </div>
        )}
      </ion-content>
      {signedIn && (
        <ion-footer>
          <div className="bottom-actions">
            <Button fill="outline" routerLink="/calculator" data-testid="open-calculator">
              Quick estimate
            </Button>
            <Button fill="outline" routerLink="/settings" data-testid="open-settings">
              Settings
            </Button>
          </div>
        </ion-footer>
      )}
    </>
  );
}
