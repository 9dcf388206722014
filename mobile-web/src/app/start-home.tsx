import { initialize } from '@ionic/core/components';
import { QueryClientProvider } from '@tanstack/react-query';
import { StrictMode, Suspense, lazy, startTransition, useEffect, useRef } from 'react';
import { BrowserRouter, useLocation } from 'react-router-dom';
import { buildSchemasInSteps, SYNC_SCHEMAS } from '../api/building-schemas';
import { nextTask } from '../lib/next-task';
import { useAfterFirstScreen } from './after-first-screen';
import { queryClient, setErrorNotifier } from './query-client';
import { ReloadPrompt } from './ReloadPrompt';
import { appRoot } from './root';

/**
 * The home itself, with the session and the local database it reads: on demand, so the first
 * download stays the page's frame; index.html preloads its code (vite.config.ts, preloadChunks),
 * so it downloads alongside the entry rather than after it.
 */
const HomeScreen = lazy(() =>
  // The local database (Dexie, the largest module the home runs) first, in a task of its own.
  import('../local-db/db')
    .then(nextTask)
    .then(() => import('../features/home/components/HomeScreen'))
    .then((module) => ({ default: module.HomeScreen })),
);

/** The sync engine, as in the full app: loaded once the home is up and the phone is idle, its schemas a few at a time. */
const SyncRunner = lazy(() =>
  buildSchemasInSteps(SYNC_SCHEMAS)
    .then(() => import('./SyncRunner'))
    .then((module) => ({ default: module.SyncRunner })),
);

/**
 * A start at the home, the address most visits open at: the home alone, drawn with Ionic's own
 * elements but without @ionic/react, the router's page stack or the other pages. The first tap that
 * leaves the home (a site, the settings, a redirect to a manager's home) starts the full app
 * (start-app.tsx) at that address, in place of this one; the home the full app shows on the way
 * back is the same HomeScreen inside its page stack.
 */
export async function startHome(): Promise<void> {
  // The page's code has just run, in one task; Ionic's set-up (it looks the phone over) and the
  // first render each get a task of their own.
  await nextTask();
  // What setupIonicReact({ mode: 'md' }) does for the full app: Material Design mode, custom elements.
  document.documentElement.classList.add('ion-ce');
  initialize({ mode: 'md' });
  await nextTask();
  startTransition(() => {
    appRoot().render(
      <StrictMode>
        <QueryClientProvider client={queryClient}>
          <BrowserRouter>
            <HomeAlone />
          </BrowserRouter>
        </QueryClientProvider>
      </StrictMode>,
    );
  });
}

function HomeAlone() {
  const { pathname } = useLocation();
  const syncAllowed = useAfterFirstScreen();
  const leaving = useRef(false);
  useEffect(() => {
    if (pathname === '/' || leaving.current) return;
    // The home stays on screen until the full app draws the new address over it.
    leaving.current = true;
    void import('./start-app').then(({ startApp }) => startApp());
  }, [pathname]);
  useEffect(
    () =>
      // A failed change (making a site available offline) says so in the full app's toast.
      setErrorNotifier((message) => void import('./error-toast').then(({ presentErrorToast }) => presentErrorToast(message))),
    [],
  );
  return (
    <ion-app>
      <div className="ion-page">
        <Suspense fallback={null}>
          <HomeScreen />
        </Suspense>
      </div>
      {syncAllowed && (
        <Suspense fallback={null}>
          <SyncRunner />
        </Suspense>
      )}
      <ReloadPrompt />
    </ion-app>
  );
}
