import type { SafetyCard } from '@varden/schemas';
import { useId } from 'react';
import { formatDateTime } from '../../../lib/date-format';
import { formatWait } from '../readings/decimal';

export type Acknowledgement = { kind: 'none' } | { kind: 'on-phone' } | { kind: 'recorded'; at: string; byName: string | null };

/** The card's steps; the server words them for the bank, these stand in if it sends none. */
const standInSteps = [
  { title: 'Isolate and lock out', text: 'Isolate the bank from every supply and lock and tag out each isolation point.' },
  { title: 'Wait the discharge time', text: 'Capacitors hold their charge after isolation.' },
  { title: 'Verify absence of voltage', text: 'Test every terminal with a voltage tester proved before and after.' },
  { title: 'Short and earth', text: 'Discharge, then short and earth the terminals; keep the shorts on while you work.' },
  { title: 'PPE', text: 'Wear the PPE the site’s arc-flash assessment sets.' },
];

function Steps({ card }: { card: SafetyCard }) {
  const steps = card.steps.length > 0 ? card.steps : standInSteps;
  return (
    <ol className="grid gap-3">
      {steps.map((step, i) => (
        <li key={step.title} className="grid grid-cols-[2rem_1fr] gap-2">
          <span aria-hidden="true" className="numeric flex size-8 items-center justify-center rounded-full border-2 border-ink font-semibold">
            {i + 1}
          </span>
          <div className="min-w-0">
            <p className="font-semibold">{step.title}</p>
            <p className="text-ink-muted">{step.text}</p>
          </div>
        </li>
      ))}
    </ol>
  );
}

/**
 * The safety card every technician order opens with ("Before you open the bank"): isolate and
 * lock out, the discharge wait from the bank's nameplates, verify absence of voltage, short and
 * earth, PPE; and that the site's rules, local codes and licensed practice come first. Once
 * acknowledged it folds away, still one tap from being read again.
 */
export function SafetyCardPanel({ card, acknowledgement }: { card: SafetyCard; acknowledgement: Acknowledgement }) {
  const headingId = useId();
  const wait = formatWait(card.dischargeWaitS);
  const body = (
    <div className="grid gap-4">
      <p className="rounded border-2 border-ink bg-sunken p-3 text-lg font-semibold" data-testid="discharge-wait">
        Wait at least {wait} after isolation
        <span className="block text-base font-normal text-ink-muted">
          {card.dischargeWaitFromNameplates
            ? 'The longest rated discharge time on this bank’s nameplates.'
            : 'No discharge time is registered for these units: a cautious default. Longer if the nameplates on site say so.'}
        </span>
      </p>
      <Steps card={card} />
      {card.maxStoredEnergyJ !== null && (
        <p className="text-ink-muted">
          One element of these units stores up to <span className="numeric font-medium text-ink">{Math.round(card.maxStoredEnergyJ)} J</span> at rated voltage.
        </p>
      )}
      <p className="text-ink-muted">{card.ppeNote}</p>
      <p className="font-semibold">Your site’s safety rules, local codes and licensed practice come first.</p>
      <p className="text-ink-muted">{card.deferral}</p>
    </div>
  );

  if (acknowledgement.kind === 'none') {
    return (
      <section aria-labelledby={headingId} data-testid="safety-card" className="grid gap-4 rounded-md border-2 border-ink bg-surface p-4 desk:p-6">
        <h2 id={headingId} className="flex items-center gap-2 text-xl font-semibold">
          <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-6 shrink-0 fill-none stroke-ink stroke-[1.5]">
            <path d="M1 8h5M10 8h5M6 3v10M10 3v10" strokeLinecap="round" />
          </svg>
          Before you open the bank
        </h2>
        {body}
        <p className="text-ink-muted">When every step is done, acknowledge the card with the button at the foot of the screen. Your acknowledgement is recorded on the order.</p>
      </section>
    );
  }
  return (
    <section aria-labelledby={headingId} data-testid="safety-card" className="grid gap-2 rounded-md border border-line bg-surface p-4 desk:p-6">
      <h2 id={headingId} className="flex items-center gap-2 text-lg font-semibold">
        <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-5 shrink-0 fill-none stroke-healthy stroke-[2.5]">
          <path d="M2.5 8.5 6.5 12.5 13.5 3.5" strokeLinecap="round" strokeLinejoin="round" />
        </svg>
        Safety card acknowledged
      </h2>
      <p className="text-ink-muted">
        {acknowledgement.kind === 'recorded'
          ? `${acknowledgement.byName ?? 'You'}, ${formatDateTime(acknowledgement.at)}. Discharge wait ${wait}.`
          : `On this phone, waiting to send. Discharge wait ${wait}.`}
      </p>
      <details>
        <summary className="flex min-h-touch cursor-pointer items-center font-medium text-copper">Read the card again</summary>
        <div className="mt-2">{body}</div>
      </details>
    </section>
  );
}
