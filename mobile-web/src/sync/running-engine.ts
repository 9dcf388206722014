/**
 * Which sync engine is running, for screens that only show its state (the header's sync badge, a
 * site's download). It holds no engine code: the engine, its transport and the schemas it parses
 * load with app-sync.ts, after the first screen, instead of with every screen that shows a badge.
 * No React here: features/sync/sync-hooks.ts turns it into a hook.
 */
import type { SyncEngine } from './sync-engine';

let running: SyncEngine | undefined;
const listeners = new Set<() => void>();

/** Called by app-sync.ts alone, when it starts or stops the engine. */
export function setRunningEngine(engine: SyncEngine | undefined): void {
  running = engine;
  listeners.forEach((listener) => listener());
}

/** The running engine, or undefined while nobody is signed in. */
export function currentSyncEngine(): SyncEngine | undefined {
  return running;
}

/** Told whenever the running engine changes (sign-in, sign-out). */
export function subscribeRunningEngine(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}
