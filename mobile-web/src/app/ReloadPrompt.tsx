import { Button } from '../components/ionic-elements';
import { useEffect } from 'react';
import { useRegisterSW } from 'virtual:pwa-register/react';
import './ReloadPrompt.css';

/** How often an open app asks the server whether a new version has been deployed. */
const UPDATE_CHECK_INTERVAL_MS = 60 * 60 * 1000;

/**
 * Registers the service worker (vite-plugin-pwa, injectRegister: null) and tells the user when
 * a new version is waiting. The waiting worker only takes over when they tap Reload, so a form
 * in progress is never swapped out under them.
 */
export function ReloadPrompt() {
  const {
    needRefresh: [needRefresh, setNeedRefresh],
    offlineReady: [offlineReady, setOfflineReady],
    updateServiceWorker,
  } = useRegisterSW({
    // Register after the window's load event: installing the worker fetches every precached
    // chunk, which must not compete with the first page's own downloads on a slow connection.
    immediate: false,
    onRegisteredSW(_swUrl, registration) {
      if (!registration) return;
      setInterval(() => {
        if (navigator.onLine && !registration.installing) registration.update().catch(() => undefined);
      }, UPDATE_CHECK_INTERVAL_MS);
    },
    onRegisterError(error: unknown) {
      console.error('[plummet] service worker registration failed', error);
    },
  });

  /**
   * Activates the waiting worker and reloads once it controls the page. vite-plugin-pwa reloads
   * on its own only when this page was already controlled at start-up (workbox-window's
   * isUpdate), not in the first session after install, so listen for the change here too.
   */
  async function reloadIntoNewVersion() {
    const registration = await navigator.serviceWorker.getRegistration();
    if (!registration?.waiting) {
      window.location.reload();
      return;
    }
    navigator.serviceWorker.addEventListener('controllerchange', () => window.location.reload(), { once: true });
    await updateServiceWorker(true);
  }

  useEffect(() => {
    if (!offlineReady) return;
    const timer = setTimeout(() => setOfflineReady(false), 8000);
    return () => clearTimeout(timer);
  }, [offlineReady, setOfflineReady]);

  if (needRefresh) {
    return (
      <div className="reload-prompt" role="alert" data-testid="reload-prompt">
        <span className="reload-prompt__text">A new version of Plummet is ready</span>
        <span className="reload-prompt__actions">
          <Button fill="clear" className="reload-prompt__later" onClick={() => setNeedRefresh(false)}>
            Later
          </Button>
          <Button color="secondary" onClick={() => void reloadIntoNewVersion()} data-testid="reload-prompt-reload">
            Reload
          </Button>
        </span>
      </div>
    );
  }

  if (offlineReady) {
    return (
      <div className="reload-prompt" role="status" data-testid="offline-ready">
        <span className="reload-prompt__text">Plummet is ready to work offline</span>
        <span className="reload-prompt__actions">
          <Button fill="clear" className="reload-prompt__later" onClick={() => setOfflineReady(false)}>
            OK
          </Button>
        </span>
      </div>
    );
  }

  return null;
}
