import { useId, type ReactNode } from 'react';
import { describedBy, FieldError, FieldHint } from './field-parts';

export type CheckboxOption<T extends string | number> = { value: T; label: string; description?: string };

type CheckboxGroupProps<T extends string | number> = {
  legend: string;
  hint?: ReactNode;
  error?: string | undefined;
  options: ReadonlyArray<CheckboxOption<T>>;
  value: readonly T[];
  onChange: (value: T[]) => void;
  onBlur?: () => void;
  /** Lays the options out in columns on a desk; one column on a phone. */
  columns?: 1 | 2 | 3;
};

const columnClass = { 1: '', 2: 'desk:grid-cols-2', 3: 'desk:grid-cols-3' } as const;

/** A set of checkboxes that edits one list value (roles, site grants); 48 px rows on a phone. */
export function CheckboxGroup<T extends string | number>({
  legend,
  hint,
  error,
  options,
  value,
  onChange,
  onBlur,
  columns = 1,
}: CheckboxGroupProps<T>) {
  const id = useId();
  // Values whose option is not shown (filtered out) stay as they are.
  const toggle = (option: T, checked: boolean) => {
    if (checked) onChange(value.includes(option) ? [...value] : [...value, option]);
    else onChange(value.filter((held) => held !== option));
  };
  return (
    <fieldset aria-describedby={describedBy(id, hint, error)} aria-invalid={error ? true : undefined} className="grid min-w-0 gap-2">
      <legend className="mb-1 font-medium">{legend}</legend>
      {hint && <FieldHint id={`${id}-hint`}>{hint}</FieldHint>}
      <div className={`grid gap-1 ${columnClass[columns]}`}>
        {options.map((option) => (
          <label
            key={option.value}
            className="flex min-h-touch cursor-pointer items-start gap-3 rounded px-2 py-2 hover:bg-sunken has-focus-visible:outline-3 has-focus-visible:outline-focus desk:min-h-control"
          >
            <input
              type="checkbox"
              checked={value.includes(option.value)}
              onChange={(event) => toggle(option.value, event.target.checked)}
              onBlur={onBlur}
              className="mt-1 size-5 shrink-0 accent-copper"
            />
            <span className="min-w-0">
              <span className="block">{option.label}</span>
              {option.description && <span className="block text-base text-ink-muted desk:text-sm">{option.description}</span>}
            </span>
          </label>
        ))}
      </div>
      {error && <FieldError id={`${id}-error`}>{error}</FieldError>}
    </fieldset>
  );
}
