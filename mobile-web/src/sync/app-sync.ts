/**
 * The app's one sync engine: made when someone is signed in, stopped before sign-out clears the
 * phone. Which engine runs lives in running-engine.ts (screens read it through
 * features/sync/sync-hooks.ts without loading this file); nothing else creates an engine. No React here.
 */
import { fetchWithAccessToken } from '../api/authorised-fetch';
import { db } from '../local-db/db';
import { backoffMs } from '@plummet/shared';
import { readSession } from '../features/auth/session.store';
import { downloadForemen } from './download-foremen';
import { downloadOrganisationSettings } from './download-settings';
import { SyncEngine, type SyncRunOutcome } from './sync-engine';
import { httpSyncTransport } from './sync-transport';
import { setRunningEngine } from './running-engine';
import { startSyncTriggers } from './sync-triggers';

export { currentSyncEngine } from './running-engine';

interface Running {
  userId: string;
  engine: SyncEngine;
  stopTriggers: () => void;
  /** Runs under way, with the downloads that follow a sync (sign-out waits for them before clearing the phone). */
  runs: Set<Promise<SyncRunOutcome>>;
}

let running: Running | null = null;

/** True while sign-out clears the phone: a screen that asks for an engine meanwhile does not get one. */
let signingOut = false;

/**
 * Starts syncing for `userId` (again only when the user changed). The triggers skip a run while
 * the browser says no network is attached: a run marks the entries it tries, and an entry tried
 * for nothing would stop later edits folding into it.
 */
export function startAppSync(userId: string): SyncEngine | undefined {
  if (signingOut) return undefined;
  if (running?.userId === userId) return running.engine;
  void stopAppSync();
  const authorised = fetchWithAccessToken(db);
  const engine = new SyncEngine(db, httpSyncTransport(authorised));
  let retry: ReturnType<typeof setTimeout> | undefined;
  let failures = 0;
  const networkDown = () => typeof navigator !== 'undefined' && navigator.onLine === false;
  // The `online` event often comes before the connection carries traffic: a run that found no
  // server while the network is up tries again soon (1 s doubling, with jitter) instead of waiting for the timer.
  const runs = new Set<Promise<SyncRunOutcome>>();
  const run = (): Promise<SyncRunOutcome> => {
    const runOnce = runAndDownload();
    runs.add(runOnce);
    void runOnce.finally(() => runs.delete(runOnce)).catch(() => undefined);
    return runOnce;
  };
  const runAndDownload = async (): Promise<SyncRunOutcome> => {
    clearTimeout(retry);
    if (networkDown()) return 'offline';
    const outcome = await engine.sync();
    failures = outcome === 'offline' ? failures + 1 : 0;
    if (outcome === 'done') {
      const role = (await readSession(db))?.user.role;
      if (role) await downloadForemen(db, authorised, role);
      await downloadOrganisationSettings(db, authorised);
    }
    if (outcome === 'offline' && running?.engine === engine && !networkDown()) retry = setTimeout(() => void run(), backoffMs(failures, Math.random()));
    return outcome;
  };
  const stopTriggers = startSyncTriggers({ sync: run });
  running = {
    userId,
    engine,
    runs,
    stopTriggers: () => {
      clearTimeout(retry);
      stopTriggers();
    },
  };
  setRunningEngine(engine);
  return engine;
}

/** Stops the triggers and waits for a run in progress, so nothing writes after sign-out clears the phone. */
export async function stopAppSync(): Promise<void> {
  const current = running;
  if (!current) return;
  running = null;
  setRunningEngine(undefined);
  current.stopTriggers();
  await current.engine.whenIdle();
  // The foremen and settings downloads after a sync write to the phone too: wait for them.
  await Promise.allSettled([...current.runs]);
}

/**
 * Runs `work` (sign-out clearing the phone) with syncing stopped and kept stopped: the sync runner
 * of a screen still starting up may ask for an engine in the meantime, and a run started then
 * would write to the phone after it has been cleared.
 */
export async function withAppSyncStopped<T>(work: () => Promise<T>): Promise<T> {
  signingOut = true;
  try {
    await stopAppSync();
    return await work();
  } finally {
    signingOut = false;
  }
}
