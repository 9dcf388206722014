import { type OverviewFigures, scaffoldStatusWords } from '@plummet/shared';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { ManagerDueSection } from '../../register/components/ManagerDueSection';
import { ManagerLayout } from '../components/ManagerLayout';
import { TableScroll } from '../components/TableScroll';
import { useOverview, useSites } from '../manager.queries';

const BANDS = ['High', 'Medium', 'Low'] as const;

/** Links into the findings table (or reports) with the filters behind a number. */
function findingsLink(siteId: string | undefined, params: Record<string, string>) {
  return `/findings?${new URLSearchParams({ ...(siteId ? { siteId } : {}), ...params }).toString()}`;
}
function reportsLink(siteId: string | undefined, params: Record<string, string>) {
  return `/reports?${new URLSearchParams({ ...(siteId ? { siteId } : {}), ...params }).toString()}`;
}

function Figure({ value, label, to, tone, testId }: { value: number; label: string; to: string; tone?: string; testId: string }) {
  return (
    <li>
      <Link className={`manager-figure${tone ? ` manager-figure--${tone}` : ''}`} to={to} data-testid={testId}>
        <span className="manager-figure__value">{value}</span>
        <span className="manager-figure__label">{label}</span>
      </Link>
    </li>
  );
}

function Figures({ figures, siteId, prefix }: { figures: OverviewFigures; siteId?: string; prefix: string }) {
  return (
    <ul className="manager-figures">
      {BANDS.map((band) => (
        <Figure
          key={band}
          value={figures.openByBand[band]}
          label={`${band} band, still to fix`}
          tone={band.toLowerCase()}
          to={findingsLink(siteId, { riskBand: band, state: 'open,made-safe' })}
          testId={`${prefix}-open-${band}`}
        />
      ))}
      <Figure value={figures.overdueFixes} label="Fixes overdue" to={findingsLink(siteId, { overdue: 'true' })} testId={`${prefix}-overdue`} />
      <Figure value={figures.waitingVerification} label="Fixed, to verify" to={findingsLink(siteId, { state: 'fixed' })} testId={`${prefix}-to-verify`} />
      <Figure value={figures.inspectionsDueToday} label="Inspections due today" to={reportsLink(siteId, { due: 'today' })} testId={`${prefix}-due-today`} />
      <Figure value={figures.inspectionsOverdue} label="Inspections overdue" to={reportsLink(siteId, { due: 'overdue' })} testId={`${prefix}-inspections-overdue`} />
      {figures.scaffoldsByStatus.map((s) => (
        <Figure key={s.status} value={s.count} label={`Scaffolds: ${scaffoldStatusWords(s.status)}`} to={reportsLink(siteId, { status: s.status })} testId={`${prefix}-status-${s.status}`} />
      ))}
      <Figure value={figures.openConflicts} label="Edits to settle" to="/sync" testId={`${prefix}-conflicts`} />
    </ul>
  );
}

/** The managers' start: open risk, overdue work, due inspections and edits to settle, for every site or one. */
export function OverviewPage() {
  const [siteId, setSiteId] = useState<string | undefined>(undefined);
  const overview = useOverview(siteId);
  const sites = useSites();
  const data = overview.data;

  return (
    <ManagerLayout title="Overview" loadedAt={overview.dataUpdatedAt} refreshFailed={overview.isError} testId="overview-page">
      <div className="manager-filters">
        <label>
          Site
          <select value={siteId ?? ''} onChange={(e) => setSiteId(e.target.value || undefined)} data-testid="overview-site">
            <option value="">Every site</option>
            {sites.data?.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
        </label>
      </div>
      {!data && (overview.isError ? <p role="alert">The overview could not be loaded: {overview.error.message}</p> : <p>Loading the overview…</p>)}
      {data && (
        <>
          <section className="manager-section" aria-labelledby="overview-totals">
            <h2 id="overview-totals">{siteId ? data.sites[0]?.siteName : 'Every site'}</h2>
            <Figures figures={data.totals} siteId={siteId} prefix="total" />
          </section>
          <ManagerDueSection siteId={siteId} />
          {!siteId && (
            <section className="manager-section" aria-labelledby="overview-sites">
              <h2 id="overview-sites">By site</h2>
              <TableScroll label="Sites table">
                <table className="manager-table" data-testid="overview-sites">
                  <thead>
                    <tr>
                      <th scope="col">Site</th>
                      <th scope="col">High to fix</th>
                      <th scope="col">Medium to fix</th>
                      <th scope="col">Low to fix</th>
                      <th scope="col">Fixes overdue</th>
                      <th scope="col">To verify</th>
                      <th scope="col">Inspections overdue</th>
                    </tr>
                  </thead>
                  <tbody>
                    {data.sites.map((s) => (
                      <tr key={s.siteId}>
                        <th scope="row">
                          <button type="button" className="manager-button manager-button--plain" onClick={() => setSiteId(s.siteId)}>
                            {s.siteName}
                          </button>
                        </th>
                        {BANDS.map((band) => (
                          <td key={band}>
                            <Link to={findingsLink(s.siteId, { riskBand: band, state: 'open,made-safe' })}>{s.openByBand[band]}</Link>
                          </td>
                        ))}
                        <td>
                          <Link to={findingsLink(s.siteId, { overdue: 'true' })}>{s.overdueFixes}</Link>
                        </td>
                        <td>
                          <Link to={findingsLink(s.siteId, { state: 'fixed' })}>{s.waitingVerification}</Link>
                        </td>
                        <td>
                          <Link to={reportsLink(s.siteId, { due: 'overdue' })}>{s.inspectionsOverdue}</Link>
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </TableScroll>
            </section>
          )}
        </>
      )}
    </ManagerLayout>
  );
}
