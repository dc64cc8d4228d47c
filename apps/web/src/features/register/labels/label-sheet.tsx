import { useQuery } from '@tanstack/react-query';
import type { Bank, Site, Step, Unit } from '@varden/schemas';
import { registerKey } from '../api/register-keys';
import { paths } from '../../../config/paths';
import { qrDataUrl } from './qr-image';
import { readerNumberFormat } from '../../../lib/reader-format';

/** One printed label: what it names, in words, and the QR code that opens its page. */
export type LabelSpec = {
  key: string;
  kind: string;
  title: string;
  lines: string[];
  /** Path inside Varden; the QR code holds the absolute address. */
  path: string;
};

const n = readerNumberFormat({ maximumFractionDigits: 2 });

/** The bank's label first, then one per capacitor unit in service by step and position. */
export function labelsOf(site: Site, bank: Bank, steps: readonly Step[], units: readonly Unit[]): LabelSpec[] {
  const stepById = new Map(steps.map((step) => [step.id, step]));
  const unitLabels = units
    .flatMap((unit) => {
      const step = stepById.get(unit.stepId);
      return step ? [{ unit, step }] : [];
    })
    .sort((a, b) => a.step.number - b.step.number || a.unit.position - b.unit.position)
    .map(({ unit, step }) => ({
      key: `unit-${unit.id}`,
      kind: 'Capacitor unit',
      title: `Step ${step.number} · Position ${unit.position}`,
      lines: [
        unit.serial ? `Serial ${unit.serial}` : 'No serial recorded',
        `${n.format(unit.nameplateKvar)} kvar ${n.format(unit.nameplateVoltageV)} V ${unit.nameplateFrequencyHz} Hz`,
        `${bank.name} · ${site.name}`,
      ],
      path: paths.register.unit.getHref(unit.id),
    }));
  return [
    {
      key: `bank-${bank.id}`,
      kind: 'Correction bank',
      title: bank.name,
      lines: [site.name, bank.location, `${steps.length} step${steps.length === 1 ? '' : 's'}${bank.detuned ? `, detuned` : ''}`].filter(Boolean),
      path: paths.register.bank.getHref(bank.id),
    },
    ...unitLabels,
  ];
}

function Label({ spec, origin }: { spec: LabelSpec; origin: string }) {
  const address = `${origin}${spec.path}`;
  const qr = useQuery({
    queryKey: [...registerKey, 'qr', address] as const,
    queryFn: () => qrDataUrl(address),
    staleTime: Number.POSITIVE_INFINITY,
  });
  return (
    <article className="register-label" data-testid="register-label" data-address={address}>
      <div className="register-label-code">
        {qr.data ? (
          <img src={qr.data} alt={`QR code opening ${spec.kind.toLowerCase()} ${spec.title} in Varden`} width={112} height={112} />
        ) : (
          <span className="text-sm text-ink-muted">{qr.isError ? 'No QR code' : 'Drawing…'}</span>
        )}
      </div>
      <div className="min-w-0">
        <p className="text-xs font-medium tracking-wide text-ink-muted uppercase">{spec.kind}</p>
        <p className="text-base font-semibold">{spec.title}</p>
        {spec.lines.map((line) => (
          <p key={line} className="text-sm">
            {line}
          </p>
        ))}
        <p className="mt-1 font-mono text-xs break-all text-ink-muted">{address}</p>
      </div>
    </article>
  );
}

// Labels 60 × 40 mm in a grid of 3 × 6 fit the printable area of both A4 (190 × 277 mm) and
// US Letter (195.9 × 259.4 mm) with 10 mm margins; a label never breaks across sheets.
const sheetStyles = `
.register-labels { display: grid; gap: 0.75rem; grid-template-columns: repeat(auto-fill, minmax(17rem, 1fr)); }
.register-label { display: grid; grid-template-columns: auto 1fr; gap: 0.75rem; align-items: start; padding: 0.75rem;
  border: 1px dashed var(--v-line-strong); border-radius: 4px; background: var(--v-surface); break-inside: avoid; overflow: hidden; }
.register-label-code { width: 112px; height: 112px; display: grid; place-items: center; background: #fff; }
.register-label-code img { width: 100%; height: 100%; }
@media print {
  @page { margin: 10mm; }
  footer, [data-print="hide"] { display: none !important; }
  .register-labels { grid-template-columns: repeat(3, 60mm); grid-auto-rows: 40mm; gap: 3mm; }
  .register-label { width: 60mm; height: 40mm; padding: 2.5mm; gap: 2.5mm; border: 0.2mm dashed #888; border-radius: 0; page-break-inside: avoid; }
  .register-label-code { width: 22mm; height: 22mm; }
  .register-label p { font-size: 7.5pt; line-height: 1.2; }
  .register-label p.text-base { font-size: 9pt; }
  .register-label .font-mono { font-size: 5.5pt; }
}
`;

/** The printable sheet: one label for the bank and one per capacitor unit, each with its QR code. */
export function LabelSheet({ labels, origin }: { labels: readonly LabelSpec[]; origin: string }) {
  return (
    <>
      <style>{sheetStyles}</style>
      <div className="register-labels" aria-label="Labels">
        {labels.map((spec) => (
          <Label key={spec.key} spec={spec} origin={origin} />
        ))}
      </div>
    </>
  );
}
