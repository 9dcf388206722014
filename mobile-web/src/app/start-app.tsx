import { setupIonicReact } from '@ionic/react';
import { StrictMode, startTransition } from 'react';
import { App } from './App';
import { appRoot } from './root';

/*
 * Ionic: the required core styles, and only the optional sheets the app uses. main.tsx imports the
 * same sheets, so index.html carries them from its first paint; here for sign-in.html, which starts
 * the app only after someone has signed in.
 */
import '@ionic/react/css/core.css';
import '@ionic/react/css/normalize.css';
import '@ionic/react/css/structure.css';
import '@ionic/react/css/typography.css';
import '@ionic/react/css/padding.css';

import '../theme/global.css';
import '../theme/screens.css';

/** Starts the full app (Ionic, the router, every page on demand) at the current address. */
export function startApp(): void {
  // One look on every phone: Material Design mode (48 px targets fit it best).
  setupIonicReact({ mode: 'md' });
  // As a transition, React renders the first screen in slices and lets the phone answer a tap
  // between them, instead of one long task while the whole tree is built.
  startTransition(() => {
    appRoot().render(
      <StrictMode>
        <App />
      </StrictMode>,
    );
  });
}
