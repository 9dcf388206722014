import { RiskBadge } from '../../../components/RiskBadge';
import { formatQuantity, type Units } from '../../../lib/units';
import { describeChange, type Scenario } from '../what-if';
import './WhatIfTable.css';

/** Each control beside the current state: the risk, the energy, and the change in words. */
export function WhatIfTable({ scenarios, units }: { scenarios: readonly Scenario[]; units: Units }) {
  const now = scenarios.find((scenario) => scenario.id === 'now')?.result;
  return (
    <ul className="what-if" data-testid="what-if">
      {scenarios.map((scenario) => (
        <li key={scenario.id} className="what-if__row" data-testid={`what-if-${scenario.id}`} data-score={scenario.result?.riskScore}>
          <div className="what-if__head">
            <span className="what-if__label">{scenario.label}</span>
            {scenario.result && <RiskBadge band={scenario.result.riskBand} score={scenario.result.riskScore} />}
          </div>
          {scenario.result && (
            <div className="what-if__figures">
              {formatQuantity('height', scenario.input.heightM, units)} drop · {formatQuantity('energy', scenario.result.estimate.impactEnergyJ, units)} ·{' '}
              {scenario.result.estimate.severity.label} × {scenario.result.estimate.likelihood.label}
              {scenario.id !== 'now' && <strong className="what-if__change">{describeChange(now, scenario.result)}</strong>}
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}
