import type { SiteHealth } from '@varden/schemas';
import { ConditionGlyph, conditionBands } from '../../../components/condition-glyph';
import { classNames } from '../../../lib/class-names';

type Bands = SiteHealth['bands'];

export const noReadingLabel = 'No reading yet';

/**
 * The "no reading yet" mark: a dashed outline with a bar, in the muted ink, borrowing none of
 * the four bands' shapes or colours (the register's panel drawing draws the same mark).
 */
export function NoReadingMark({ className }: { className?: string }) {
  return (
    <span data-band="none" className={classNames('inline-flex items-center gap-1.5 whitespace-nowrap text-ink-muted', className)}>
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-[1em] shrink-0 fill-none stroke-ink-muted">
        <circle cx="8" cy="8" r="5.75" strokeWidth="1.5" strokeDasharray="2.4 1.8" />
        <path d="M5.5 8h5" strokeWidth="1.5" strokeLinecap="round" />
      </svg>
      <span>{noReadingLabel}</span>
    </span>
  );
}

type BandKey = keyof Bands;

/** Units per condition band as glyph, word and count; the bands with none are left out unless `all`; `only` picks bands. */
export function BandCounts({ bands, all = false, only, className }: { bands: Bands; all?: boolean; only?: readonly BandKey[]; className?: string }) {
  const picked = (key: BandKey) => !only || only.includes(key);
  const shown = conditionBands.filter((band) => picked(band) && (all || bands[band] > 0));
  return (
    <ul className={classNames('flex flex-wrap gap-x-5 gap-y-2', className)} aria-label="Units by condition">
      {shown.map((band) => (
        <li key={band} className="inline-flex items-baseline gap-2">
          <ConditionGlyph band={band} />
          <span className="numeric font-semibold">{bands[band]}</span>
        </li>
      ))}
      {picked('noReading') && (all || bands.noReading > 0) && (
        <li className="inline-flex items-baseline gap-2">
          <NoReadingMark />
          <span className="numeric font-semibold">{bands.noReading}</span>
        </li>
      )}
    </ul>
  );
}
