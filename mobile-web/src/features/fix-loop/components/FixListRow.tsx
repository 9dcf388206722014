import { IonIcon } from '@ionic/react';
import { chevronForward } from 'ionicons/icons';
import { Link } from 'react-router-dom';
import { RiskBadge } from '../../../components/RiskBadge';
import type { SiteRecord } from '../../../local-db/records';
import { formatQuantity, type Units } from '../../../lib/units';
import type { FixListEntry } from '../fix-loop-rules';
import { DueText } from './DueText';
import { FindingThumb } from './FindingThumb';

/** The usual height of a row, px: the virtual list's first guess; rows with more text are taller. */
export const FIX_ROW_HEIGHT = 132;

/** Site · scaffold · elevation · lift · bay · height, as far as the phone knows them. */
export function whereWords(entry: Pick<FixListEntry, 'finding' | 'scaffold'>, site: SiteRecord | undefined, units: Units): string {
  const { finding, scaffold } = entry;
  return [
    site?.name,
    scaffold ? `scaffold ${scaffold.reference}` : undefined,
    finding.elevation,
    `lift ${finding.lift}`,
    `bay ${finding.bay}`,
    `${formatQuantity('height', finding.heightM, units)} up`,
  ]
    .filter(Boolean)
    .join(' · ');
}

/** One finding on the fix list: what, where, how bad, when due, and what the inspector said. */
export function FixListRow({ entry, site, units }: { entry: FixListEntry; site: SiteRecord | undefined; units: Units }) {
  const { finding } = entry;
  return (
    <Link to={`/fix-list/${finding.id}`} className="fix-row" data-testid="fix-row" data-finding-id={finding.id}>
      <FindingThumb findingId={finding.id} alt={`Inspector’s photo of ${finding.item.name}`} />
      <span className="fix-row__body">
        <span className="fix-row__top">
          <RiskBadge band={finding.riskBand} score={finding.riskScore} />
          <DueText due={entry.due} />
        </span>
        <span className="fix-row__item">
          {finding.item.name}
          {finding.state === 'made-safe' && <span className="fix-row__state"> · made safe for now</span>}
        </span>
        <span className="fix-row__where">{whereWords(entry, site, units)}</span>
        <span className="fix-row__note">{finding.notes ? `“${finding.notes}”` : 'No note from the inspector'}</span>
      </span>
      <IonIcon className="fix-row__chevron" icon={chevronForward} aria-hidden="true" />
    </Link>
  );
}
