import type { Unit } from '@varden/schemas';
import { useId } from 'react';
import { Link } from 'react-router-dom';
import { Quantity } from '../../../components/quantity';
import { CsvExportButton } from '../components/csv-export-button';
import { formatDate } from '../components/formats';
import { PanelSection } from '../components/panel-section';
import { fileNameOf, tableToCsv, type CsvColumn } from '../csv/table-csv';
import { paths } from '../../../config/paths';

const csvColumns: CsvColumn<Unit>[] = [
  { header: 'serial', value: (unit) => unit.serial },
  { header: 'kvar', value: (unit) => unit.nameplateKvar },
  { header: 'voltage_v', value: (unit) => unit.nameplateVoltageV },
  { header: 'maker', value: (unit) => unit.maker },
  { header: 'model', value: (unit) => unit.model },
  { header: 'installed_on', value: (unit) => unit.installedOn },
  { header: 'removed_on', value: (unit) => unit.removedOn },
  { header: 'removal_reason', value: (unit) => unit.removalReason },
];

/** "Position history": every unit that has stood at this position, oldest first, the one open marked. */
export function PositionHistoryTable({ history, current, label }: { history: readonly Unit[]; current: Unit; label: string }) {
  const captionId = useId();
  return (
    <PanelSection
      title="Position history"
      actions={<CsvExportButton fileName={fileNameOf(label, 'position-history')} build={() => tableToCsv(csvColumns, history)} />}
    >
      <div role="region" aria-labelledby={captionId} tabIndex={0} className="min-w-0 overflow-x-auto rounded-md border border-line">
        <table className="w-full border-collapse text-left" data-testid="position-history">
          <caption id={captionId} className="sr-only">{`Units that have stood at ${label}`}</caption>
          <thead className="bg-sunken">
            <tr>
              {['Unit', 'Nameplate', 'Installed', 'Removed', 'Reason'].map((heading) => (
                <th key={heading} scope="col" className="border-b border-line-strong px-3 py-2 text-base font-medium whitespace-nowrap desk:text-sm">
                  {heading}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {history.map((unit) => (
              <tr key={unit.id} className="border-b border-line last:border-b-0" aria-current={unit.id === current.id ? 'true' : undefined}>
                <th scope="row" className="px-3 py-2 align-top font-normal">
                  {unit.id === current.id ? (
                    <span className="font-semibold">{unit.serial || `Unit ${unit.id}`} (this unit)</span>
                  ) : (
                    <Link to={paths.register.unit.getHref(unit.id)}>{unit.serial || `Unit ${unit.id}`}</Link>
                  )}
                  {unit.removedOn === null && <span className="block text-base text-ink-muted desk:text-sm">In service</span>}
                </th>
                <td className="px-3 py-2 align-top whitespace-nowrap">
                  <Quantity value={unit.nameplateKvar} unit="kvar" />, <Quantity value={unit.nameplateVoltageV} unit="V" />
                </td>
                <td className="numeric px-3 py-2 align-top whitespace-nowrap">{formatDate(unit.installedOn)}</td>
                <td className="numeric px-3 py-2 align-top whitespace-nowrap">{unit.removedOn ? formatDate(unit.removedOn) : '—'}</td>
                <td className="px-3 py-2 align-top">{unit.removalReason ?? ''}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {history.length <= 1 && <p className="mt-3 text-base text-ink-muted desk:text-sm">No earlier unit at this position in the register.</p>}
    </PanelSection>
  );
}
