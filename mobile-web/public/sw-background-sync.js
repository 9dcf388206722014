// Imported by the generated service worker (vite.config.ts, workbox.importScripts).
// Background Sync wakes the worker when the connection returns; the sync code itself lives in the
// page (it needs the session and the local database), so the worker asks every open Plummet
// window to sync now. With no window open, the next start of the app syncs instead.
self.addEventListener('sync', (event) => {
  if (event.tag !== 'plummet-sync') return;
  event.waitUntil(
    self.clients.matchAll({ type: 'window', includeUncontrolled: true }).then((clients) => {
      for (const client of clients) client.postMessage({ type: 'plummet-sync' });
    }),
  );
});
