import { createContext, useCallback, useContext, useEffect, useState, type ReactNode } from 'react';

type Report = (part: string, settled: boolean) => void;

const SettledContext = createContext<Report>(() => undefined);

/**
 * Sections of one screen that fill in from several sources (the phone's database, then the
 * server) call this with whether their first answer is in. Outside a ShowWhenSettled it does nothing.
 */
export function useReportSettled(part: string, settled: boolean): void {
  const report = useContext(SettledContext);
  useEffect(() => report(part, settled), [report, part, settled]);
}

/**
 * Keeps its sections laid out but unseen until each named part has settled (or `timeoutMs` has
 * passed), then shows them at once: the screen appears whole instead of growing in steps, each
 * step pushing what is already there down under the user's thumb. Once shown it stays shown.
 */
export function ShowWhenSettled({ parts, timeoutMs = 3000, children }: { parts: readonly string[]; timeoutMs?: number; children: ReactNode }) {
  const [settled, setSettled] = useState<ReadonlySet<string>>(() => new Set());
  const [timedOut, setTimedOut] = useState(false);
  const report = useCallback<Report>((part, done) => {
    setSettled((current) => {
      if (done === current.has(part)) return current;
      const next = new Set(current);
      if (done) next.add(part);
      else next.delete(part);
      return next;
    });
  }, []);
  useEffect(() => {
    const timer = setTimeout(() => setTimedOut(true), timeoutMs);
    return () => clearTimeout(timer);
  }, [timeoutMs]);
  const [shown, setShown] = useState(false);
  const ready = timedOut || parts.every((part) => settled.has(part));
  useEffect(() => {
    if (ready) setShown(true);
  }, [ready]);
  return (
    <SettledContext.Provider value={report}>
      <div className="show-when-settled" style={shown || ready ? undefined : { visibility: 'hidden' }} aria-busy={shown || ready ? undefined : true}>
        {children}
      </div>
    </SettledContext.Provider>
  );
}
