import { setupIonicReact } from '@ionic/react';
import { StrictMode, startTransition } from 'react';
import { App } from './App';
import { appRoot } from './root';

/* Ionic's styles and ours are in main.tsx: the page carries them from its first paint. */

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
