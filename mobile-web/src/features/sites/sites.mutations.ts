import type { Site } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { db, writeMeta } from '../../local-db/db';
import type { SiteDownloadResult } from '../../sync/download-site';
import { currentSyncEngine } from '../../sync/running-engine';
import { requestPersistentStorage, type StorageReport } from '../../sync/storage';
import { fetchWithAccessToken } from '../../api/authorised-fetch';

export const STORAGE_REPORT_KEY = 'storage-report';

export interface OfflineCopyResult {
  download: SiteDownloadResult;
  storage: StorageReport;
}

/** Downloads a site for the walk, then asks the browser to keep the data and measures it. */
export function useMakeSiteOfflineMutation() {
  return useMutation({
    mutationFn: async ({ site, organisationId }: { site: Site; organisationId: string }): Promise<OfflineCopyResult> => {
      // Syncing first sends what waits in the outbox and brings the change feed up to date; the
      // download is then the site's first pull: its records from the start of the feed.
      await currentSyncEngine()?.sync();
      // The download's code (and the schemas it parses with) loads on the first tap, not with the home.
      const [{ downloadSite }, { httpSyncTransport }] = await Promise.all([import('../../sync/download-site'), import('../../sync/sync-transport')]);
      const download = await downloadSite(db, site, organisationId, httpSyncTransport(fetchWithAccessToken(db)));
      const storage = await requestPersistentStorage();
      await writeMeta(db, STORAGE_REPORT_KEY, { ...storage, at: new Date().toISOString() });
      return { download, storage };
    },
    meta: { errorToast: 'The site could not be downloaded. Check the connection and try again.' },
  });
}
