import { useId, type ComponentPropsWithRef, type ReactNode } from 'react';
import { controlBorder, controlClass, describedBy, FieldError, FieldHint } from '../../../components/form/field-parts';
import { classNames } from '../../../lib/class-names';

type SelectFieldProps = Omit<ComponentPropsWithRef<'select'>, 'className' | 'children'> & {
  label: string;
  hint?: ReactNode;
  error?: string | undefined;
  options: ReadonlyArray<{ value: string; label: string }>;
  /** A first option standing for "none chosen" ("Any site"); left out when absent. */
  placeholder?: string;
  className?: string;
};

/** A labelled select with its hint and error tied to it, 48 px on a phone. */
export function SelectField({ label, hint, error, options, placeholder, id, className, ...select }: SelectFieldProps) {
  const generated = useId();
  const selectId = id ?? generated;
  return (
    <div className={classNames('grid content-start gap-1', className)}>
      <label htmlFor={selectId} className="font-medium">
        {label}
      </label>
      {hint && <FieldHint id={`${selectId}-hint`}>{hint}</FieldHint>}
      <select
        id={selectId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(selectId, hint, error)}
        className={classNames(controlClass, controlBorder(Boolean(error)))}
        {...select}
      >
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
      {error && <FieldError id={`${selectId}-error`}>{error}</FieldError>}
    </div>
  );
}

type TextAreaFieldProps = Omit<ComponentPropsWithRef<'textarea'>, 'className' | 'children'> & {
  label: string;
  hint?: ReactNode;
  error?: string | undefined;
};

/** A labelled multi-line field for instructions, reasons and the meaning of a signature. */
export function TextAreaField({ label, hint, error, id, rows = 4, ...textarea }: TextAreaFieldProps) {
  const generated = useId();
  const fieldId = id ?? generated;
  return (
    <div className="grid gap-1">
      <label htmlFor={fieldId} className="font-medium">
        {label}
      </label>
      {hint && <FieldHint id={`${fieldId}-hint`}>{hint}</FieldHint>}
      <textarea
        id={fieldId}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(fieldId, hint, error)}
        className={classNames(controlClass, controlBorder(Boolean(error)), 'py-2')}
        {...textarea}
      />
      {error && <FieldError id={`${fieldId}-error`}>{error}</FieldError>}
    </div>
  );
}

/** A titled panel of a page: a section with its heading, on the surface colour. */
export function Panel({ title, children, actions, className, headingLevel = 2 }: { title: string; children: ReactNode; actions?: ReactNode; className?: string; headingLevel?: 2 | 3 }) {
  const headingId = useId();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section aria-labelledby={headingId} className={classNames('min-w-0 rounded-md border border-line bg-surface p-4 desk:p-6', className)}>
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-x-4 gap-y-2">
        <Heading id={headingId} className="text-lg font-semibold">
          {title}
        </Heading>
        {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
      </div>
      {children}
    </section>
  );
}

/** Facts of a record as a description list: two columns on a desk, stacked on a phone. */
export function Facts({ items, className }: { items: ReadonlyArray<{ label: string; value: ReactNode }>; className?: string }) {
  return (
    <dl className={classNames('grid gap-x-6 gap-y-3 desk:grid-cols-[minmax(9rem,auto)_1fr]', className)}>
      {items.map((item) => (
        <div key={item.label} className="contents">
          <dt className="text-base text-ink-muted desk:text-sm desk:leading-6">{item.label}</dt>
          <dd className="-mt-2 min-w-0 desk:mt-0">{item.value}</dd>
        </div>
      ))}
    </dl>
  );
}
