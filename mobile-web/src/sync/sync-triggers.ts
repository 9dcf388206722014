/**
 * When the phone syncs: at start, when the connection returns, when the app comes back to the
 * foreground, and on a timer while open. Background Sync (where the browser has it) is registered
 * under SYNC_TAG for the service worker to act on. Returns a function that stops the triggers.
 */
import type { SyncEngine } from './sync-engine';

export const SYNC_TAG = 'plummet-sync';

interface TriggerEnv {
  addEventListener(type: string, listener: () => void): void;
  removeEventListener(type: string, listener: () => void): void;
}

export interface SyncTriggerOptions {
  window?: TriggerEnv;
  document?: TriggerEnv & { visibilityState?: string };
  intervalMs?: number;
}

export function startSyncTriggers(engine: Pick<SyncEngine, 'sync'>, options: SyncTriggerOptions = {}): () => void {
  const win = options.window ?? (typeof window === 'undefined' ? undefined : window);
  const doc = options.document ?? (typeof document === 'undefined' ? undefined : document);
  const run = () => void engine.sync();
  const onVisible = () => {
    if (doc?.visibilityState === 'visible') run();
  };
  run();
  win?.addEventListener('online', run);
  doc?.addEventListener('visibilitychange', onVisible);
  const timer = setInterval(run, options.intervalMs ?? 60_000);
  void registerBackgroundSync();
  return () => {
    win?.removeEventListener('online', run);
    doc?.removeEventListener('visibilitychange', onVisible);
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
