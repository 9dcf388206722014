import { Button } from '../components/ionic-elements';
import { useEffect, useSyncExternalStore } from 'react';
import {
  dismissNewVersion,
  dismissOfflineReady,
  isNewVersionWaiting,
  isReadyOffline,
  reloadIntoNewVersion,
  subscribeToServiceWorker,
} from './service-worker';
import './ReloadPrompt.css';

/**
 * Tells the user when a new version is waiting, and once when the app first works offline. The
 * waiting worker only takes over when they tap Reload, so a form in progress is never swapped out
 * under them. The first prompt on the page registers the service worker (service-worker.ts).
 */
export function ReloadPrompt() {
  const needRefresh = useSyncExternalStore(subscribeToServiceWorker, isNewVersionWaiting);
  const offlineReady = useSyncExternalStore(subscribeToServiceWorker, isReadyOffline);

  useEffect(() => {
    if (!offlineReady) return;
    const timer = setTimeout(dismissOfflineReady, 8000);
    return () => clearTimeout(timer);
  }, [offlineReady]);

  if (needRefresh) {
    return (
      <div className="reload-prompt" role="alert" data-testid="reload-prompt">
        <span className="reload-prompt__text">A new version of Plummet is ready</span>
        <span className="reload-prompt__actions">
          <Button fill="clear" className="reload-prompt__later" onClick={dismissNewVersion}>
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
          <Button fill="clear" className="reload-prompt__later" onClick={dismissOfflineReady}>
            OK
          </Button>
        </span>
      </div>
    );
  }

  return null;
}
