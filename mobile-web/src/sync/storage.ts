/**
 * The browser's storage for the offline data: how much is used, and whether the browser has
 * agreed to keep it (navigator.storage.persist). Without that promise a browser may clear the
 * site's data when the phone runs short of space, unsent findings and photos included.
 */

export interface StorageReport {
  /** Bytes this app uses, when the browser says. */
  usedBytes?: number;
  /** Bytes it may use, when the browser says. */
  quotaBytes?: number;
  /** 'granted': kept until the user clears it; 'best-effort': may be cleared under pressure. */
  persistence: 'granted' | 'best-effort' | 'unsupported';
}

type StorageLike = Pick<StorageManager, 'estimate' | 'persist' | 'persisted'>;

function storageManager(): StorageLike | undefined {
  return typeof navigator !== 'undefined' && navigator.storage ? navigator.storage : undefined;
}

/** Asks for persistent storage (once granted, asking again is harmless) and measures what is used. */
export async function requestPersistentStorage(storage: StorageLike | undefined = storageManager()): Promise<StorageReport> {
  if (!storage) return { persistence: 'unsupported' };
  let persistence: StorageReport['persistence'] = 'unsupported';
  if (typeof storage.persist === 'function') {
    try {
      const already = typeof storage.persisted === 'function' ? await storage.persisted() : false;
      persistence = already || (await storage.persist()) ? 'granted' : 'best-effort';
    } catch {
      persistence = 'best-effort';
    }
  }
  return { ...(await estimateStorage(storage)), persistence };
}

export async function estimateStorage(storage: StorageLike | undefined = storageManager()): Promise<Pick<StorageReport, 'usedBytes' | 'quotaBytes'>> {
  if (!storage || typeof storage.estimate !== 'function') return {};
  try {
    const estimate = await storage.estimate();
    return { usedBytes: estimate.usage, quotaBytes: estimate.quota };
  } catch {
    return {};
  }
}

/** 1.2 MB, 840 kB, 2.1 GB (decimal units, as phones show storage). */
export function formatBytes(bytes: number): string {
  const units = ['bytes', 'kB', 'MB', 'GB', 'TB'];
  let value = bytes;
  let unit = 0;
  while (value >= 1000 && unit < units.length - 1) {
    value /= 1000;
    unit++;
  }
  return `${unit === 0 ? value : value.toFixed(value < 10 ? 1 : 0)} ${units[unit]}`;
}

/** Sentences for the screen: what is stored, and what the browser promised. */
export function describeStorage(report: StorageReport): { used: string; persistence: string } {
  const used =
    report.usedBytes === undefined
      ? 'This browser does not say how much it stores.'
      : report.quotaBytes
        ? `Plummet uses ${formatBytes(report.usedBytes)} on this phone (${formatBytes(report.quotaBytes)} available to it).`
        : `Plummet uses ${formatBytes(report.usedBytes)} on this phone.`;
  const persistence =
    report.persistence === 'granted'
      ? 'The browser agreed to keep this data until you sign out or clear it.'
      : report.persistence === 'best-effort'
        ? 'The browser did not promise to keep this data: it may clear it if the phone runs short of space. Installing Plummet on the home screen usually earns that promise.'
        : 'This browser cannot promise to keep offline data: send your changes as soon as you have signal.';
  return { used, persistence };
}
