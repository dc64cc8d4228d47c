import { useState } from 'react';
import { Button } from '../../../components/button';
import { downloadCsv } from '../csv/table-csv';

type CsvExportButtonProps = {
  /** Builds the whole table's CSV (every page of the current filter), then it downloads. */
  build: () => Promise<string> | string;
  fileName: string;
  label?: string;
};

/** "Export CSV" for a table: fetches what it needs, downloads, and says so if it failed. */
export function CsvExportButton({ build, fileName, label = 'Export CSV' }: CsvExportButtonProps) {
  const [state, setState] = useState<'idle' | 'working' | 'failed'>('idle');
  const run = async () => {
    setState('working');
    try {
      downloadCsv(fileName, await build());
      setState('idle');
    } catch {
      setState('failed');
    }
  };
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <Button onClick={() => void run()} disabled={state === 'working'}>
        <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-4 fill-none stroke-current stroke-[1.5]">
          <path d="M8 2v8M4.5 7 8 10.5 11.5 7M2.5 13.5h11" strokeLinecap="round" strokeLinejoin="round" />
        </svg>
        {state === 'working' ? 'Preparing…' : label}
      </Button>
      {state === 'failed' && (
        <span role="alert" className="text-base text-replace desk:text-sm">
          The export failed; try again.
        </span>
      )}
    </span>
  );
}
