import { IonIcon } from '@ionic/react';
import { callOutline } from 'ionicons/icons';
import { FINDING_STATE_WORDS, type Foreman } from '@plummet/shared';
import { formatDateTime } from '../../../lib/format-date';
import { CautionNote } from '../../../components/CautionNote';
import { RiskBadge } from '../../../components/RiskBadge';
import type { FindingRecord, SiteRecord, ScaffoldRecord } from '../../../local-db/records';
import { formatQuantity, type Units } from '../../../lib/units';
import type { FixListEntry } from '../fix-loop-rules';
import { DueText } from './DueText';
import { whereWords } from './FixListRow';

interface FindingFactsProps {
  entry: FixListEntry;
  site: SiteRecord | undefined;
  scaffold: ScaffoldRecord | undefined;
  assignee: Foreman | undefined;
  /** The signed-in user: a finding given to them reads "You". */
  selfId: string;
  units: Units;
}


/** What the finding is, where, how bad, when due, the inspector's note and the estimate (with its caution). */
export function FindingFacts({ entry, site, assignee, selfId, units }: FindingFactsProps) {
  const { finding } = entry;
  const estimate = finding.estimate;
  return (
    <section aria-label="The finding">
      <p className="fix-row__top">
        <RiskBadge band={finding.riskBand} score={finding.riskScore} />
        <DueText due={entry.due} />
      </p>
      <dl className="data-list" data-testid="finding-facts">
        <dt>State</dt>
        <dd data-testid="finding-state">{FINDING_STATE_WORDS[finding.state]}</dd>
        {finding.state === 'made-safe' && finding.madeSafeUntil && (
          <>
            <dt>Made safe until</dt>
            <dd>
              {formatDateTime(finding.madeSafeUntil)} (end of the shift){finding.madeSafeNote ? `: ${finding.madeSafeNote}` : ''}
            </dd>
          </>
        )}
        <dt>Where</dt>
        <dd>{whereWords(entry, site, units)}</dd>
        <dt>Inspector’s note</dt>
        <dd>{finding.notes || '—'}</dd>
        <dt>Given to</dt>
        <dd data-testid="finding-assignee">
          {entry.finding.assigneeId === selfId ? (
            'You'
          ) : assignee ? (
            <>
              {assignee.name}
              {assignee.phone && (
                <a className="tel-link" href={`tel:${assignee.phone.replace(/[^+\d]/g, '')}`} data-testid="assignee-phone">
                  {' '}
                  <IonIcon icon={callOutline} aria-hidden="true" /> {assignee.phone}
                </a>
              )}
            </>
          ) : finding.assigneeId ? (
            'A foreman (name arrives with the next sync)'
          ) : (
            'The scaffold’s foreman'
          )}
        </dd>
        {finding.handBack && (
          <>
            <dt>Handed back</dt>
            <dd data-testid="hand-back-shown">{finding.handBack.note || 'Waiting for a manager to reassign it'}</dd>
          </>
        )}
        <dt>Fall estimate</dt>
        <dd>
          {formatQuantity('speed', estimate.impactVelocityMps, units)} at impact, {formatQuantity('energy', estimate.impactEnergyJ, units)},
          peak force {formatQuantity('force', estimate.peakForceN, units)}; severity {estimate.severity.label}, likelihood {estimate.likelihood.label}
        </dd>
      </dl>
      <CautionNote />
    </section>
  );
}
