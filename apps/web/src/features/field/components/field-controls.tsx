import { useId, type ComponentPropsWithRef, type ReactNode } from 'react';
import { controlBorder, describedBy, FieldError, FieldHint } from '../../../components/form/field-parts';
import { classNames } from '../../../lib/class-names';

type DecimalFieldProps = Omit<ComponentPropsWithRef<'input'>, 'className' | 'children' | 'type' | 'inputMode'> & {
  label: string;
  /** Written after the box: "µF", "A", "°C". */
  unit?: string;
  hint?: ReactNode;
  error?: string | undefined;
  /** Whole numbers only (a counter): the phone shows digits without a decimal key. */
  whole?: boolean;
};

/**
 * A measured value: the phone's number keyboard (inputMode decimal or numeric), 48 px tall,
 * 16 px text so the page does not zoom, the unit beside the box in tabular figures.
 */
export function DecimalField({ label, unit, hint, error, whole = false, id, ...input }: DecimalFieldProps) {
  const generated = useId();
  const inputId = id ?? generated;
  return (
    <div className="grid min-w-0 content-start gap-1">
      <label htmlFor={inputId} className="font-medium">
        {label}
      </label>
      {hint && <FieldHint id={`${inputId}-hint`}>{hint}</FieldHint>}
      <div className="flex items-center gap-2">
        <input
          id={inputId}
          type="text"
          inputMode={whole ? 'numeric' : 'decimal'}
          autoComplete="off"
          enterKeyHint="next"
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(inputId, hint, error)}
          className={classNames(
            'numeric min-h-touch w-full min-w-0 rounded border bg-surface px-3 text-base text-ink',
            controlBorder(Boolean(error)),
          )}
          {...input}
        />
        {unit && <span className="numeric shrink-0 text-ink-muted">{unit}</span>}
      </div>
      {error && <FieldError id={`${inputId}-error`}>{error}</FieldError>}
    </div>
  );
}

type BigToggleProps = {
  label: string;
  checked: boolean;
  onChange: (checked: boolean) => void;
  /** The words for on and off, e.g. "Found" / "None"; the state is always written, never colour alone. */
  onWord?: string;
  offWord?: string;
  /** Marks "on" as a finding (bulging, leakage): drawn in the replace colour with a square. */
  onIsFinding?: boolean;
  disabled?: boolean;
};

/** A whole-row switch for a gloved hand: 48 px tall, the state written beside a glyph. */
export function BigToggle({ label, checked, onChange, onWord = 'Yes', offWord = 'No', onIsFinding = false, disabled }: BigToggleProps) {
  return (
    <button
      type="button"
      role="switch"
      aria-checked={checked}
      disabled={disabled}
      onClick={() => onChange(!checked)}
      className={classNames(
        'flex min-h-touch w-full items-center justify-between gap-3 rounded border px-3 py-2 text-left text-base',
        checked && onIsFinding ? 'border-2 border-replace bg-surface' : checked ? 'border-2 border-ink bg-sunken' : 'border-line-strong bg-surface',
        'disabled:cursor-not-allowed disabled:opacity-60',
      )}
    >
      <span className="min-w-0 font-medium">{label}</span>
      <span className={classNames('inline-flex shrink-0 items-center gap-2 font-semibold', checked && onIsFinding ? 'text-replace' : 'text-ink')}>
        <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-4 fill-none stroke-current stroke-2">
          {checked ? (
            onIsFinding ? (
              <rect x="2.5" y="2.5" width="11" height="11" className="fill-current" />
            ) : (
              <path d="M2.5 8.5 6.5 12.5 13.5 3.5" strokeLinecap="round" strokeLinejoin="round" />
            )
          ) : (
            <circle cx="8" cy="8" r="5.5" />
          )}
        </svg>
        {checked ? onWord : offWord}
      </span>
    </button>
  );
}

type ChoiceOption<T extends string> = { value: T; label: string };

type ChoiceGroupProps<T extends string> = {
  legend: string;
  options: ReadonlyArray<ChoiceOption<T>>;
  value: T | undefined;
  onChange: (value: T) => void;
  error?: string | undefined;
  columns?: 1 | 2 | 3;
};

const columnClass = { 1: 'grid-cols-1', 2: 'grid-cols-2', 3: 'grid-cols-3' } as const;

/** One of a few choices as large radio tiles (the measurement method, the contact condition). */
export function ChoiceGroup<T extends string>({ legend, options, value, onChange, error, columns = 2 }: ChoiceGroupProps<T>) {
  const id = useId();
  return (
    <fieldset className="grid min-w-0 gap-2" aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="mb-1 font-medium">{legend}</legend>
      <div className={classNames('grid gap-2', columnClass[columns])}>
        {options.map((option) => (
          <label
            key={option.value}
            className={classNames(
              'flex min-h-touch cursor-pointer items-center gap-2 rounded border px-3 py-2 text-base has-focus-visible:outline-3 has-focus-visible:outline-focus',
              value === option.value ? 'border-2 border-copper bg-sunken font-semibold' : 'border-line-strong bg-surface',
            )}
          >
            <input
              type="radio"
              name={id}
              value={option.value}
              checked={value === option.value}
              onChange={() => onChange(option.value)}
              className="size-5 shrink-0 accent-copper"
            />
            <span className="min-w-0">{option.label}</span>
          </label>
        ))}
      </div>
      {error && <FieldError id={`${id}-error`}>{error}</FieldError>}
    </fieldset>
  );
}

type NotesFieldProps = Omit<ComponentPropsWithRef<'textarea'>, 'className' | 'children'> & { label?: string; error?: string | undefined };

/** The notes of a reading: free text, up to 2000 characters (the contract's limit). */
export function NotesField({ label = 'Notes', error, id, ...textarea }: NotesFieldProps) {
  const generated = useId();
  const inputId = id ?? generated;
  return (
    <div className="grid gap-1">
      <label htmlFor={inputId} className="font-medium">
        {label}
      </label>
      <textarea
        id={inputId}
        rows={2}
        maxLength={2000}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${inputId}-error` : undefined}
        className={classNames('min-h-touch w-full min-w-0 rounded border bg-surface px-3 py-2 text-base text-ink', controlBorder(Boolean(error)))}
        {...textarea}
      />
      {error && <FieldError id={`${inputId}-error`}>{error}</FieldError>}
    </div>
  );
}
