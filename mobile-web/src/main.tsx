/*
 * The app's first download (index.html): our palette, Open Sans, then the full Ionic app at the
 * current address. A first visit to /sign-in gets sign-in.html instead (src/sign-in-page.ts), a
 * form drawn in the HTML that needs neither React nor Ionic until someone has signed in.
 */

/* Open Sans, bundled (no CDN): latin subset, the three weights the theme uses, woff2 only. */
import '@fontsource/open-sans/latin-400.css';
import '@fontsource/open-sans/latin-600.css';
import '@fontsource/open-sans/latin-700.css';

import './theme/variables.css';
import './theme/first-paint.css';

import { startApp } from './app/start-app';

// The home is where most visits start: fetch its page alongside the app's own code rather than
// after it has started (lazy-pages.tsx imports the same module, so it runs once).
if (window.location.pathname === '/') void import('./features/home/pages/HomePage');

startApp();
