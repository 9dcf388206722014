import { IonInput, IonNote } from '@ionic/react';

interface NumberFieldProps {
  label: string;
  unit: string;
  value: string;
  onChange(text: string): void;
  error?: string;
  helper?: string;
  testId?: string;
  placeholder?: string;
}

/**
 * A decimal field with its unit beside it. The text is kept as typed (a decimal comma, an empty
 * field); the caller converts it to SI, so the estimate follows every keystroke.
 */
export function NumberField({ label, unit, value, onChange, error, helper, testId, placeholder }: NumberFieldProps) {
  return (
    <div className="number-field">
      <IonInput
        label={`${label} (${unit})`}
        labelPlacement="stacked"
        fill="outline"
        inputmode="decimal"
        enterkeyhint="next"
        autocomplete="off"
        value={value}
        placeholder={placeholder}
        onIonInput={(event) => onChange(String(event.detail.value ?? ''))}
        data-testid={testId}
      />
      {helper && !error && <p className="field-helper">{helper}</p>}
      {error && (
        <IonNote color="danger" className="field-error" aria-live="polite">
          {error}
        </IonNote>
      )}
    </div>
  );
}
