/**
 * Resolves in a task of its own, so the browser can paint and answer a tap in between: long work
 * split at these points costs a phone several short tasks instead of one long one.
 */
export function nextTask(): Promise<void> {
  const scheduler = (globalThis as { scheduler?: { yield?: () => Promise<void> } }).scheduler;
  if (typeof scheduler?.yield === 'function') return scheduler.yield();
  return new Promise((resolve) => setTimeout(resolve, 0));
}
