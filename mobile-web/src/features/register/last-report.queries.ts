import { useLiveQuery } from 'dexie-react-hooks';
import { useEffect } from 'react';
import { db } from '../../local-db/db';
import type { SignedReportRecord } from '../../local-db/records';
import { keepSignedReport } from '../../local-db/signed-reports';
import { useOnlineStatus } from '../../lib/use-online-status';
import { fetchLastSignedReport } from './register.api';

/**
 * The scaffold's last signed report from this phone: the one kept from the server (any phone's) or
 * one signed here, whichever is later. Online, the kept copy is refreshed first.
 */
export function useLastSignedReport(scaffold: { id: string; organisationId: string } | null | undefined): SignedReportRecord | null | undefined {
  const online = useOnlineStatus();
  const scaffoldId = scaffold?.id;
  const organisationId = scaffold?.organisationId;
  useEffect(() => {
    if (!online || !scaffoldId || !organisationId) return;
    fetchLastSignedReport(scaffoldId)
      .then((report) => report && keepSignedReport(db, { ...report, organisationId }))
      .catch(() => undefined); // offline or refused: the kept copy stays
  }, [online, scaffoldId, organisationId]);

  return useLiveQuery(async () => {
    if (!scaffoldId) return null;
    const kept = await db.signedReports.get(scaffoldId);
    const own = (await db.inspections.where('scaffoldId').equals(scaffoldId).toArray())
      .filter((i) => i.status === 'finished' && i.finishedAt)
      .sort((a, b) => Date.parse(b.finishedAt!) - Date.parse(a.finishedAt!))[0];
    if (own && (!kept || Date.parse(own.finishedAt!) > Date.parse(kept.finishedAt ?? ''))) {
      const { siteId: _site, status: _status, ...inspection } = own;
      return { ...inspection, controlChecks: await db.controlChecks.where('inspectionId').equals(own.id).toArray() };
    }
    return kept ?? null;
  }, [scaffoldId]);
}
