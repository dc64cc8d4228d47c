import Papa from 'papaparse';

/** One column of an exported table: its heading in the file and how a row's cell reads. */
export type CsvColumn<T> = {
  header: string;
  value: (row: T) => string | number | boolean | null | undefined;
};

/**
 * A table as CSV text: headings first, then one line per row. Numbers are written in full
 * (no rounding, a dot for decimals) so a spreadsheet reads them back as the same values.
 */
export function tableToCsv<T>(columns: ReadonlyArray<CsvColumn<T>>, rows: readonly T[]): string {
  return Papa.unparse(
    {
      fields: columns.map((column) => column.header),
      data: rows.map((row) =>
        columns.map((column) => {
          const value = column.value(row);
          return value === null || value === undefined ? '' : String(value);
        }),
      ),
    },
    // Cells starting with = + - @ are quoted with a leading ' so a spreadsheet never runs them.
    { escapeFormulae: true },
  );
}

/** A file name safe on every system: "Alder Quay / Bank A" → "alder-quay-bank-a". */
export function fileNameOf(...parts: string[]): string {
  return (
    parts
      .join(' ')
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '') || 'export'
  );
}

/** Hands CSV text to the browser as a download. */
export function downloadCsv(fileName: string, csv: string): void {
  // The byte-order mark makes spreadsheet programs read the file as UTF-8 (µ, φ, names).
  const blob = new Blob(['\uFEFF', csv], { type: 'text/csv;charset=utf-8' });
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName.endsWith('.csv') ? fileName : `${fileName}.csv`;
  document.body.append(link);
  link.click();
  link.remove();
  // Some browsers read the URL after click returns.
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
