import type { Bank, Step } from '@varden/schemas';
import { useId } from 'react';
import { Link } from 'react-router-dom';
import { Quantity } from '../../../components/quantity';
import { CsvExportButton } from '../components/csv-export-button';
import { formatDetuning } from '../components/formats';
import { NoReadingGlyph, noReadingLabel } from '../components/no-reading-glyph';
import { PanelSection } from '../components/panel-section';
import { connectionLabels } from '../forms/unit-fields';
import { fileNameOf, tableToCsv, type CsvColumn } from '../csv/table-csv';
import { paths } from '../../../config/paths';
import type { BankRegister } from './bank-register';

/** One line of the panel as text: a component of a step, or the step itself when it is empty. */
export type PanelRow = {
  key: string;
  step: Step;
  component: string;
  href?: string;
  rating: { value: number; unit: string } | null;
  detail: string;
  identity: string;
};

/** The panel drawing's content as rows: per step, fuses, contactor, reactor, then units by position. */
export function panelRows(register: Pick<BankRegister, 'steps' | 'componentsOf'>): PanelRow[] {
  const rows: PanelRow[] = [];
  const identity = (...parts: string[]) => parts.filter(Boolean).join(' · ');
  for (const step of [...register.steps].sort((a, b) => a.number - b.number)) {
    const { fuseSets, contactors, reactors, units } = register.componentsOf(step);
    const before = rows.length;
    for (const fuses of fuseSets) {
      rows.push({
        key: `f${fuses.id}`,
        step,
        component: 'Fuse set',
        href: paths.register.fuseSet.getHref(fuses.id),
        rating: { value: fuses.ratedCurrentA, unit: 'A' },
        detail: fuses.type,
        identity: '',
      });
    }
    for (const contactor of contactors) {
      rows.push({
        key: `c${contactor.id}`,
        step,
        component: 'Contactor',
        href: paths.register.contactor.getHref(contactor.id),
        rating: { value: contactor.ratedOperations, unit: 'operations' },
        detail: `Counter at installation ${contactor.counterAtInstall}`,
        identity: identity(contactor.maker, contactor.model),
      });
    }
    for (const reactor of reactors) {
      rows.push({
        key: `r${reactor.id}`,
        step,
        component: 'Detuning reactor',
        href: paths.register.reactor.getHref(reactor.id),
        rating: { value: reactor.inductanceMH, unit: 'mH' },
        detail: `p ${formatDetuning(reactor.detuningFactor)}, ${reactor.ratedCurrentA} A`,
        identity: identity(reactor.maker, reactor.model),
      });
    }
    for (const unit of [...units].sort((a, b) => a.position - b.position)) {
      rows.push({
        key: `u${unit.id}`,
        step,
        component: `Capacitor unit, position ${unit.position}`,
        href: paths.register.unit.getHref(unit.id),
        rating: { value: unit.nameplateKvar, unit: 'kvar' },
        detail: `${unit.nameplateVoltageV} V ${unit.nameplateFrequencyHz} Hz, ${connectionLabels[unit.connection].toLowerCase()}`,
        identity: identity(unit.serial && `Serial ${unit.serial}`, unit.maker, unit.model),
      });
    }
    if (rows.length === before) {
      rows.push({ key: `s${step.id}`, step, component: 'No components yet', rating: null, detail: '', identity: '' });
    }
  }
  return rows;
}

function groupByStep(rows: readonly PanelRow[]): PanelRow[][] {
  const groups: PanelRow[][] = [];
  for (const row of rows) {
    const last = groups[groups.length - 1];
    if (last && last[0]?.step.id === row.step.id) last.push(row);
    else groups.push([row]);
  }
  return groups;
}

const csvColumns: CsvColumn<PanelRow>[] = [
  { header: 'step', value: (row) => row.step.number },
  { header: 'step_kvar', value: (row) => row.step.ratedKvar },
  { header: 'component', value: (row) => row.component },
  { header: 'rating', value: (row) => row.rating?.value },
  { header: 'rating_unit', value: (row) => row.rating?.unit },
  { header: 'detail', value: (row) => row.detail },
  { header: 'identity', value: (row) => row.identity },
  { header: 'condition', value: (row) => (row.href ? noReadingLabel : '') },
];

/** The text alternative of the panel drawing: the same content as a table, with its CSV export. */
export function PanelTable({ bank, register }: { bank: Bank; register: BankRegister }) {
  const captionId = useId();
  const rows = panelRows(register);
  return (
    <PanelSection
      title="The panel as a table"
      actions={<CsvExportButton fileName={fileNameOf(bank.siteName, bank.name, 'register')} build={() => tableToCsv(csvColumns, rows)} />}
    >
      <div role="region" aria-labelledby={captionId} tabIndex={0} className="min-w-0 overflow-x-auto rounded-md border border-line">
        <table className="w-full border-collapse text-left" data-testid="panel-table">
          <caption id={captionId} className="sr-only">
            {`Steps and components of ${bank.name}`}
          </caption>
          <thead className="bg-sunken">
            <tr>
              {['Step', 'Component', 'Rating', 'Details', 'Identity', 'Condition'].map((heading) => (
                <th key={heading} scope="col" className="border-b border-line-strong px-3 py-2 text-base font-medium whitespace-nowrap desk:text-sm">
                  {heading}
                </th>
              ))}
            </tr>
          </thead>
          {groupByStep(rows).map((group) => (
            // One row group per step, its header cell spanning the step's components.
            <tbody key={group[0]!.step.id} className="border-t border-line-strong">
              {group.map((row, index) => (
                <tr key={row.key} className="border-t border-line first:border-t-0">
                  {index === 0 && (
                    <th scope="rowgroup" rowSpan={group.length} className="bg-paper px-3 py-2 align-top font-normal whitespace-nowrap">
                      <Link to={paths.register.step.getHref(row.step.id)}>Step {row.step.number}</Link>
                      <span className="block text-base text-ink-muted desk:text-sm">
                        <Quantity value={row.step.ratedKvar} unit="kvar" />
                      </span>
                    </th>
                  )}
                  <td className="px-3 py-2 align-top">
                    {row.href ? <Link to={row.href}>{row.component}</Link> : <span className="text-ink-muted">{row.component}</span>}
                  </td>
                  <td className="px-3 py-2 align-top whitespace-nowrap">{row.rating ? <Quantity value={row.rating.value} unit={row.rating.unit} /> : ''}</td>
                  <td className="px-3 py-2 align-top">{row.detail}</td>
                  <td className="px-3 py-2 align-top">{row.identity}</td>
                  <td className="px-3 py-2 align-top">{row.href ? <NoReadingGlyph /> : ''}</td>
                </tr>
              ))}
            </tbody>
          ))}
          {rows.length === 0 && (
            <tbody>
              <tr>
                <td colSpan={6} className="px-3 py-6 text-center text-ink-muted">
                  No steps yet.
                </td>
              </tr>
            </tbody>
          )}
        </table>
      </div>
    </PanelSection>
  );
}
