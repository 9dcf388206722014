import './ChoiceGroup.css';

export interface Choice<T extends string> {
  value: T;
  label: string;
  /** A second line, e.g. what the choice means. */
  hint?: string;
}

interface ChoiceGroupProps<T extends string> {
  legend: string;
  value: T | undefined;
  choices: readonly Choice<T>[];
  onChange(value: T): void;
  /** 'row': short labels side by side; 'stack': one per line, for long labels. */
  layout?: 'row' | 'stack';
  testId?: string;
  disabled?: boolean;
  /** The legend is still read out, but not shown (the card around says it already). */
  legendHidden?: boolean;
}

/**
 * A set of big radio buttons (≥ 48 px, gloved thumbs): native radios for keyboard and screen
 * readers, styled as tiles; the chosen one is marked by a tick and a heavier border, not colour alone.
 */
export function ChoiceGroup<T extends string>({ legend, value, choices, onChange, layout = 'row', testId, disabled, legendHidden }: ChoiceGroupProps<T>) {
  const name = `${testId ?? legend}`.replace(/\s+/g, '-').toLowerCase();
  return (
    <fieldset className={`choice-group choice-group--${layout}`} data-testid={testId} disabled={disabled}>
      <legend className={legendHidden ? 'visually-hidden' : 'choice-group__legend'}>{legend}</legend>
      <div className="choice-group__options">
        {choices.map((choice) => (
          <label key={choice.value} className={`choice ${choice.value === value ? 'choice--chosen' : ''}`} data-value={choice.value}>
            <input
              type="radio"
              name={name}
              value={choice.value}
              checked={choice.value === value}
              onChange={() => onChange(choice.value)}
            />
            <span className="choice__text">
              <span className="choice__label">{choice.label}</span>
              {choice.hint && <span className="choice__hint">{choice.hint}</span>}
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
