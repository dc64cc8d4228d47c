import type { Step, Unit } from '@varden/schemas';
import { describe, expect, it } from 'vitest';
import { componentsByStep, layoutPanel, panelGeometry, stepSymbols } from './panel-layout';

const step = (id: number, number: number): Step => ({ id, bankId: 1, number, ratedKvar: 50, retiredAt: null, version: 1 });
const unit = (id: number, stepId: number, position: number): Unit => ({
  id,
  stepId,
  position,
  nameplateKvar: 25,
  nameplateVoltageV: 400,
  nameplateFrequencyHz: 50,
  connection: 'delta',
  capacitanceUF: 165.79,
  capacitanceGiven: false,
  ratedCapacitanceUF: 165.79,
  tolerancePreset: 'iec',
  toleranceMinusPct: -5,
  tolerancePlusPct: 10,
  temperatureCategory: '',
  dischargeTimeS: 180,
  serial: '',
  maker: '',
  model: '',
  installedOn: null,
  removedOn: null,
  removalReason: null,
  replacedById: null,
  warnings: [],
  version: 1,
});

describe('stepSymbols', () => {
  it('orders a step as built: fuses, contactor, reactor, then units by position', () => {
    const symbols = stepSymbols(
      {
        units: [unit(12, 1, 2), unit(11, 1, 1)],
        contactors: [{ id: 3, stepId: 1, ratedOperations: 100000, counterAtInstall: 0, maker: '', model: '', installedOn: null, removedOn: null, version: 1 }],
        reactors: [{ id: 4, stepId: 1, inductanceMH: 0.7, ratedCurrentA: 90, detuningFactor: 0.07, maker: '', model: '', installedOn: null, removedOn: null, version: 1 }],
        fuseSets: [{ id: 5, stepId: 1, ratedCurrentA: 125, type: 'gG', installedOn: null, removedOn: null, version: 1 }],
      },
      true,
    );
    expect(symbols.map((s) => [s.kind, s.id])).toEqual([
      ['fuse-set', 5],
      ['contactor', 3],
      ['reactor', 4],
      ['unit', 11],
      ['unit', 12],
    ]);
    expect(symbols[2]?.detail).toMatch(/0\.7 mH, p 7 %/);
  });

  it('marks what the register lacks, and a reactor only for a detuned bank', () => {
    const empty = { units: [], contactors: [], reactors: [], fuseSets: [] };
    expect(stepSymbols(empty, false).map((s) => [s.kind, s.id, s.detail])).toEqual([
      ['fuse-set', undefined, 'Not recorded'],
      ['contactor', undefined, 'Not recorded'],
      ['unit', undefined, 'None recorded'],
    ]);
    expect(stepSymbols(empty, true).map((s) => s.kind)).toEqual(['fuse-set', 'contactor', 'reactor', 'unit']);
  });
});

describe('layoutPanel', () => {
  it('puts steps side by side by number, as tall as the longest step', () => {
    const steps = [step(2, 2), step(1, 1)];
    const components = componentsByStep({ units: [unit(11, 1, 1), unit(12, 1, 2), unit(21, 2, 1)], contactors: [], reactors: [], fuseSets: [] });
    const layout = layoutPanel(steps, components, false);
    const g = panelGeometry;
    expect(layout.columns.map((c) => c.step.number)).toEqual([1, 2]);
    expect(layout.columns[1]!.x - layout.columns[0]!.x).toBe(g.columnWidth + g.gap);
    expect(layout.columns[0]!.symbols).toHaveLength(4);
    expect(layout.width).toBe(2 * g.padding + 2 * g.columnWidth + g.gap);
    expect(layout.height).toBe(2 * g.padding + g.busbarHeight + g.headerHeight + 4 * g.rowHeight);
  });
});
