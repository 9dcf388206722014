/**
 * The page's one service worker registration and what it has told us. The home and the full app
 * each show the reload prompt, one after the other in the same page, so registering from the
 * prompt itself would register twice and start two hourly update checks. Here it happens once,
 * when the first prompt subscribes, and both prompts read the same state. The registration code
 * loads on demand, so it is not part of the first download.
 */

/** How often an open app asks the server whether a new version has been deployed. */
const UPDATE_CHECK_INTERVAL_MS = 60 * 60 * 1000;

type Listener = () => void;

const listeners = new Set<Listener>();
/** A new version is installed and waits until the user reloads into it. */
let needRefresh = false;
/** The app is cached and now starts without a network. */
let offlineReady = false;
/** Started by the first subscriber; gives what activates a waiting worker (nothing if registering failed). */
let registering: Promise<((reloadPage?: boolean) => Promise<void>) | undefined> | undefined;

function changed(): void {
  for (const listener of listeners) listener();
}

function logRegisterError(error: unknown): void {
  console.error('[plummet] service worker registration failed', error);
}

function registerOnce(): void {
  registering ??= import('virtual:pwa-register')
    .then(({ registerSW }) =>
      registerSW({
        // Register after the window's load event: installing the worker fetches every precached
        // chunk, which must not compete with the first page's own downloads on a slow connection.
        immediate: false,
        onNeedRefresh() {
          needRefresh = true;
          changed();
        },
        onOfflineReady() {
          offlineReady = true;
          changed();
        },
        onRegisteredSW(_swUrl, registration) {
          if (!registration) return;
          setInterval(() => {
            if (navigator.onLine && !registration.installing) registration.update().catch(() => undefined);
          }, UPDATE_CHECK_INTERVAL_MS);
        },
        onRegisterError: logRegisterError,
      }),
    )
    .catch((error: unknown) => {
      logRegisterError(error);
      return undefined;
    });
}

/** Registers the service worker on the first call, never again; the listener hears every change. */
export function subscribeToServiceWorker(listener: Listener): () => void {
  registerOnce();
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export const isNewVersionWaiting = (): boolean => needRefresh;
export const isReadyOffline = (): boolean => offlineReady;

/** The user chose to stay on this version for now. */
export function dismissNewVersion(): void {
  needRefresh = false;
  changed();
}

export function dismissOfflineReady(): void {
  offlineReady = false;
  changed();
}

/**
 * Activates the waiting worker and reloads once it controls the page. The registration reloads
 * on its own only when this page was already controlled at start-up, not in the first session
 * after install, so listen for the change here too.
 */
export async function reloadIntoNewVersion(): Promise<void> {
  const registration = await navigator.serviceWorker.getRegistration();
  if (!registration?.waiting) {
    window.location.reload();
    return;
  }
  navigator.serviceWorker.addEventListener('controllerchange', () => window.location.reload(), { once: true });
  const activateWaitingWorker = await registering;
  await activateWaitingWorker?.(true);
}
