import { IonContent, IonIcon, IonPage } from '@ionic/react';
import { chevronForward } from 'ionicons/icons';
import { Link } from 'react-router-dom';
import { formatDateTime } from '../../../lib/format-date';
import { AppHeader } from '../../../components/AppHeader';
import { RiskBadge } from '../../../components/RiskBadge';
import { VirtualList } from '../../../components/VirtualList';
import { RequireSession } from '../../auth/components/RequireSession';
import { useUnits } from '../../auth/session.queries';
import { FindingThumb } from '../components/FindingThumb';
import { whereWords } from '../components/FixListRow';
import { useSitesById, useToVerify } from '../fix-loop.queries';
import { CONTROL_WORDS } from '../fix-loop-words';
import '../fix-loop.css';

const ROW_HEIGHT = 132;

/** The inspector's queue of fixed findings waiting for a second pair of eyes: High first, then the oldest fix. */
export function ToVerifyPage() {
  const units = useUnits();
  const entries = useToVerify();
  const sites = useSitesById();

  return (
    <IonPage>
      <AppHeader title="To verify" backHref="/" />
      <IonContent scrollY={false} data-testid="to-verify-page">
        <RequireSession>
          {() =>
            entries && entries.length === 0 ? (
              <p className="empty-note ion-margin">Nothing waits to be verified on this phone.</p>
            ) : (
              <VirtualList
                items={entries ?? []}
                rowHeight={ROW_HEIGHT}
                rowKey={(entry) => entry.finding.id}
                label="Fixed findings to verify, highest risk and oldest fix first"
                testId="to-verify-list"
                renderRow={({ finding, fix }) => (
                  <Link to={`/fix-list/${finding.id}`} className="fix-row" data-testid="verify-row" data-finding-id={finding.id}>
                    <FindingThumb findingId={finding.id} alt={`Photo of ${finding.item.name}`} />
                    <span className="fix-row__body">
                      <span className="fix-row__top">
                        <RiskBadge band={finding.riskBand} score={finding.riskScore} />
                        <span className="due-text">Fixed {formatDateTime(fix?.fixedAt ?? finding.updatedAt)}</span>
                      </span>
                      <span className="fix-row__item">{finding.item.name}</span>
                      <span className="fix-row__where">{whereWords({ finding, scaffold: undefined }, sites?.get(finding.siteId), units)}</span>
                      <span className="fix-row__note">
                        {fix ? `${fix.control ? CONTROL_WORDS[fix.control] : 'Fixed'}${fix.note ? `: “${fix.note}”` : ''}` : 'Fix details arrive with the next sync'}
                      </span>
                    </span>
                    <IonIcon className="fix-row__chevron" icon={chevronForward} aria-hidden="true" />
                  </Link>
                )}
              />
            )
          }
        </RequireSession>
      </IonContent>
    </IonPage>
  );
}
