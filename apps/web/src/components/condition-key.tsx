import { ConditionGlyph, conditionBands, type ConditionBand } from './condition-glyph';

const meanings: Record<ConditionBand, string> = {
  healthy: 'Readings sit within the unit’s tolerance.',
  watch: 'Drifting towards its limit; keep it in view.',
  replace: 'Past its limit; plan the replacement.',
  remeasure: 'The readings do not add up; measure again.',
};

/** The four condition bands with what each one asks of the team. */
export function ConditionKey() {
  return (
    <section aria-labelledby="condition-key-heading" className="rounded-md border border-line bg-surface p-4 desk:p-6">
      <h2 id="condition-key-heading" className="mb-3 text-lg font-semibold">
        Condition key
      </h2>
      <dl className="grid gap-3">
        {conditionBands.map((band) => (
          <div key={band} className="grid gap-x-4 gap-y-0.5 desk:grid-cols-[8rem_1fr]">
            <dt className="font-medium">
              <ConditionGlyph band={band} />
            </dt>
            <dd className="text-ink-muted">{meanings[band]}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
