import { lazy, Suspense, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { ManagerLayout } from '../components/ManagerLayout';
import { TableScroll } from '../components/TableScroll';
import { useSites, useTrends } from '../manager.queries';
import { formatDay } from '../../../lib/format-date';

const WeeklyChart = lazy(() => import('../components/WeeklyChart'));
const BANDS = ['High', 'Medium', 'Low'] as const;
// Colour and dash pattern both tell the bands apart.
const LOOK = { High: { stroke: '#9b1c1c', dash: undefined }, Medium: { stroke: '#8a5a00', dash: [8, 4] }, Low: { stroke: '#2b5d8a', dash: [2, 3] } };
const day = formatDay;

/** Findings raised and closed per week by band, time to fix, and places findings keep coming back. */
export function TrendsPage() {
  const [siteId, setSiteId] = useState<string | undefined>();
  const [weeks, setWeeks] = useState(12);
  const trends = useTrends(siteId, weeks);
  const sites = useSites();
  const data = trends.data;
  const chart = useMemo(() => {
    if (!data) return null;
    const starts = data.weeks.map((w) => Date.parse(w.weekStart));
    const series = (key: 'raised' | 'closed') => BANDS.map((b) => ({ label: b, values: data.weeks.map((w) => w[key][b]), ...LOOK[b] }));
    return { starts, raised: series('raised'), closed: series('closed') };
  }, [data]);

  return (
    <ManagerLayout title="Trends" loadedAt={trends.dataUpdatedAt} refreshFailed={trends.isError} testId="trends-page">
      <div className="manager-filters">
        <label>
          Site
          <select value={siteId ?? ''} onChange={(e) => setSiteId(e.target.value || undefined)}>
            <option value="">Every site</option>
            {sites.data?.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
          </select>
        </label>
        <label>
          Period
          <select value={weeks} onChange={(e) => setWeeks(Number(e.target.value))}>
            {[4, 12, 26, 52].map((n) => <option key={n} value={n}>Last {n} weeks</option>)}
          </select>
        </label>
      </div>
      {!data && (trends.isError ? <p role="alert">The trends could not be loaded: {trends.error.message}</p> : <p>Loading the trends…</p>)}
      {data && chart && (
        <>
          <section className="manager-section" aria-labelledby="trends-weekly">
            <h2 id="trends-weekly">Raised and closed per week</h2>
            <Suspense fallback={<p>Drawing the charts…</p>}>
              <WeeklyChart title="Raised per week" weekStarts={chart.starts} series={chart.raised} />
              <WeeklyChart title="Verified per week" weekStarts={chart.starts} series={chart.closed} />
            </Suspense>
            <TableScroll label="Raised and closed per week">
              <table className="manager-table" data-testid="trends-weekly-table">
                <caption>Findings raised and verified per week, by band</caption>
                <thead>
                  <tr>
                    <th scope="col">Week of</th>
                    {BANDS.map((b) => <th key={`r${b}`} scope="col">Raised {b}</th>)}
                    {BANDS.map((b) => <th key={`c${b}`} scope="col">Verified {b}</th>)}
                  </tr>
                </thead>
                <tbody>
                  {data.weeks.map((w) => (
                    <tr key={w.weekStart}>
                      <th scope="row">{day(w.weekStart)}</th>
                      {BANDS.map((b) => <td key={`r${b}`}>{w.raised[b]}</td>)}
                      {BANDS.map((b) => <td key={`c${b}`}>{w.closed[b]}</td>)}
                    </tr>
                  ))}
                </tbody>
              </table>
            </TableScroll>
          </section>
          <section className="manager-section" aria-labelledby="trends-fix">
            <h2 id="trends-fix">Median time to fix</h2>
            <table className="manager-table" data-testid="trends-fix-table">
              <thead>
                <tr>
                  <th scope="col">Band</th>
                  <th scope="col">Median from raised to fixed</th>
                  <th scope="col">Fixes counted</th>
                </tr>
              </thead>
              <tbody>
                {data.timeToFix.map((t) => (
                  <tr key={t.band}>
                    <th scope="row">{t.band}</th>
                    <td>{t.medianHours === null ? 'No fix in the period' : `${t.medianHours.toFixed(1)} hours`}</td>
                    <td>{t.fixes}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </section>
          <section className="manager-section" aria-labelledby="trends-repeat">
            <h2 id="trends-repeat">Repeat locations (three or more findings in 30 days)</h2>
            {data.repeatLocations.length === 0 ? (
              <p>No place has three findings or more in the last 30 days.</p>
            ) : (
              <table className="manager-table" data-testid="trends-repeat-table">
                <thead>
                  <tr>
                    <th scope="col">Site</th>
                    <th scope="col">Scaffold</th>
                    <th scope="col">Lift and bay</th>
                    <th scope="col">Findings</th>
                    <th scope="col">Last raised</th>
                  </tr>
                </thead>
                <tbody>
                  {data.repeatLocations.map((r) => (
                    <tr key={`${r.scaffoldId}-${r.lift}-${r.bay}`}>
                      <td>{r.siteName}</td>
                      <td>
                        <Link to={`/findings?scaffoldId=${r.scaffoldId}`}>{r.scaffoldReference}</Link>
                      </td>
                      <td>Lift {r.lift}, bay {r.bay} ({r.elevations.join(', ')})</td>
                      <td>{r.findings}</td>
                      <td>{day(r.lastRaisedAt)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
          </section>
        </>
      )}
    </ManagerLayout>
  );
}
