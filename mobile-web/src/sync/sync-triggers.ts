/**
 * When the phone syncs: at start, when the connection returns, when the app comes back to the
 * foreground, on a timer while open, and when the service worker relays a Background Sync wake-up
 * (registered under SYNC_TAG where the browser has it; see public/sw-background-sync.js).
 * Returns a function that stops the triggers.
 */
import type { SyncEngine } from './sync-engine';

export const SYNC_TAG = 'plummet-sync';

interface TriggerEnv {
  addEventListener(type: string, listener: (event: never) => void): void;
  removeEventListener(type: string, listener: (event: never) => void): void;
}

export interface SyncTriggerOptions {
  window?: TriggerEnv;
  document?: TriggerEnv & { visibilityState?: string };
  /** Where service-worker messages arrive (navigator.serviceWorker in a browser). */
  serviceWorker?: TriggerEnv;
  intervalMs?: number;
}

export function startSyncTriggers(engine: Pick<SyncEngine, 'sync'>, options: SyncTriggerOptions = {}): () => void {
  const win = options.window ?? (typeof window === 'undefined' ? undefined : window);
  const doc = options.document ?? (typeof document === 'undefined' ? undefined : document);
  const sw = options.serviceWorker ?? (typeof navigator !== 'undefined' && 'serviceWorker' in navigator ? navigator.serviceWorker : undefined);
  const run = () => {
    void engine.sync().then((outcome) => {
      // Ask for a wake-up when the connection returns, in case the app is in the background then.
      // Only while the phone knows it is offline: an online registration fires at once, and the
      // relayed wake-up would start another run, and so on.
      if (outcome === 'offline' && typeof navigator !== 'undefined' && navigator.onLine === false) void registerBackgroundSync();
    });
  };
  const onVisible = () => {
    if (doc?.visibilityState === 'visible') run();
  };
  const onWorkerMessage = (event: MessageEvent) => {
    if ((event.data as { type?: string } | null)?.type === SYNC_TAG) run();
  };
  run();
  win?.addEventListener('online', run);
  doc?.addEventListener('visibilitychange', onVisible);
  sw?.addEventListener('message', onWorkerMessage);
  const timer = setInterval(run, options.intervalMs ?? 60_000);
  return () => {
    win?.removeEventListener('online', run);
    doc?.removeEventListener('visibilitychange', onVisible);
    sw?.removeEventListener('message', onWorkerMessage);
    clearInterval(timer);
  };
}

/** Asks the browser to wake the service worker when the connection returns (Chromium only; ignored elsewhere). */
async function registerBackgroundSync(): Promise<void> {
  try {
    if (typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
    const registration = (await navigator.serviceWorker.ready) as ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } };
    await registration.sync?.register(SYNC_TAG);
  } catch {
    // Not offered or not allowed: the other triggers still run.
  }
}
