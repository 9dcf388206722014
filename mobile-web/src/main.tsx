/*
 * The app's first download (index.html): our palette, Open Sans, Ionic's styles, then the home
 * drawn on its own (most starts open there) or the full Ionic app at any other address. A first
 * visit to /sign-in gets sign-in.html instead (src/sign-in-page.ts), a form drawn in the HTML that
 * needs neither React nor Ionic until someone has signed in.
 */

import './lib/zod-setup';

/* Open Sans, bundled (no CDN): latin subset, the three weights the theme uses, woff2 only. */
import '@fontsource/open-sans/latin-400.css';
import '@fontsource/open-sans/latin-600.css';
import '@fontsource/open-sans/latin-700.css';

import './theme/variables.css';
import './theme/first-paint.css';

/* Ionic: the required core styles, and only the optional sheets the app uses. */
import '@ionic/react/css/core.css';
import '@ionic/react/css/normalize.css';
import '@ionic/react/css/structure.css';
import '@ionic/react/css/typography.css';
import '@ionic/react/css/padding.css';

import './theme/global.css';
import './theme/screens.css';

import { startHome } from './app/start-home';

// The home needs neither @ionic/react nor the router's page stack: start-home.tsx draws it and
// starts the full app when someone leaves it. Any other address starts the full app straight away.
if (window.location.pathname === '/') void startHome();
else void import('./app/start-app').then(({ startApp }) => startApp());
