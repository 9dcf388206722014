import { IonButton, IonContent, IonFooter, IonPage } from '@ionic/react';
import { useParams } from 'react-router-dom';
import { formatDate, isPast } from '../../../lib/format-date';
import { AppHeader } from '../../../components/AppHeader';
import { RiskBadge } from '../../../components/RiskBadge';
import type { FindingRecord, ScaffoldRecord } from '../../../local-db/records';
import { RequireSession } from '../../auth/components/RequireSession';
import { useFindingsOfSite } from '../../findings/findings.queries';
import { ScaffoldStatusTag } from '../../scaffolds/components/ScaffoldStatusTag';
import { useScaffoldsOfSite } from '../../scaffolds/scaffolds.queries';
import { useLocalSite } from '../sites.queries';
import './SitePage.css';

function openCounts(findings: readonly FindingRecord[], scaffoldId: string) {
  const open = findings.filter((f) => f.scaffoldId === scaffoldId && (f.state === 'open' || f.state === 'made-safe'));
  return { total: open.length, high: open.filter((f) => f.riskBand === 'High').length, top: open[0] };
}

function ScaffoldCard({ scaffold, findings }: { scaffold: ScaffoldRecord; findings: readonly FindingRecord[] }) {
  const counts = openCounts(findings, scaffold.id);
  const overdue = isPast(scaffold.nextDueAt);
  return (
    <article className="scaffold-card" data-testid="scaffold-card" data-reference={scaffold.reference}>
      <div className="scaffold-card__head">
        <h2 className="scaffold-card__name">{scaffold.reference}</h2>
        <ScaffoldStatusTag status={scaffold.status} />
      </div>
      <p className="scaffold-card__meta">{scaffold.description}</p>
      <p className="scaffold-card__meta">
        {scaffold.elevations.length} elevation{scaffold.elevations.length === 1 ? '' : 's'} · {scaffold.lifts} lifts · {scaffold.baysPerElevation} bays each
      </p>
      <p className={`scaffold-card__due ${overdue ? 'scaffold-card__due--overdue' : ''}`}>
        {overdue ? 'Inspection overdue since ' : 'Next inspection due '}
        {formatDate(scaffold.nextDueAt)}
      </p>
      <p className="scaffold-card__findings">
        {counts.total === 0 ? 'No open findings' : `${counts.total} open finding${counts.total === 1 ? '' : 's'}`}
        {counts.top && <RiskBadge band={counts.top.riskBand} score={counts.top.riskScore} />}
      </p>
      <IonButton expand="block" routerLink={`/scaffolds/${scaffold.id}`} data-testid="open-scaffold">
        Open {scaffold.reference}
      </IonButton>
    </article>
  );
}

export function SitePage() {
  const { siteId } = useParams();
  const site = useLocalSite(siteId);
  const scaffolds = useScaffoldsOfSite(siteId);
  const findings = useFindingsOfSite(siteId);

  return (
    <IonPage>
      <AppHeader title={site?.name ?? 'Site'} backHref="/" />
      <IonContent className="ion-padding">
        <RequireSession>
          {() => (
            <div className="page-body">
              {site === null && <p className="empty-note">This site is not on this phone. Go back and make it available offline while you have signal.</p>}
              {site && (
                <>
                  <p className="muted">
                    {site.address} · client {site.clientName}
                  </p>
                  <h1 className="page-heading">Scaffolds</h1>
                  <ul className="card-list">
                    {(scaffolds ?? []).map((scaffold) => (
                      <li key={scaffold.id}>
                        <ScaffoldCard scaffold={scaffold} findings={findings ?? []} />
                      </li>
                    ))}
                  </ul>
                </>
              )}
            </div>
          )}
        </RequireSession>
      </IonContent>
      {site && (
        <IonFooter>
          <div className="bottom-actions">
            <IonButton fill="outline" routerLink={`/sites/${site.id}/findings`} data-testid="open-finding-list">
              All findings ({findings?.length ?? '…'})
            </IonButton>
          </div>
        </IonFooter>
      )}
    </IonPage>
  );
}
