import type { Site } from '@plummet/shared';
import { useQuery } from '@tanstack/react-query';
import { useOnlineStatus } from '../../../lib/use-online-status';
import { CautionNote } from '../../../components/CautionNote';
import { useReportSettled } from '../../../components/ShowWhenSettled';
import type { SiteRecord } from '../../../local-db/records';
import { SessionNote } from '../../auth/components/SessionNote';
import type { StoredSession } from '../../auth/session';
import { sitesQueryOptions, useLocalSites } from '../sites.queries';
import { SiteCard } from './SiteCard';

/** The server's list of sites when online, merged with the copies kept on the phone. */
function mergeSites(server: readonly Site[] | undefined, local: readonly SiteRecord[]): { site: Site; local?: SiteRecord }[] {
  const byId = new Map<string, { site: Site; local?: SiteRecord }>();
  for (const record of local) byId.set(record.id, { site: record, local: record });
  for (const site of server ?? []) byId.set(site.id, { site, local: byId.get(site.id)?.local });
  return [...byId.values()].sort((a, b) => a.site.name.localeCompare(b.site.name));
}

export function SitesOverview({ session, expired }: { session: StoredSession; expired: boolean }) {
  const online = useOnlineStatus();
  const local = useLocalSites();
  const server = useQuery({ ...sitesQueryOptions(), enabled: online && !expired });
  const sites = mergeSites(server.data, local ?? []);
  useReportSettled('sites', local !== undefined && (!online || expired || server.isFetched || server.isError));

  return (
    <div className="page-body">
      <SessionNote session={session} />
      <h1 className="page-heading">Sites</h1>
      {!online && <p className="muted">Offline: showing the sites kept on this phone.</p>}
      {server.isError && online && <p className="muted">The site list could not be loaded from the server; showing the sites on this phone.</p>}
      {local !== undefined && sites.length === 0 && (
        <p className="empty-note">{online ? 'Loading the sites of your organisation…' : 'No site is kept on this phone yet. Connect, then make a site available offline before the walk.'}</p>
      )}
      <ul className="card-list" data-testid="site-list">
        {sites.map(({ site, local: copy }) => (
          <li key={site.id}>
            <SiteCard site={site} local={copy} organisationId={session.user.organisation.id} online={online && !expired} />
          </li>
        ))}
      </ul>
      <CautionNote />
    </div>
  );
}
