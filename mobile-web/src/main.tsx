import { setupIonicReact } from '@ionic/react';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/App';

/* Ionic: the required core styles, and only the optional sheets the app uses. */
import '@ionic/react/css/core.css';
import '@ionic/react/css/normalize.css';
import '@ionic/react/css/structure.css';
import '@ionic/react/css/typography.css';
import '@ionic/react/css/padding.css';

/* Open Sans, bundled (no CDN): latin subset, the three weights the theme uses, woff2 only. */
import '@fontsource/open-sans/latin-400.css';
import '@fontsource/open-sans/latin-600.css';
import '@fontsource/open-sans/latin-700.css';

import './theme/variables.css';
import './theme/global.css';
import './theme/screens.css';

// One look on every phone: Material Design mode (48 px targets fit it best).
setupIonicReact({ mode: 'md' });

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element');

createRoot(container).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
