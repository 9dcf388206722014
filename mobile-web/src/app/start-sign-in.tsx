import { StrictMode } from 'react';
import { StandaloneSignInPage } from '../features/auth/pages/StandaloneSignInPage';
import { homePathFor } from './role-home';
import { appRoot } from './root';

/** Leaves the standalone sign-in for the full app at `path` (same page, same React root, no reload). */
async function openApp(path: string, how: 'push' | 'replace'): Promise<void> {
  if (how === 'push') window.history.pushState(null, '', path);
  else window.history.replaceState(null, '', path);
  const { startApp } = await import('./start-app');
  startApp();
}

/**
 * A first visit to /sign-in: the form alone, in plain React with the app's look, so the phone
 * shows it without downloading and starting Ionic. Once signed in, the full app takes over.
 */
export function startSignIn(): void {
  appRoot().render(
    <StrictMode>
      <StandaloneSignInPage
        onBack={() => void openApp('/', 'push')}
        onSignedIn={(session) => void openApp(homePathFor(session.user.role), 'replace')}
      />
    </StrictMode>,
  );
}
