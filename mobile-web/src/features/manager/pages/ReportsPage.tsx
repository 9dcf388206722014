import { useIonAlert, useIonToast } from '@ionic/react';
import type { Inspection } from '@plummet/shared';
import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ManagerLayout } from '../components/ManagerLayout';
import { TableScroll } from '../components/TableScroll';
import { downloadInspectionReport, openInspectionReport, sendInspectionReportAgain } from '../manager.api';
import { useScaffoldReports, useScaffolds, useSites } from '../manager.queries';
import { formatDateTime } from '../../../lib/format-date';

const when = (iso: string | null) => (iso ? formatDateTime(iso) : 'Not finished');

/** The scaffolds (filtered as the overview's numbers ask), and for the chosen one its inspections with their reports. */
export function ReportsPage() {
  const [search, setSearch] = useSearchParams();
  const siteId = search.get('siteId') ?? undefined;
  const status = search.get('status') ?? undefined;
  const due = search.get('due') ?? undefined;
  const scaffoldId = search.get('scaffoldId') ?? undefined;
  const scaffolds = useScaffolds();
  const sites = useSites();
  const reports = useScaffoldReports(scaffoldId);
  const [record, setRecord] = useState<Inspection | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [presentAlert] = useIonAlert();
  const [presentToast] = useIonToast();
  const now = Date.now();
  const endOfDay = new Date().setHours(24, 0, 0, 0);
  const shown = (scaffolds.data ?? []).filter((s) => {
    if (siteId && s.siteId !== siteId) return false;
    if (status && s.status !== status) return false;
    const next = s.nextDueAt ? Date.parse(s.nextDueAt) : null;
    if (due === 'overdue' && !(next !== null && next < now)) return false;
    if (due === 'today' && !(next !== null && next >= now && next < endOfDay)) return false;
    return true;
  });
  const choose = (id: string) => {
    const next = new URLSearchParams(search);
    next.set('scaffoldId', id);
    setSearch(next, { replace: true });
    setRecord(null);
  };

  async function open(inspectionId: string) {
    setMessage(null);
    try {
      const opened = await openInspectionReport(inspectionId);
      setRecord(opened.kind === 'record' ? opened.record : null);
      if (opened.kind === 'record') setMessage('The PDF is not available yet: here is the inspection record.');
    } catch (error) {
      setMessage(error instanceof Error ? error.message : 'The report could not be opened.');
    }
  }

  async function download(inspectionId: string, reference: string) {
    setMessage(null);
    try {
      await downloadInspectionReport(inspectionId, `inspection-report-${reference.replace(/[^A-Za-z0-9-]+/g, '_')}.pdf`);
    } catch (error) {
      setMessage(error instanceof Error ? error.message : 'The PDF could not be downloaded.');
    }
  }

  function sendAgain(inspectionId: string) {
    void presentAlert({
      header: 'Send the report again?',
      message: 'The site’s managers get the findings e-mail with the PDF once more.',
      buttons: [
        { text: 'Cancel', role: 'cancel' },
        {
          text: 'Send again',
          handler: () => {
            sendInspectionReportAgain(inspectionId).then(
              () => void presentToast({ message: 'Report queued: the managers get it in a few minutes.', duration: 3000, position: 'bottom' }),
              (error: unknown) => void presentToast({ message: error instanceof Error ? error.message : 'The report could not be sent.', duration: 4000, position: 'bottom', color: 'danger' }),
            );
          },
        },
      ],
    });
  }

  const filters = [siteId && sites.data?.find((s) => s.id === siteId)?.name, status && `tagged “${status}”`, due === 'today' && 'inspection due today', due === 'overdue' && 'inspection overdue'].filter(Boolean);

  return (
    <ManagerLayout title="Reports" loadedAt={scaffolds.dataUpdatedAt} refreshFailed={scaffolds.isError} testId="reports-page">
      <section className="manager-section" aria-labelledby="reports-scaffolds">
        <h2 id="reports-scaffolds">Scaffolds{filters.length ? `: ${filters.join(', ')}` : ''}</h2>
        <TableScroll label="Scaffolds table">
          <table className="manager-table" data-testid="reports-scaffolds">
            <thead>
              <tr>
                <th scope="col">Scaffold</th>
                <th scope="col">Site</th>
                <th scope="col">Tag status</th>
                <th scope="col">Next inspection</th>
              </tr>
            </thead>
            <tbody>
              {shown.map((s) => (
                <tr key={s.id} aria-selected={s.id === scaffoldId}>
                  <th scope="row">
                    <button type="button" className="manager-button manager-button--plain" onClick={() => choose(s.id)}>
                      {s.reference}
                    </button>
                  </th>
                  <td>{sites.data?.find((x) => x.id === s.siteId)?.name ?? ''}</td>
                  <td>{s.status}</td>
                  <td>{s.nextDueAt ? formatDateTime(s.nextDueAt) : 'Not set'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
        {shown.length === 0 && scaffolds.data && <p>No scaffold matches.</p>}
      </section>
      {reports.data && (
        <section className="manager-section" aria-labelledby="reports-inspections">
          <h2 id="reports-inspections">
            Inspections of {reports.data.scaffoldReference} ({reports.data.siteName})
          </h2>
          <table className="manager-table" data-testid="reports-inspections">
            <thead>
              <tr>
                <th scope="col">Finished</th>
                <th scope="col">Inspector</th>
                <th scope="col">Reason</th>
                <th scope="col">Findings</th>
                <th scope="col">Tag status given</th>
                <th scope="col">Report</th>
              </tr>
            </thead>
            <tbody>
              {reports.data.items.map((r) => (
                <tr key={r.inspectionId}>
                  <td>{when(r.finishedAt)}</td>
                  <td>{r.inspectorName}</td>
                  <td>{r.reason}</td>
                  <td>{r.findingsCount}</td>
                  <td>{r.statusGiven ?? '—'}</td>
                  <td>
                    <button type="button" className="manager-button manager-button--plain" onClick={() => void open(r.inspectionId)}>
                      PDF
                    </button>{' '}
                    {r.finishedAt && (
                      <>
                        <button type="button" className="manager-button manager-button--plain" onClick={() => void download(r.inspectionId, reports.data?.scaffoldReference ?? 'scaffold')}>
                          Download PDF
                        </button>{' '}
                        <button type="button" className="manager-button manager-button--plain" onClick={() => sendAgain(r.inspectionId)}>
                          Send again
                        </button>
                      </>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {message && <p role="status">{message}</p>}
          {record && (
            <dl className="manager-facts" data-testid="inspection-record">
              <dt>For</dt><dd>{record.reportFor || '—'}</dd>
              <dt>Where</dt><dd>{record.location || '—'}</dd>
              <dt>Equipment</dt><dd>{record.equipment || '—'}</dd>
              <dt>Matters giving rise to risk</dt><dd>{record.mattersGivingRisk || '—'}</dd>
              <dt>Action taken</dt><dd>{record.actionTaken || '—'}</dd>
              <dt>Further action</dt><dd>{record.furtherAction || '—'}</dd>
              <dt>Reported by</dt><dd>{record.reporterName || '—'}{record.reporterPosition ? `, ${record.reporterPosition}` : ''}</dd>
            </dl>
          )}
        </section>
      )}
    </ManagerLayout>
  );
}
