import { useMutation, useQueryClient } from '@tanstack/react-query';
import { registerImportColumns, type Bank, type Step, type Unit } from '@varden/schemas';
import { useId, useState, type ChangeEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/button';
import { registerImportMutations, type RegisterImportAnswer } from '../api/register-import';
import { PanelSection } from '../components/panel-section';
import { controlClass } from '../forms/form-field';
import { paths } from '../../../config/paths';
import { checkRegisterCsv, columnMeanings, registerCsvTemplate, requiredColumns, type RegisterCsvCheck } from './register-csv';
import { downloadCsv } from './table-csv';

/** Largest file the API takes (registerImportRequest). */
const maxBytes = 900_000;

type Preview = { csv: string; check: RegisterCsvCheck; server: RegisterImportAnswer | null; serverError: string | null };

function ColumnsTable() {
  const captionId = useId();
  return (
    <div role="region" aria-labelledby={captionId} tabIndex={0} className="min-w-0 overflow-x-auto rounded-md border border-line">
      <table className="w-full border-collapse text-left">
        <caption id={captionId} className="sr-only">
          Columns of a register file
        </caption>
        <thead className="bg-sunken">
          <tr>
            {['Column', 'Needed', 'What it holds'].map((heading) => (
              <th key={heading} scope="col" className="border-b border-line-strong px-3 py-2 text-base font-medium desk:text-sm">
                {heading}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {registerImportColumns.map((column) => (
            <tr key={column} className="border-b border-line last:border-b-0">
              <th scope="row" className="px-3 py-2 font-mono text-sm font-normal whitespace-nowrap">
                {column}
              </th>
              <td className="px-3 py-2">{(requiredColumns as readonly string[]).includes(column) ? 'Yes' : 'Optional'}</td>
              <td className="px-3 py-2">{columnMeanings[column]}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** Errors of one line from both checks, the server's after the browser's, without repeats. */
function errorsOf(preview: Preview, line: number): string[] {
  const local = preview.check.rows.find((row) => row.line === line)?.errors ?? [];
  const server = preview.server && !preview.server.accepted ? (preview.server.rows.find((row) => row.line === line)?.errors ?? []) : [];
  return [...new Set([...local, ...server])];
}

function PreviewTable({ preview }: { preview: Preview }) {
  const captionId = useId();
  const failing = preview.check.rows.filter((row) => errorsOf(preview, row.line).length > 0).length;
  return (
    <div role="region" aria-labelledby={captionId} tabIndex={0} className="min-w-0 overflow-x-auto rounded-md border border-line">
      <table className="w-full border-collapse text-left" data-testid="import-preview">
        <caption id={captionId} className="sr-only">{`Preview of ${preview.check.rows.length} rows, ${failing} with errors`}</caption>
        <thead className="bg-sunken">
          <tr>
            {['Line', 'Step', 'Position', 'Unit', 'Serial', 'Errors'].map((heading) => (
              <th key={heading} scope="col" className="border-b border-line-strong px-3 py-2 text-base font-medium whitespace-nowrap desk:text-sm">
                {heading}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {preview.check.rows.map((row) => {
            const errors = errorsOf(preview, row.line);
            return (
              <tr key={row.line} className="border-b border-line last:border-b-0" data-errors={errors.length}>
                <th scope="row" className="numeric px-3 py-2 align-top font-normal">
                  {row.line}
                </th>
                <td className="numeric px-3 py-2 align-top whitespace-nowrap">
                  {row.cells.step} {row.cells.step_kvar && <span className="text-ink-muted">({row.cells.step_kvar} kvar)</span>}
                </td>
                <td className="numeric px-3 py-2 align-top">{row.cells.position}</td>
                <td className="numeric px-3 py-2 align-top whitespace-nowrap">
                  {[row.cells.kvar && `${row.cells.kvar} kvar`, row.cells.voltage_v && `${row.cells.voltage_v} V`, row.cells.frequency_hz && `${row.cells.frequency_hz} Hz`, row.cells.connection]
                    .filter(Boolean)
                    .join(', ')}
                </td>
                <td className="px-3 py-2 align-top">{row.cells.serial}</td>
                <td className="px-3 py-2 align-top">
                  {errors.length === 0 ? (
                    <span className="inline-flex items-center gap-1.5">
                      <svg aria-hidden="true" viewBox="0 0 16 16" className="size-4 fill-none stroke-up stroke-2">
                        <path d="M2.5 8.5 6.5 12.5 13.5 3.5" strokeLinecap="round" strokeLinejoin="round" />
                      </svg>
                      No errors
                    </span>
                  ) : (
                    <ul className="grid gap-1 font-medium text-replace">
                      {errors.map((error) => (
                        <li key={error} className="flex gap-1.5">
                          <svg aria-hidden="true" viewBox="0 0 16 16" className="mt-1 size-3 shrink-0 fill-none stroke-current stroke-2">
                            <path d="M3.5 3.5 12.5 12.5M12.5 3.5 3.5 12.5" strokeLinecap="round" />
                          </svg>
                          {error}
                        </li>
                      ))}
                    </ul>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

type RegisterImportPanelProps = {
  bank: Bank;
  steps: readonly Step[];
  units: readonly Unit[];
};

/**
 * "Register import": a bank's steps and units from a CSV file, checked row by row in the
 * browser, then by the server (a dry run), and written all or nothing only when both are clean.
 */
export function RegisterImportPanel({ bank, steps, units }: RegisterImportPanelProps) {
  const queryClient = useQueryClient();
  const send = useMutation(registerImportMutations.send(queryClient));
  const textId = useId();
  const fileId = useId();
  const [csv, setCsv] = useState('');
  const [fileNote, setFileNote] = useState<string | null>(null);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [imported, setImported] = useState<{ steps: number; units: number } | null>(null);
  const [importError, setImportError] = useState<string | null>(null);

  const stepNumberOf = new Map(steps.map((step) => [step.id, step.number]));
  const context = {
    bankId: bank.id,
    steps: steps.map((step) => ({ number: step.number, ratedKvar: step.ratedKvar })),
    occupied: units.flatMap((unit) => {
      const stepNumber = stepNumberOf.get(unit.stepId);
      return stepNumber === undefined ? [] : [{ stepNumber, position: unit.position }];
    }),
  };

  const changeText = (text: string) => {
    setCsv(text);
    setImported(null);
    setImportError(null);
  };

  const chooseFile = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    if (!file) return;
    if (file.size > maxBytes) {
      setFileNote(`${file.name} is larger than 900 kB; split it by step.`);
      return;
    }
    changeText(await file.text());
    setFileNote(`Read ${file.name}.`);
  };

  const runPreview = async () => {
    setImported(null);
    setImportError(null);
    const check = checkRegisterCsv(csv, context);
    const local: Preview = { csv, check, server: null, serverError: null };
    setPreview(local);
    if (!check.ok) return;
    try {
      setPreview({ ...local, server: await send.mutateAsync({ bankId: bank.id, csv, dryRun: true }) });
    } catch (error) {
      setPreview({ ...local, serverError: error instanceof Error ? error.message : 'The server could not check the file.' });
    }
  };

  const runImport = async () => {
    setImportError(null);
    try {
      const answer = await send.mutateAsync({ bankId: bank.id, csv, dryRun: false });
      if (answer.accepted) {
        setImported(answer.result.created);
        setPreview(null);
        setCsv('');
      } else {
        setPreview((current) => (current ? { ...current, server: answer } : current));
        setImportError(answer.message);
      }
    } catch (error) {
      setImportError(error instanceof Error ? error.message : 'The import failed.');
    }
  };

  const current = preview !== null && preview.csv === csv;
  const clean = current && preview.check.ok && preview.server?.accepted === true;
  const server = preview?.server;

  return (
    <div className="grid gap-6">
      <PanelSection title="The file">
        <div className="grid gap-4">
          <div className="grid gap-1">
            <label htmlFor={textId} className="text-base font-medium desk:text-sm">
              Paste the CSV
            </label>
            <textarea
              id={textId}
              value={csv}
              onChange={(event) => changeText(event.target.value)}
              rows={8}
              spellCheck={false}
              className={`${controlClass} py-2 font-mono text-sm`}
              placeholder={registerImportColumns.join(',')}
            />
          </div>
          <div className="flex flex-wrap items-end gap-4">
            <div className="grid min-w-0 gap-1">
              <label htmlFor={fileId} className="text-base font-medium desk:text-sm">
                Or choose a .csv file
              </label>
              <input
                id={fileId}
                type="file"
                accept=".csv,text/csv"
                onChange={(event) => void chooseFile(event)}
                className="min-h-touch w-full max-w-full min-w-0 text-base file:mr-3 file:min-h-touch file:rounded file:border file:border-line-strong file:bg-surface file:px-3 file:text-ink desk:file:min-h-control"
              />
            </div>
            <Button onClick={() => downloadCsv('register-template', registerCsvTemplate())}>Download the template</Button>
          </div>
          {fileNote && (
            <p role="status" className="text-base text-ink-muted desk:text-sm">
              {fileNote}
            </p>
          )}
          <div>
            <Button variant="primary" onClick={() => void runPreview()} disabled={csv.trim() === '' || send.isPending}>
              {send.isPending && !clean ? 'Checking…' : 'Preview the import'}
            </Button>
          </div>
        </div>
      </PanelSection>

      {imported && (
        <div role="status" className="rounded-md border-2 border-healthy bg-surface p-4">
          <p className="font-semibold">Imported</p>
          <p className="mt-1">
            {imported.steps} new step{imported.steps === 1 ? '' : 's'} and {imported.units} capacitor unit{imported.units === 1 ? '' : 's'} were added to{' '}
            {bank.name}. <Link to={paths.register.bank.getHref(bank.id)}>See the panel</Link>
          </p>
        </div>
      )}

      {preview && (
        <PanelSection title="Preview">
          <div className="grid gap-4" aria-live="polite">
            {!current && <p className="text-ink-muted">The text changed since this preview: preview it again before importing.</p>}
            {preview.check.fileErrors.length > 0 && (
              <div role="alert" className="rounded border-2 border-replace p-3">
                {preview.check.fileErrors.map((error) => (
                  <p key={error}>{error}</p>
                ))}
              </div>
            )}
            {preview.check.ignoredColumns.length > 0 && (
              <p className="text-ink-muted">Columns Varden does not know, left out: {preview.check.ignoredColumns.join(', ')}.</p>
            )}
            {preview.check.rows.length > 0 && (
              <p data-testid="import-summary" className="font-medium">
                {summaryOf(preview)}
              </p>
            )}
            {preview.serverError && (
              <p role="alert" className="rounded border-2 border-replace p-3">
                The server could not check the file: {preview.serverError}
              </p>
            )}
            {server && !server.accepted && (
              <div role="alert" className="rounded border-2 border-replace p-3">
                <p>{server.message}</p>
                {server.fieldMessages.length > 0 && <p className="text-ink-muted">{server.fieldMessages.join(' ')}</p>}
              </div>
            )}
            {preview.check.rows.length > 0 && <PreviewTable preview={preview} />}
            {clean && (
              <div className="grid gap-2">
                <p>Nothing is written until you import; the import adds every row or none.</p>
                <div>
                  <Button variant="primary" onClick={() => void runImport()} disabled={send.isPending}>
                    {send.isPending ? 'Importing…' : 'Import'}
                  </Button>
                </div>
              </div>
            )}
            {importError && (
              <p role="alert" className="rounded border-2 border-replace p-3">
                Nothing was imported: {importError}
              </p>
            )}
          </div>
        </PanelSection>
      )}

      <PanelSection title="Columns of a register file">
        <div className="grid gap-3">
          <p className="max-w-measure text-ink-muted">
            One row per capacitor unit, with a header row naming the columns (in any order). A step is created when its number is new to
            the bank; its rating must be the same on every row. A position already holding a unit in service is refused: replace that unit
            instead.
          </p>
          <ColumnsTable />
        </div>
      </PanelSection>
    </div>
  );
}

function summaryOf(preview: Preview): string {
  const rows = preview.check.rows.length;
  const failing = preview.check.rows.filter((row) => errorsOf(preview, row.line).length > 0).length;
  if (failing > 0) return `${failing} of ${rows} row${rows === 1 ? '' : 's'} have errors: fix them in the file and preview again. Nothing is imported while any row has an error.`;
  if (preview.server?.accepted) {
    const { steps, units } = preview.server.result.created;
    return `${rows} row${rows === 1 ? '' : 's'}, no errors. The import will add ${steps} step${steps === 1 ? '' : 's'} and ${units} capacitor unit${units === 1 ? '' : 's'}.`;
  }
  if (preview.serverError) return `${rows} row${rows === 1 ? '' : 's'} pass the browser's check; the server's check did not answer.`;
  return `${rows} row${rows === 1 ? '' : 's'} pass the browser's check; the server is checking them…`;
}
