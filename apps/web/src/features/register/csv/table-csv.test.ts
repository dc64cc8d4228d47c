import { describe, expect, it } from 'vitest';
import { fileNameOf, tableToCsv, type CsvColumn } from './table-csv';

type Row = { name: string; voltageV: number; kva: number | null };
const columns: CsvColumn<Row>[] = [
  { header: 'name', value: (row) => row.name },
  { header: 'voltage_v', value: (row) => row.voltageV },
  { header: 'transformer_kva', value: (row) => row.kva },
];

describe('tableToCsv', () => {
  it('writes the headings, then a line per row, empty cells for missing values', () => {
    expect(tableToCsv(columns, [{ name: 'Alder Quay', voltageV: 400, kva: 1600 }, { name: 'Brinmoor, Pumping', voltageV: 400, kva: null }])).toBe(
      'name,voltage_v,transformer_kva\r\nAlder Quay,400,1600\r\n"Brinmoor, Pumping",400,',
    );
  });

  it('neutralises cells a spreadsheet would run as formulas', () => {
    expect(tableToCsv(columns, [{ name: '=HYPERLINK("x")', voltageV: 480, kva: 1 }])).toContain(`"'=HYPERLINK(""x"")"`);
  });
});

describe('fileNameOf', () => {
  it('makes a plain file name', () => {
    expect(fileNameOf('Castellan Polymers, Plant 2', 'banks')).toBe('castellan-polymers-plant-2-banks');
    expect(fileNameOf('Bänk µ')).toBe('bank');
    expect(fileNameOf('***')).toBe('export');
  });
});
