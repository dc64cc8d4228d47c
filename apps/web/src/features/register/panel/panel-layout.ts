import type { Step, Unit } from '@varden/schemas';
import type { Contactor, FuseSet, Reactor } from '../api/component-queries';
import { readerNumberFormat } from '../../../lib/reader-format';

/**
 * The panel drawing's geometry, apart from its pictures: a bank drawn as it is built, its steps
 * side by side as columns hanging from the busbar, each column from the busbar down: fuses,
 * contactor, reactor (detuned banks), then the capacitor units by position.
 */
export type SymbolKind = 'fuse-set' | 'contactor' | 'reactor' | 'unit';

export type PanelSymbol = {
  kind: SymbolKind;
  /** The record's id; absent for a component the register does not hold yet. */
  id?: number;
  title: string;
  detail: string;
  y: number;
};

export type PanelColumn = {
  step: Step;
  x: number;
  symbols: PanelSymbol[];
  height: number;
};

export type PanelLayout = {
  columns: PanelColumn[];
  width: number;
  height: number;
};

export const panelGeometry = {
  columnWidth: 156,
  gap: 10,
  padding: 16,
  /** Space for the busbar above the columns. */
  busbarHeight: 28,
  headerHeight: 52,
  rowHeight: 60,
} as const;

export type StepComponents = {
  units: readonly Unit[];
  contactors: readonly Contactor[];
  reactors: readonly Reactor[];
  fuseSets: readonly FuseSet[];
};

const numberFormat = readerNumberFormat({ maximumFractionDigits: 2 });
const n = (value: number) => numberFormat.format(value);
// 100,000 → "100K": the column is narrow; the record page gives the full figure.
const compactFormat = readerNumberFormat({ notation: 'compact', maximumFractionDigits: 1 });

/** The symbols of one step, top to bottom, before they are placed. */
export function stepSymbols(components: StepComponents, detuned: boolean): Omit<PanelSymbol, 'y'>[] {
  const symbols: Omit<PanelSymbol, 'y'>[] = [];
  if (components.fuseSets.length === 0) symbols.push({ kind: 'fuse-set', title: 'Fuses', detail: 'Not recorded' });
  for (const fuses of components.fuseSets) {
    symbols.push({ kind: 'fuse-set', id: fuses.id, title: 'Fuses', detail: `${n(fuses.ratedCurrentA)} A ${fuses.type}` });
  }
  if (components.contactors.length === 0) symbols.push({ kind: 'contactor', title: 'Contactor', detail: 'Not recorded' });
  for (const contactor of components.contactors) {
    symbols.push({ kind: 'contactor', id: contactor.id, title: 'Contactor', detail: `${compactFormat.format(contactor.ratedOperations)} operations rated` });
  }
  if (detuned && components.reactors.length === 0) symbols.push({ kind: 'reactor', title: 'Reactor', detail: 'Not recorded' });
  for (const reactor of components.reactors) {
    symbols.push({ kind: 'reactor', id: reactor.id, title: 'Reactor', detail: `${n(reactor.inductanceMH)} mH, p ${n(reactor.detuningFactor * 100)} %` });
  }
  const units = [...components.units].sort((a, b) => a.position - b.position);
  for (const unit of units) {
    symbols.push({ kind: 'unit', id: unit.id, title: `Unit ${unit.position}`, detail: `${n(unit.nameplateKvar)} kvar ${n(unit.nameplateVoltageV)} V` });
  }
  if (units.length === 0) symbols.push({ kind: 'unit', title: 'Capacitor units', detail: 'None recorded' });
  return symbols;
}

/** Places every step's column and symbol; the drawing is as tall as its longest step. */
export function layoutPanel(steps: readonly Step[], componentsOf: (step: Step) => StepComponents, detuned: boolean): PanelLayout {
  const g = panelGeometry;
  const ordered = [...steps].sort((a, b) => a.number - b.number);
  const columns = ordered.map((step, index): PanelColumn => {
    const top = g.padding + g.busbarHeight + g.headerHeight;
    const symbols = stepSymbols(componentsOf(step), detuned).map((symbol, row) => ({ ...symbol, y: top + row * g.rowHeight }));
    return {
      step,
      x: g.padding + index * (g.columnWidth + g.gap),
      symbols,
      height: g.busbarHeight + g.headerHeight + symbols.length * g.rowHeight,
    };
  });
  const tallest = Math.max(g.headerHeight + g.busbarHeight + g.rowHeight, ...columns.map((column) => column.height));
  const count = Math.max(1, columns.length);
  return {
    columns,
    width: g.padding * 2 + count * g.columnWidth + (count - 1) * g.gap,
    height: g.padding * 2 + tallest,
  };
}

/** Groups a bank's components by step id. */
export function componentsByStep(all: StepComponents): (step: Step) => StepComponents {
  const groups = new Map<number, { units: Unit[]; contactors: Contactor[]; reactors: Reactor[]; fuseSets: FuseSet[] }>();
  const groupOf = (stepId: number) => {
    let group = groups.get(stepId);
    if (!group) {
      group = { units: [], contactors: [], reactors: [], fuseSets: [] };
      groups.set(stepId, group);
    }
    return group;
  };
  for (const unit of all.units) groupOf(unit.stepId).units.push(unit);
  for (const contactor of all.contactors) groupOf(contactor.stepId).contactors.push(contactor);
  for (const reactor of all.reactors) groupOf(reactor.stepId).reactors.push(reactor);
  for (const fuses of all.fuseSets) groupOf(fuses.stepId).fuseSets.push(fuses);
  const none: StepComponents = { units: [], contactors: [], reactors: [], fuseSets: [] };
  return (step) => groups.get(step.id) ?? none;
}
