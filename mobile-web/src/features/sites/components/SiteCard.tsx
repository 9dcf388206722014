import { Button, Icon } from '../../../components/ionic-elements';
import type { Site } from '@plummet/shared';
import { checkmarkCircle, cloudDownloadOutline } from 'ionicons/icons';
import { formatDateTime } from '../../../lib/format-date';
import { Spinner } from '../../../components/Spinner';
import type { SiteRecord } from '../../../local-db/records';
import { describeStorage } from '../../../sync/storage';
import { useMakeSiteOfflineMutation } from '../sites.mutations';
import './SiteCard.css';

interface SiteCardProps {
  site: Site;
  local?: SiteRecord;
  organisationId: string;
  online: boolean;
}

export function SiteCard({ site, local, organisationId, online }: SiteCardProps) {
  const makeOffline = useMakeSiteOfflineMutation();
  const result = makeOffline.data;
  const storage = result ? describeStorage(result.storage) : undefined;

  return (
    <article className="site-card" data-testid="site-card" data-site-id={site.id} data-offline={!!local?.offline}>
      <h2 className="site-card__name">{site.name}</h2>
      <p className="site-card__meta">{site.address}</p>
      <p className="site-card__meta">
        Client: {site.clientName} · {site.regime === '7-day' ? 'inspected every 7 days' : 'inspected before each shift'}
      </p>
      {local?.offline ? (
        <p className="site-card__offline" data-testid="site-offline-state">
          <Icon icon={checkmarkCircle} aria-hidden="true" /> Available offline · downloaded {formatDateTime(local.downloadedAt)}
        </p>
      ) : (
        <p className="site-card__not-offline">Not on this phone yet.</p>
      )}
      {result && storage && (
        <div className="site-card__report" data-testid="storage-report" role="status">
          <p>
            Downloaded {result.download.scaffolds} scaffold{result.download.scaffolds === 1 ? '' : 's'}, {result.download.findings} open finding
            {result.download.findings === 1 ? '' : 's'} and {result.download.catalogueItems} catalogue items
            {result.download.keptLocal > 0 ? ` (${result.download.keptLocal} changed on this phone kept as they are)` : ''}.
          </p>
          <p>{storage.used}</p>
          <p data-testid="storage-persistence" data-persistence={result.storage.persistence}>
            {storage.persistence}
          </p>
        </div>
      )}
      <div className="site-card__actions">
        {online && (
          <Button
            fill={local?.offline ? 'outline' : 'solid'}
            disabled={makeOffline.isPending}
            onClick={() => makeOffline.mutate({ site, organisationId })}
            data-testid="make-offline"
          >
            {makeOffline.isPending ? <Spinner /> : <Icon slot="start" icon={cloudDownloadOutline} aria-hidden="true" />}
            {makeOffline.isPending ? 'Downloading…' : local?.offline ? 'Update offline copy' : 'Make available offline'}
          </Button>
        )}
        {local?.offline && (
          <Button routerLink={`/sites/${site.id}`} data-testid="open-site">
            Open site
          </Button>
        )}
      </div>
    </article>
  );
}
