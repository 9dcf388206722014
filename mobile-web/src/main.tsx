/*
 * The first download: our palette, Open Sans and a decision. A first visit to /sign-in gets a
 * plain React form that looks like the app (start-sign-in) and needs none of Ionic; every other
 * address starts the full Ionic app (start-app), which brings its own styles. Both are loaded on
 * demand, so neither pays for the other, and the service worker precaches both for offline use.
 */

/* Open Sans, bundled (no CDN): latin subset, the three weights the theme uses, woff2 only. */
import '@fontsource/open-sans/latin-400.css';
import '@fontsource/open-sans/latin-600.css';
import '@fontsource/open-sans/latin-700.css';

import './theme/variables.css';
import './theme/first-paint.css';

if (window.location.pathname === '/sign-in') {
  void import('./app/start-sign-in').then(({ startSignIn }) => startSignIn());
} else {
  void import('./app/start-app').then(({ startApp }) => startApp());
}
