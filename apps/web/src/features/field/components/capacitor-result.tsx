import { starPhasesFromLegs, type Triple } from '@varden/engineering';
import { ConditionGlyph } from '../../../components/condition-glyph';
import { Quantity } from '../../../components/quantity';
import type { LiveCapacitorResult, ServerCapacitorResult } from '../readings/live-capacitor-result';
import { readerNumberFormat } from '../../../lib/reader-format';

const signed = readerNumberFormat({ signDisplay: 'exceptZero', minimumFractionDigits: 1, maximumFractionDigits: 1 });

function Deviation({ pct }: { pct: number }) {
  return (
    <span className="numeric whitespace-nowrap">
      <span className="font-medium">{signed.format(pct)}</span>
      {'\u00A0'}
      <span className="text-ink-muted">%</span>
    </span>
  );
}

/** The names of the legs as the assessment gives them: delta legs, star phases, or the single element. */
function legNames(connection: 'delta' | 'star' | 'single-phase'): string[] {
  if (connection === 'single-phase') return ['C'];
  return connection === 'star' ? ['C1', 'C2', 'C3'] : ['C12', 'C23', 'C31'];
}

/**
 * The result of a capacitor reading right under its fields, as the phone computes it while the
 * technician types: the band (glyph, colour and word), deviation, kvar at rated conditions, the
 * legs and the reasons. Announced politely to screen readers as it changes.
 */
export function LiveCapacitorResultView({
  result,
  nameplateKvar,
  connection,
}: {
  result: LiveCapacitorResult;
  nameplateKvar: number;
  connection: 'delta' | 'star' | 'single-phase';
}) {
  // The legs are delta-equivalent; a star unit's deviations are of its phases, so show those.
  const shown = result.kind === 'result' && connection === 'star' ? starPhasesFromLegs(result.legsUF as Triple) : result.kind === 'result' ? result.legsUF : [];
  return (
    <div aria-live="polite" className="rounded border border-line bg-sunken p-3" data-testid="live-result">
      {result.kind === 'incomplete' && <p className="text-ink-muted">{result.missing} The result appears here as you type.</p>}
      {result.kind === 'not-accepted' && (
        <p className="font-medium text-replace">
          <span className="font-semibold">Values not accepted: </span>
          {result.reason}
        </p>
      )}
      {result.kind === 'result' && (
        <div className="grid gap-3">
          <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
            <ConditionGlyph band={result.band} className="text-lg font-semibold" />
            <span>
              <Deviation pct={result.deviationPct} /> <span className="text-ink-muted">from nameplate</span>
            </span>
          </div>
          <dl className="grid grid-cols-2 gap-x-4 gap-y-1">
            <dt className="text-ink-muted">kvar at rated</dt>
            <dd className="text-right">
              <Quantity value={result.kvarAtRated} unit="kvar" maximumFractionDigits={2} />
            </dd>
            <dt className="text-ink-muted">Nameplate</dt>
            <dd className="text-right">
              <Quantity value={nameplateKvar} unit="kvar" />
            </dd>
          </dl>
          <table className="w-full text-left">
            <caption className="sr-only">Legs from the readings</caption>
            <thead>
              <tr className="text-ink-muted">
                <th scope="col" className="font-normal">
                  {connection === 'star' ? 'Phase' : 'Leg'}
                </th>
                <th scope="col" className="text-right font-normal">
                  µF
                </th>
                <th scope="col" className="text-right font-normal">
                  vs rated
                </th>
              </tr>
            </thead>
            <tbody>
              {legNames(connection).map((name, i) => (
                <tr key={name}>
                  <th scope="row" className="font-medium">
                    {name}
                  </th>
                  <td className="text-right">
                    <Quantity value={shown[i]} unit="µF" maximumFractionDigits={1} minimumFractionDigits={1} />
                  </td>
                  <td className="text-right">{result.legDeviationsPct[i] !== undefined && <Deviation pct={result.legDeviationsPct[i]} />}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {result.reasons.length > 0 && (
            <ul className="grid list-disc gap-1 pl-5">
              {result.reasons.map((reason) => (
                <li key={reason}>{reason}</li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  );
}

/** What the server made of the last reading sent: its stored evaluation, and whether it differs from the phone's. */
export function ServerCapacitorResultView({ result, differs }: { result: ServerCapacitorResult; differs: boolean }) {
  return (
    <div className="grid gap-1 rounded border border-line-strong p-3" data-testid="server-result">
      <p className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <span className="font-semibold">Server’s result:</span>
        {result.band ? <ConditionGlyph band={result.band} className="font-semibold" /> : <span>no band</span>}
        {result.deviationPct !== null && <Deviation pct={result.deviationPct} />}
        {result.kvarAtRated !== null && <Quantity value={result.kvarAtRated} unit="kvar" />}
      </p>
      {differs && <p className="font-medium">This differs from the result on the phone: the server’s is the record. Check the values you entered.</p>}
      {result.reasons.length > 0 && (
        <ul className="grid list-disc gap-1 pl-5 text-ink-muted">
          {result.reasons.map((reason) => (
            <li key={reason}>{reason}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
