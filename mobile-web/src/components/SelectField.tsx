import { useId } from 'react';

interface SelectFieldProps<T extends string | number> {
  label: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange(value: T): void;
  testId?: string;
}

/** A native select: the phone's own picker, large and familiar, with no overlay to load. */
export function SelectField<T extends string | number>({ label, value, options, onChange, testId }: SelectFieldProps<T>) {
  const id = useId();
  return (
    <div className="select-field">
      <label htmlFor={id} className="select-field__label">
        {label}
      </label>
      <select
        id={id}
        className="select-field__control"
        value={String(value)}
        data-testid={testId}
        onChange={(event) => {
          const chosen = options.find((option) => String(option.value) === event.target.value);
          if (chosen) onChange(chosen.value);
        }}
      >
        {options.map((option) => (
          <option key={String(option.value)} value={String(option.value)}>
            {option.label}
          </option>
        ))}
      </select>
    </div>
  );
}
