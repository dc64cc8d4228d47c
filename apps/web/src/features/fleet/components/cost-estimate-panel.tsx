import { siteHealthQuery, type SiteHealth } from '@varden/schemas';
import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/button';
import { controlBorder, controlClass, FieldError } from '../../../components/form/field-parts';
import { Quantity } from '../../../components/quantity';
import { classNames } from '../../../lib/class-names';

type Cost = NonNullable<SiteHealth['cost']>;

/** The hours-a-month field: checked with the API's own schema, then handed up. */
function HoursForm({ hoursPerMonth, onChange, busy }: { hoursPerMonth: number; onChange: (hours: number) => void; busy: boolean }) {
  const id = useId();
  const [text, setText] = useState(String(hoursPerMonth));
  const [error, setError] = useState<string | undefined>();
  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const typed = Number(text);
    if (text.trim() === '' || !Number.isFinite(typed)) {
      setError('Enter the hours of load a month, 1 to 744.');
      return;
    }
    // The API's own rule (1 to 744 hours), with its words.
    const parsed = siteHealthQuery.safeParse({ hoursPerMonth: typed });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? 'Enter the hours of load a month, 1 to 744.');
      return;
    }
    setError(undefined);
    onChange(parsed.data.hoursPerMonth);
  };
  return (
    <form onSubmit={submit} noValidate data-print="hide" className="grid gap-1">
      <label htmlFor={id} className="font-medium">
        Hours of load a month
      </label>
      <div className="flex flex-wrap items-start gap-2">
        <div className="w-32">
        <input
          id={id}
          type="number"
          inputMode="numeric"
          min={1}
          max={744}
          step={1}
          value={text}
          onChange={(event) => setText(event.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          className={classNames(controlClass, controlBorder(Boolean(error)), 'numeric')}
        />
        </div>
        <Button type="submit" disabled={busy}>
          {busy ? 'Recalculating…' : 'Recalculate'}
        </Button>
      </div>
      {error && <FieldError id={`${id}-error`}>{error}</FieldError>}
    </form>
  );
}

/** "Cost of lost correction": the monthly estimate, what it rests on, and the hours it assumes. */
export function CostEstimatePanel({
  cost,
  lostKvar,
  onHoursChange,
  busy,
}: {
  cost: Cost;
  lostKvar: number;
  onHoursChange: (hours: number) => void;
  busy: boolean;
}) {
  return (
    <div className="grid gap-4 desk:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
      <div className="grid content-start gap-3">
        <p className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
          <span className="rounded border border-line-strong px-2 py-0.5 text-base font-semibold tracking-wide uppercase desk:text-xs">Estimate</span>
          <span className="text-2xl" data-testid="cost-estimate">
            <Quantity value={cost.lostMonthlyCost} unit={`${cost.currency} a month`} maximumFractionDigits={0} />
          </span>
        </p>
        {cost.extraKvarhPerMonth <= 0 && (
          <p className="text-base text-ink-muted desk:text-sm">
            Nothing extra: even with the lost kvar the reactive energy stays within what the tariff allows, or was charged as much before.
          </p>
        )}
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-base desk:text-sm">
          <dt className="text-ink-muted">Tariff</dt>
          <dd>{cost.basis.charAt(0).toUpperCase() + cost.basis.slice(1)}</dd>
          <dt className="text-ink-muted">Price</dt>
          <dd>
            <Quantity value={cost.pricePerKvarh} unit={`${cost.currency}/kvarh`} maximumFractionDigits={4} />
          </dd>
          <dt className="text-ink-muted">Lost correction</dt>
          <dd>
            <Quantity value={lostKvar} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} />
          </dd>
          <dt className="text-ink-muted">Extra charged energy</dt>
          <dd>
            <Quantity value={cost.extraKvarhPerMonth} unit="kvarh a month" maximumFractionDigits={0} />
          </dd>
          <dt className="text-ink-muted">Hours of load</dt>
          <dd>
            <Quantity value={cost.hoursPerMonth} unit="h a month" maximumFractionDigits={0} />
          </dd>
        </dl>
        <HoursForm key={cost.hoursPerMonth} hoursPerMonth={cost.hoursPerMonth} onChange={onHoursChange} busy={busy} />
      </div>
      <div className="grid content-start gap-2">
        <h3 className="font-semibold">What the estimate assumes</h3>
        <ul className="grid list-disc gap-1 pl-5 text-base desk:text-sm">
          {cost.assumptions.map((assumption) => (
            <li key={assumption}>{assumption}</li>
          ))}
        </ul>
        <p className="text-base text-ink-muted desk:text-sm">The utility’s bill decides; this estimate only shows the size of the charge the lost kvar cause.</p>
      </div>
    </div>
  );
}
