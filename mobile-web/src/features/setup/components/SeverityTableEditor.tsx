import { EXPOSURES, SEVERITY_LABELS, type Exposure, type SeverityLevel } from '@plummet/shared';
import type { FieldErrors } from '../form-errors';
import type { SeverityRows, ThresholdRow } from '../settings-form';

const EXPOSURE_WORDS: Record<Exposure, string> = { 'bare-head': 'Bare head (public, no head protection)', helmet: 'Worker in a hard hat' };
const EMPTY_ROW: ThresholdRow = { level: '3', quantity: 'energy', atLeast: '', reference: '', source: '' };

interface Props {
  rows: SeverityRows;
  errors: FieldErrors;
  onChange(rows: SeverityRows): void;
}

/** The organisation's own severity bands: per exposure, the energy or force at which each level starts, with its source. */
export function SeverityTableEditor({ rows, errors, onChange }: Props) {
  const setRow = (exposure: Exposure, index: number, change: Partial<ThresholdRow>) =>
    onChange({ ...rows, [exposure]: rows[exposure].map((row, i) => (i === index ? { ...row, ...change } : row)) });
  return (
    <div className="setup-severity" data-testid="severity-editor">
      {EXPOSURES.map((exposure) => (
        <div key={exposure} className="manager-table-wrap">
          <h3>{EXPOSURE_WORDS[exposure]}</h3>
          {errors[`severityTable.${exposure}`] && <p className="setup-field__error">{errors[`severityTable.${exposure}`]}</p>}
          <table className="manager-table">
            <thead>
              <tr>
                <th scope="col">Level</th>
                <th scope="col">On</th>
                <th scope="col">From (J or N)</th>
                <th scope="col">Reference in words</th>
                <th scope="col">Source</th>
                <th scope="col">
                  <span className="visually-hidden">Remove</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {rows[exposure].map((row, i) => {
                const err = (field: string) => errors[`severityTable.${exposure}.${i}.${field}`];
                const cell = (field: keyof ThresholdRow, label: string) => (
                  <td>
                    <input
                      aria-label={`${label}, ${exposure} row ${i + 1}`}
                      aria-invalid={err(field) ? true : undefined}
                      value={row[field]}
                      onChange={(e) => setRow(exposure, i, { [field]: e.target.value })}
                      data-testid={`severity-${exposure}-${i}-${field}`}
                    />
                    {err(field) && <small className="setup-field__error">{err(field)}</small>}
                  </td>
                );
                return (
                  <tr key={i}>
                    <td>
                      <select aria-label={`Level, ${exposure} row ${i + 1}`} value={row.level} onChange={(e) => setRow(exposure, i, { level: e.target.value })}>
                        {[2, 3, 4, 5].map((level) => (
                          <option key={level} value={String(level)}>
                            {level} {SEVERITY_LABELS[level as SeverityLevel]}
                          </option>
                        ))}
                      </select>
                      {err('level') && <small className="setup-field__error">{err('level')}</small>}
                    </td>
                    <td>
                      <select aria-label={`Quantity, ${exposure} row ${i + 1}`} value={row.quantity} onChange={(e) => setRow(exposure, i, { quantity: e.target.value as ThresholdRow['quantity'] })}>
                        <option value="energy">Energy (J)</option>
                        <option value="force">Peak force (N)</option>
                      </select>
                    </td>
                    {cell('atLeast', 'From')}
                    {cell('reference', 'Reference')}
                    {cell('source', 'Source')}
                    <td>
                      <button type="button" className="manager-button manager-button--plain" onClick={() => onChange({ ...rows, [exposure]: rows[exposure].filter((_, j) => j !== i) })}>
                        Remove
                      </button>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <button type="button" className="manager-button manager-button--plain" onClick={() => onChange({ ...rows, [exposure]: [...rows[exposure], { ...EMPTY_ROW }] })}>
            Add a threshold
          </button>
        </div>
      ))}
    </div>
  );
}
