import { useEffect, useState } from 'react';

/**
 * Runs `task` once the browser has a quiet moment (requestIdleCallback, at most `timeoutMs` later;
 * a short timer where there is none, as on Safari). Returns a cancel function.
 */
export function whenIdle(task: () => void, timeoutMs = 2000): () => void {
  if (typeof window.requestIdleCallback === 'function') {
    const id = window.requestIdleCallback(task, { timeout: timeoutMs });
    return () => window.cancelIdleCallback(id);
  }
  const timer = setTimeout(task, 300);
  return () => clearTimeout(timer);
}

/**
 * False until the first screen has been drawn and the browser is idle: for work the first screen
 * does not show (the sync engine), so it does not compete with that screen's downloads and code.
 */
export function useAfterFirstScreen(timeoutMs = 2000): boolean {
  const [ready, setReady] = useState(false);
  useEffect(() => {
    let cancel = () => {};
    // After the page's load event (its scripts have run), a painted frame, then a quiet moment.
    const afterLoad = () => {
      const frame = requestAnimationFrame(() => (cancel = whenIdle(() => setReady(true), timeoutMs)));
      cancel = () => cancelAnimationFrame(frame);
    };
    if (document.readyState === 'complete') afterLoad();
    else {
      window.addEventListener('load', afterLoad, { once: true });
      cancel = () => window.removeEventListener('load', afterLoad);
    }
    return () => cancel();
  }, [timeoutMs]);
  return ready;
}
