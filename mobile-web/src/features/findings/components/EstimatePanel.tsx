import { IonButton, IonIcon } from '@ionic/react';
import type { FindingEstimateResult } from '@plummet/shared';
import { calculatorOutline } from 'ionicons/icons';
import { CautionNote } from '../../../components/CautionNote';
import { RiskBadge } from '../../../components/RiskBadge';
import { formatQuantity, formatWind, type Units, type WindUnits } from '../../../lib/units';
import './EstimatePanel.css';

interface EstimatePanelProps {
  result?: FindingEstimateResult;
  /** Why there is no estimate yet (missing or refused input). */
  waitingFor?: string;
  windSpeedMps: number | null;
  units: Units;
  windUnits: WindUnits;
  onExplain(): void;
}

/** The fall estimate in full, recomputed on every keystroke; with its sources one tap away. */
export function EstimatePanel({ result, waitingFor, windSpeedMps, units, windUnits, onExplain }: EstimatePanelProps) {
  if (!result) {
    return (
      <section className="estimate-panel estimate-panel--waiting" data-testid="estimate-panel" aria-live="polite">
        <h2 className="estimate-panel__title">Fall estimate</h2>
        <p>{waitingFor ?? 'Fill in the item and the height to see the estimate.'}</p>
        <CautionNote />
      </section>
    );
  }
  const e = result.estimate;
  return (
    <section className="estimate-panel" data-testid="estimate-panel" aria-live="polite">
      <div className="estimate-panel__head">
        <h2 className="estimate-panel__title">Fall estimate</h2>
        <span data-testid="estimate-risk" data-band={result.riskBand} data-score={result.riskScore}>
          <RiskBadge band={result.riskBand} score={result.riskScore} />
        </span>
      </div>
      <dl className="estimate-panel__figures">
        <div>
          <dt>Impact speed</dt>
          <dd data-testid="estimate-speed">{formatQuantity('speed', e.impactVelocityMps, units)}</dd>
        </div>
        <div>
          <dt>Impact energy</dt>
          <dd data-testid="estimate-energy">{formatQuantity('energy', e.impactEnergyJ, units)}</dd>
        </div>
        <div>
          <dt>Peak force</dt>
          <dd data-testid="estimate-force">{formatQuantity('force', e.peakForceN, units)}</dd>
        </div>
        <div>
          <dt>Drift in the wind</dt>
          <dd data-testid="estimate-drift">
            {windSpeedMps && windSpeedMps > 0 ? `${formatQuantity('distance', e.driftM, units)} at ${formatWind(windSpeedMps, windUnits)}` : 'No wind given'}
          </dd>
        </div>
        <div>
          <dt>Severity</dt>
          <dd data-testid="estimate-severity">
            {result.severity} · {e.severity.label}
          </dd>
        </div>
        <div>
          <dt>Likelihood</dt>
          <dd data-testid="estimate-likelihood">
            {result.likelihood} · {e.likelihood.label}
          </dd>
        </div>
      </dl>
      <p className="estimate-panel__basis">{e.severity.basis}</p>
      {e.driftM > 0 && (
        <p className="estimate-panel__basis" data-testid="estimate-impacts" data-governing={e.governingImpact}>
          {e.governingImpact === 'wind' ? 'Figures for the landing over the ground with the wind, the faster: ' : 'Figures for the landing in still air, the faster: '}
          still air {formatQuantity('speed', e.stillAirImpactVelocityMps, units)}, {formatQuantity('energy', e.stillAirImpactEnergyJ, units)}; with the wind{' '}
          {formatQuantity('speed', e.windImpactVelocityMps, units)}, {formatQuantity('energy', e.windImpactEnergyJ, units)}.
        </p>
      )}
      <p className="estimate-panel__basis">
        Worst case with no air at all: {formatQuantity('speed', e.vacuumImpactVelocityMps, units)}. Fall time {formatQuantity('time', e.fallTimeS, units)}.
      </p>
      <IonButton fill="outline" expand="block" onClick={onExplain} data-testid="explain-estimate">
        <IonIcon slot="start" icon={calculatorOutline} aria-hidden="true" />
        How this was computed
      </IonButton>
      <CautionNote />
    </section>
  );
}

/** The estimate in one line under the toolbar, so it stays in view while the form scrolls. */
export function EstimateStrip({ result, units }: { result?: FindingEstimateResult; units: Units }) {
  return (
    <div className="estimate-strip" data-testid="estimate-strip" aria-live="polite">
      {result ? (
        <>
          <RiskBadge band={result.riskBand} score={result.riskScore} />
          <span>
            {formatQuantity('energy', result.estimate.impactEnergyJ, units)} · {formatQuantity('speed', result.estimate.impactVelocityMps, units)} ·{' '}
            {result.estimate.severity.label}
          </span>
        </>
      ) : (
        <span>Estimate: waiting for the item and height</span>
      )}
    </div>
  );
}
