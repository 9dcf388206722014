import { IonIcon } from '@ionic/react';
import { add, remove } from 'ionicons/icons';
import { useId } from 'react';
import './Stepper.css';

interface StepperProps {
  label: string;
  value: number;
  min: number;
  max: number;
  onChange(value: number): void;
  testId?: string;
}

/**
 * A whole number with big − and + buttons (56 px, for gloved hands) either side of the value in
 * large type. The value is announced as the buttons change it.
 */
export function Stepper({ label, value, min, max, onChange, testId }: StepperProps) {
  const id = useId();
  const step = (by: number) => onChange(Math.min(max, Math.max(min, value + by)));
  return (
    <div className="stepper" role="group" aria-labelledby={id} data-testid={testId} data-value={value}>
      <span id={id} className="stepper__label">
        {label}
      </span>
      <div className="stepper__controls">
        <button type="button" className="stepper__button" onClick={() => step(-1)} disabled={value <= min} aria-label={`${label}: one less`} data-testid={testId && `${testId}-less`}>
          <IonIcon icon={remove} aria-hidden="true" />
        </button>
        <output className="stepper__value" aria-live="polite" data-testid={testId && `${testId}-value`}>
          {value}
        </output>
        <button type="button" className="stepper__button" onClick={() => step(1)} disabled={value >= max} aria-label={`${label}: one more`} data-testid={testId && `${testId}-more`}>
          <IonIcon icon={add} aria-hidden="true" />
        </button>
      </div>
    </div>
  );
}
