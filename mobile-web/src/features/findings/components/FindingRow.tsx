import { IonIcon } from '@ionic/react';
import { alertCircleOutline, chevronForward, shieldCheckmarkOutline } from 'ionicons/icons';
import { FINDING_STATE_SHORT } from '@plummet/shared';
import { Link } from 'react-router-dom';
import { RiskBadge } from '../../../components/RiskBadge';
import type { FindingRecord } from '../../../local-db/records';
import { formatQuantity, type Units } from '../../../lib/units';
import './FindingRow.css';

/** One finding as a row: risk in words, the item, where, its energy and its state in a word. At least 88 px tall; grows when text wraps. */
export function FindingRow({ finding, units, showScaffold }: { finding: FindingRecord; units: Units; showScaffold?: string }) {
  return (
    <Link to={`/findings/${finding.id}`} className="finding-row" data-testid="finding-row" data-finding-id={finding.id}>
      <span className="finding-row__risk">
        <RiskBadge band={finding.riskBand} score={finding.riskScore} />
      </span>
      <span className="finding-row__body">
        <span className="finding-row__item">{finding.item.name}</span>
        <span className="finding-row__where">
          {showScaffold ? `${showScaffold} · ` : ''}
          {finding.elevation} · lift {finding.lift} · bay {finding.bay} · <span className="finding-row__nowrap">{formatQuantity('height', finding.heightM, units)} up</span>
        </span>
        <span className="finding-row__figures">
          {formatQuantity('energy', finding.estimate.impactEnergyJ, units)} · {finding.estimate.severity.label}
          <span className={`finding-row__state finding-row__state--${finding.state}`} data-testid="finding-state">
            <IonIcon icon={finding.state === 'open' ? alertCircleOutline : shieldCheckmarkOutline} aria-hidden="true" /> {FINDING_STATE_SHORT[finding.state]}
          </span>
        </span>
      </span>
      <IonIcon className="finding-row__chevron" icon={chevronForward} aria-hidden="true" />
    </Link>
  );
}
