import { explainDrop, LIKELIHOOD_RULES, RISK_BANDS, type FindingEstimateInput, type FindingEstimateResult } from '@plummet/shared';
import { useMemo } from 'react';
import { CautionNote } from '../../../components/CautionNote';
import { Sheet } from '../../../components/Sheet';
import { formatNumber } from '../../../lib/units';
import { dropInputOf } from '../finding-record';
import './HowComputedSheet.css';

interface HowComputedSheetProps {
  isOpen: boolean;
  onClose(): void;
  input?: FindingEstimateInput;
  result?: FindingEstimateResult;
}

/** Words for the physics' option values. */
const VALUE_WORDS: Record<string, string> = {
  'bare-head': 'bare head (the public, or anyone in a closed zone: the worst case)',
  helmet: 'head in an industrial helmet',
  'half-sine': 'half-sine',
  rectangular: 'rectangular',
  triangular: 'triangular',
};

function shown(value: number | string): string {
  return typeof value === 'number' ? formatNumber(value) : (VALUE_WORDS[value] ?? value);
}

/** The formulas, every input with its default and source, the assumptions and the caution. */
export function HowComputedSheet({ isOpen, onClose, input, result }: HowComputedSheetProps) {
  const explanation = useMemo(() => (isOpen && input ? explainDrop(dropInputOf(input)) : undefined), [isOpen, input]);
  const band = RISK_BANDS.find((rule) => rule.band === result?.riskBand);

  return (
    <Sheet open={isOpen} title="How this was computed" onClose={onClose} testId="how-computed">
        {explanation && result && (
          <div className="how-computed">
            <p>All in SI units, as computed on this phone with the same code the server uses.</p>
            <h2>Impact</h2>
            <table className="how-computed__inputs how-computed__impacts" data-testid="how-computed-impacts">
              <thead>
                <tr>
                  <th scope="col">Where it lands</th>
                  <th scope="col">Speed</th>
                  <th scope="col">Energy</th>
                  <th scope="col">Peak force</th>
                </tr>
              </thead>
              <tbody>
                {explanation.impacts.map((impact) => (
                  <tr key={impact.id} data-testid={`impact-${impact.id}`} data-governs={impact.governs}>
                    <th scope="row">
                      {impact.label}
                      {impact.governs && <span className="how-computed__governs">sets the estimate</span>}
                    </th>
                    <td>{formatNumber(impact.speedMps)} m/s</td>
                    <td>{formatNumber(impact.energyJ)} J</td>
                    <td>{formatNumber(impact.peakForceN)} N</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <p>{explanation.governingReason}</p>
            <h2>Inputs</h2>
            <table className="how-computed__inputs">
              <tbody>
                {explanation.inputs.map((row) => (
                  <tr key={row.field}>
                    <th scope="row">{row.label}</th>
                    <td>
                      {shown(row.value)} {row.unit}
                      {row.defaulted && <span className="how-computed__default">default</span>}
                      {row.source && <span className="how-computed__source">{row.source}</span>}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            <h2>Formulas</h2>
            <ul className="how-computed__formulas">
              {explanation.formulas.map((formula) => (
                <li key={formula.id}>
                  <strong>{formula.name}</strong>
                  <code>{formula.expression}</code>
                  <span>When: {formula.appliesWhen}</span>
                  <span className="how-computed__source">{formula.source}</span>
                </li>
              ))}
            </ul>
            {explanation.contactPreset && (
              <>
                <h2>Contact with the head</h2>
                <p>{explanation.contactPreset.reasoning}</p>
                <p className="how-computed__source">{explanation.contactPreset.source}</p>
              </>
            )}
            <h2>Severity</h2>
            <p>
              {result.severity} ({result.estimate.severity.label}). {explanation.severityBasis}
            </p>
            <h2>Likelihood</h2>
            <p>
              {result.likelihood} ({result.estimate.likelihood.label}), starting from 1 (Rare):
            </p>
            <ul>
              {result.estimate.likelihood.reasons.length === 0 && <li>No rule raised or capped it.</li>}
              {result.estimate.likelihood.reasons.map((reason) => (
                <li key={reason}>{reason}</li>
              ))}
            </ul>
            <p className="how-computed__source">Rules: {LIKELIHOOD_RULES[0]?.source}; the wind step names the Beaufort scale.</p>
            <h2>Risk</h2>
            <p>
              Severity {result.severity} × likelihood {result.likelihood} = {result.riskScore}: {result.riskBand} ({band ? `${band.min}–${band.max}` : ''}).
            </p>
            {band && <p className="how-computed__source">{band.source}</p>}
            <h2>Assumptions</h2>
            <ul>
              {explanation.assumptions.map((assumption) => (
                <li key={assumption}>{assumption}</li>
              ))}
            </ul>
            <CautionNote />
          </div>
        )}
    </Sheet>
  );
}
