import { scaffoldStatusWords } from '@plummet/shared';
import { Link } from 'react-router-dom';
import { ManagerLayout } from '../../manager/components/ManagerLayout';
import { useScaffolds, useSites } from '../setup.queries';
import { JURISDICTION_WORDS, REGIME_WORDS } from '../site-form';
import '../setup.css';

/** Every site with its scaffolds: add or change a site, add a scaffold to it, open a scaffold to change it. */
export function SitesSetupPage() {
  const sites = useSites();
  const scaffolds = useScaffolds();
  return (
    <ManagerLayout title="Sites and scaffolds" testId="sites-setup-page" loadedAt={sites.dataUpdatedAt} refreshFailed={sites.isError}>
      <div className="manager-actions">
        <Link className="manager-button" to="/setup/sites/new" data-testid="new-site">
          Add a site
        </Link>
      </div>
      {sites.isPending && <p>Loading the sites…</p>}
      {sites.data?.length === 0 && <p className="setup-muted">No sites yet. Add the first one to start recording inspections.</p>}
      <ul className="setup-list">
        {sites.data?.map((site) => {
          const own = (scaffolds.data ?? []).filter((s) => s.siteId === site.id && !s.archivedAt);
          return (
            <li key={site.id} className="setup-card" data-testid={`site-card-${site.name}`}>
              <h3>{site.name}</h3>
              <p>{site.address}</p>
              <p className="setup-muted">
                For {site.clientName} · {REGIME_WORDS[site.regime]} · {JURISDICTION_WORDS[site.jurisdiction] ?? site.jurisdiction} · {site.timeZone}
              </p>
              {own.length > 0 ? (
                <ul className="setup-scaffolds" aria-label={`Scaffolds of ${site.name}`}>
                  {own.map((s) => (
                    <li key={s.id}>
                      <Link to={`/setup/scaffolds/${s.id}`}>{s.reference}</Link> — {s.lifts} lifts, {s.elevations.length} elevation
                      {s.elevations.length === 1 ? '' : 's'}; {scaffoldStatusWords(s.status)}
                    </li>
                  ))}
                </ul>
              ) : (
                <p className="setup-muted">No scaffolds on this site yet.</p>
              )}
              <div className="setup-card__actions">
                <Link to={`/setup/sites/${site.id}`} data-testid="edit-site">
                  Change the site
                </Link>
                <Link to={`/setup/sites/${site.id}/scaffolds/new`} data-testid="new-scaffold">
                  Add a scaffold
                </Link>
              </div>
            </li>
          );
        })}
      </ul>
    </ManagerLayout>
  );
}
