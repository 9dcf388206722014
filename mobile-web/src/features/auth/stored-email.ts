/**
 * The email of the session kept on this phone, read with IndexedDB itself rather than Dexie, so
 * the standalone sign-in can offer it without loading the local database's code. Undefined when
 * there is no database yet (opening one would create it empty) or no session in it.
 * Layout read: database 'plummet', table 'meta' keyed by 'key', entry 'session' (src/local-db/db.ts).
 */
export async function readStoredEmail(): Promise<string | undefined> {
  if (typeof indexedDB === 'undefined' || typeof indexedDB.databases !== 'function') return undefined;
  const known = await indexedDB.databases().catch(() => []);
  if (!known.some((database) => database.name === 'plummet')) return undefined;
  return new Promise((resolve) => {
    const open = indexedDB.open('plummet');
    open.onerror = () => resolve(undefined);
    open.onblocked = () => resolve(undefined);
    open.onsuccess = () => {
      const database = open.result;
      // Let Dexie upgrade the database whenever it needs to; this look is never worth blocking it.
      database.onversionchange = () => database.close();
      if (!database.objectStoreNames.contains('meta')) {
        database.close();
        resolve(undefined);
        return;
      }
      const request = database.transaction('meta', 'readonly').objectStore('meta').get('session');
      request.onsuccess = () => {
        database.close();
        const email: unknown = request.result?.value?.user?.email;
        resolve(typeof email === 'string' && email.includes('@') ? email : undefined);
      };
      request.onerror = () => {
        database.close();
        resolve(undefined);
      };
    };
  });
}
