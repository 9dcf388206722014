import { useId } from 'react';
import './Switch.css';

interface SwitchProps {
  label: string;
  checked: boolean;
  disabled?: boolean;
  onChange(checked: boolean): void;
  testId?: string;
}

/** An on/off switch on a native checkbox (role switch); the state shows as a word as well. */
export function Switch({ label, checked, disabled, onChange, testId }: SwitchProps) {
  const id = useId();
  return (
    <label className={`switch ${checked ? 'switch--on' : ''}`} htmlFor={id}>
      <span className="switch__label">{label}</span>
      <span className="switch__state" aria-hidden="true">
        {checked ? 'Yes' : 'No'}
      </span>
      <input
        id={id}
        type="checkbox"
        role="switch"
        className="switch__input"
        checked={checked}
        disabled={disabled}
        onChange={(event) => onChange(event.target.checked)}
        data-testid={testId}
      />
      <span className="switch__track" aria-hidden="true">
        <span className="switch__thumb" />
      </span>
    </label>
  );
}
