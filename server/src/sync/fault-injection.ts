/**
 * Fault injection for the process-level sync tests (tests/sync/processes.test.ts): the server
 * process kills itself at a named point of a push, so the test can prove that a push interrupted
 * just before its transaction commits, or just after (before the phone hears the answer), is
 * applied exactly once when the phone retries against a restarted process. A SIGKILL is the only
 * faithful way to do that: it leaves no chance to roll back, flush or answer, like a crash or an
 * OOM kill. Inert unless NODE_ENV=test AND PLUMMET_FAULT names the point, so it never fires in
 * development or production.
 */
export type FaultPoint = 'sync-push:before-commit' | 'sync-push:after-commit';

/** Kills this process on the spot when PLUMMET_FAULT names `point` (tests only). */
export function faultPoint(point: FaultPoint): void {
  if (process.env.NODE_ENV !== 'test' || process.env.PLUMMET_FAULT !== point) return;
  process.kill(process.pid, 'SIGKILL');
}

/** The same, for a point between an awaited result and its use: passes `value` through. */
export function faultAfter<T>(point: FaultPoint, value: T): T {
  faultPoint(point);
  return value;
}
