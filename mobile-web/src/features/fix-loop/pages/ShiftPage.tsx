import { IonContent, IonPage } from '@ionic/react';
import { Link } from 'react-router-dom';
import { formatDateTime } from '../../../lib/format-date';
import { AppHeader } from '../../../components/AppHeader';
import { RiskBadge } from '../../../components/RiskBadge';
import type { FindingRecord, ScaffoldRecord } from '../../../local-db/records';
import { RequireSession } from '../../auth/components/RequireSession';
import { useSession, useUnits } from '../../auth/session.queries';
import { ScaffoldStatusTag } from '../../scaffolds/components/ScaffoldStatusTag';
import { formatQuantity, type Units } from '../../../lib/units';
import { useShiftScaffolds } from '../fix-loop.queries';
import '../fix-loop.css';

/** A made-safe zone still in force: not yet lapsed at the end of its shift. */
const inForce = (finding: FindingRecord, now: Date) => finding.state === 'made-safe' && (!finding.madeSafeUntil || Date.parse(finding.madeSafeUntil) > now.getTime());

function ScaffoldShiftCard({ scaffold, findings, units, now }: { scaffold: ScaffoldRecord | undefined; findings: FindingRecord[]; units: Units; now: Date }) {
  const zones = findings.filter((f) => inForce(f, now));
  const stopping = findings.filter((f) => f.riskBand === 'High' && f.state === 'open');
  return (
    <section className="shift-card" data-testid="shift-scaffold">
      <h2>{scaffold ? `Scaffold ${scaffold.reference}` : 'A scaffold not on this phone yet'}</h2>
      {scaffold && (
        <p>
          <ScaffoldStatusTag status={scaffold.status} /> {scaffold.description}
          {scaffold.status !== 'cleared' && <span className="muted"> · restrictions: see the tag on the scaffold and its last report</span>}
        </p>
      )}
      <h3>Zones in force</h3>
      {zones.length === 0 ? (
        <p className="muted">None.</p>
      ) : (
        <ul>
          {zones.map((f) => (
            <li key={f.id}>
              {f.elevation}, lift {f.lift}, bay {f.bay}: {f.madeSafeNote ?? 'made safe'}; until {formatDateTime(f.madeSafeUntil)}
            </li>
          ))}
        </ul>
      )}
      <h3>High findings: no work below or beside until dealt with</h3>
      {stopping.length === 0 ? (
        <p className="muted">None open.</p>
      ) : (
        <ul data-testid="shift-stop-work">
          {stopping.map((f) => (
            <li key={f.id}>
              <Link to={`/fix-list/${f.id}`}>
                <RiskBadge band={f.riskBand} score={f.riskScore} /> {f.item.name}
              </Link>{' '}
              — {f.elevation}, lift {f.lift}, bay {f.bay}, {formatQuantity('height', f.heightM, units)} up
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** The foreman's start of shift: each scaffold in their area, its tag, the zones in force, and what stops work. */
export function ShiftPage() {
  const { session } = useSession();
  const units = useUnits();
  const area = useShiftScaffolds(session?.user.id);
  const now = new Date();
  const known = new Set(area?.scaffolds.map((s) => s.id));
  const unknown = (area?.findings ?? []).filter((f) => !known.has(f.scaffoldId));

  return (
    <IonPage>
      <AppHeader title="Shift start" backHref="/fix-list" />
      <IonContent className="ion-padding" data-testid="shift-page">
        <RequireSession>
          {() => (
            <div className="page-body">
              {area && area.scaffolds.length === 0 && unknown.length === 0 && <p className="empty-note">No scaffolds in your area on this phone.</p>}
              {area?.scaffolds.map((scaffold) => (
                <ScaffoldShiftCard key={scaffold.id} scaffold={scaffold} findings={area.findings.filter((f) => f.scaffoldId === scaffold.id)} units={units} now={now} />
              ))}
              {unknown.length > 0 && <ScaffoldShiftCard scaffold={undefined} findings={unknown} units={units} now={now} />}
            </div>
          )}
        </RequireSession>
      </IonContent>
    </IonPage>
  );
}
