import { useId, type ComponentPropsWithoutRef, type ReactNode } from 'react';
import type { FieldError, UseFormRegisterReturn } from 'react-hook-form';
import { classNames } from '../../../lib/class-names';

export type ControlProps = {
  id: string;
  'aria-describedby'?: string;
  'aria-invalid'?: true;
};

type FieldProps = {
  label: string;
  /** Written after the control: "V", "Hz", "kvar", "µF", "%". */
  unit?: string;
  hint?: ReactNode;
  error?: FieldError | undefined;
  /** Shown under the control while typing: a live computation. */
  live?: ReactNode;
  className?: string;
  children: (control: ControlProps) => ReactNode;
};

export const controlClass =
  'min-h-touch w-full min-w-0 rounded border border-line-strong bg-surface px-3 text-base text-ink desk:min-h-control aria-invalid:border-replace aria-invalid:border-2';

/** One form field: its label, the control with its unit beside it, a hint, and its error inline. */
export function Field({ label, unit, hint, error, live, className, children }: FieldProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ');
  const control: ControlProps = {
    id,
    ...(describedBy ? { 'aria-describedby': describedBy } : {}),
    ...(error ? { 'aria-invalid': true as const } : {}),
  };
  return (
    <div className={classNames('grid min-w-0 content-start gap-1', className)}>
      <label htmlFor={id} className="text-base font-medium desk:text-sm">
        {label}
        {unit && <span className="sr-only"> ({unit})</span>}
      </label>
      <div className="flex min-w-0 items-stretch gap-2">
        <div className="min-w-0 flex-1">{children(control)}</div>
        {unit && (
          <span aria-hidden="true" className="numeric flex min-w-8 items-center text-base text-ink-muted">
            {unit}
          </span>
        )}
      </div>
      {hint && (
        <p id={hintId} className="text-base text-ink-muted desk:text-sm">
          {hint}
        </p>
      )}
      {error?.message && (
        <p id={errorId} className="flex gap-1 text-base font-medium text-replace desk:text-sm">
          <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mt-1 size-3 shrink-0 fill-none stroke-current stroke-2">
            <path d="M8 2v7M8 12.5v.5" strokeLinecap="round" />
          </svg>
          {error.message}
        </p>
      )}
      {live && (
        <div aria-live="polite" className="text-base desk:text-sm">
          {live}
        </div>
      )}
    </div>
  );
}

type InputFieldProps = Omit<FieldProps, 'children'> & {
  registration: UseFormRegisterReturn;
  input?: Omit<ComponentPropsWithoutRef<'input'>, 'id' | keyof UseFormRegisterReturn>;
};

/** A number typed on a phone's numeric keypad: text with inputMode decimal, so "0,95" and "0.95" both work. */
export function NumberField({ registration, input, ...field }: InputFieldProps) {
  return (
    <Field {...field}>
      {(control) => (
        <input
          {...control}
          {...registration}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          className={classNames(controlClass, 'numeric')}
          {...input}
        />
      )}
    </Field>
  );
}

export function TextField({ registration, input, ...field }: InputFieldProps) {
  return (
    <Field {...field}>
      {(control) => <input {...control} {...registration} type="text" className={controlClass} {...input} />}
    </Field>
  );
}

export function DateField({ registration, input, ...field }: InputFieldProps) {
  return (
    <Field {...field}>
      {(control) => <input {...control} {...registration} type="date" className={classNames(controlClass, 'numeric')} {...input} />}
    </Field>
  );
}

type SelectFieldProps = Omit<FieldProps, 'children'> & {
  registration: UseFormRegisterReturn;
  options: ReadonlyArray<{ value: string; label: string }>;
};

export function SelectField({ registration, options, ...field }: SelectFieldProps) {
  return (
    <Field {...field}>
      {(control) => (
        <select {...control} {...registration} className={controlClass}>
          {options.map((option) => (
            <option key={option.value} value={option.value}>
              {option.label}
            </option>
          ))}
        </select>
      )}
    </Field>
  );
}

type CheckboxFieldProps = {
  label: string;
  hint?: ReactNode;
  registration: UseFormRegisterReturn;
};

export function CheckboxField({ label, hint, registration }: CheckboxFieldProps) {
  const id = useId();
  return (
    <div className="grid gap-1">
      <label htmlFor={id} className="flex min-h-touch cursor-pointer items-center gap-3 text-base font-medium desk:min-h-control desk:text-sm">
        <input id={id} type="checkbox" {...registration} className="size-5 accent-copper" aria-describedby={hint ? `${id}-hint` : undefined} />
        {label}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="text-base text-ink-muted desk:text-sm">
          {hint}
        </p>
      )}
    </div>
  );
}

/** A group of fields under a caption; two or three columns on a desk. */
export function FieldGroup({ legend, children, columns = 2 }: { legend: string; children: ReactNode; columns?: 2 | 3 }) {
  return (
    <fieldset className="grid min-w-0 gap-4">
      <legend className="mb-2 text-lg font-semibold">{legend}</legend>
      <div className={classNames('grid min-w-0 gap-4', columns === 3 ? 'desk:grid-cols-3' : 'desk:grid-cols-2')}>{children}</div>
    </fieldset>
  );
}
