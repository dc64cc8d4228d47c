import { useState } from 'react';
import { Button } from '../../../components/button';
import { isApiError } from '../../../lib/api-client';
import { PanelSection } from './panel-section';

type RetirePanelProps = {
  /** "site", "bank", "step". */
  noun: string;
  retired: boolean;
  /** PATCH { version, retired }. */
  onRetire: (retired: boolean) => Promise<unknown>;
  /** DELETE; refused with 409 once the record has history. */
  onDelete: () => Promise<unknown>;
};

/**
 * Retiring keeps a record and its history but takes it out of the lists; deleting is for a
 * record entered by mistake, and the API refuses it (409) once anything refers to it.
 */
export function RetirePanel({ noun, retired, onRetire, onDelete }: RetirePanelProps) {
  const [confirming, setConfirming] = useState<'retire' | 'delete' | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ text: string; offerRetire: boolean } | null>(null);

  const run = async (action: () => Promise<unknown>, onConflict?: (text: string) => void) => {
    setBusy(true);
    setMessage(null);
    try {
      await action();
      setConfirming(null);
    } catch (error) {
      const text = error instanceof Error ? error.message : 'The change failed.';
      if (isApiError(error) && error.status === 409 && onConflict) onConflict(text);
      else setMessage({ text, offerRetire: false });
    } finally {
      setBusy(false);
    }
  };

  return (
    <PanelSection title={retired ? `This ${noun} is retired` : `Retire or delete`} data-print="hide">
      <div className="grid max-w-measure gap-4">
        {retired ? (
          <>
            <p className="text-ink-muted">It stays in the records but is left out of the lists. Return it to service if it came back into use.</p>
            <div>
              <Button disabled={busy} onClick={() => void run(() => onRetire(false))}>
                Return the {noun} to service
              </Button>
            </div>
          </>
        ) : (
          <>
            <p className="text-ink-muted">
              Retire the {noun} when it leaves service: its history stays. Delete it only if it was entered by mistake; Varden refuses
              once anything refers to it.
            </p>
            {confirming === null && (
              <div className="flex flex-wrap gap-2">
                <Button onClick={() => setConfirming('retire')}>Retire the {noun}…</Button>
                <Button onClick={() => setConfirming('delete')}>Delete the {noun}…</Button>
              </div>
            )}
            {confirming !== null && (
              <div role="group" aria-label="Confirm" className="grid gap-3 rounded border border-line-strong p-3">
                <p className="font-medium">
                  {confirming === 'retire' ? `Retire this ${noun}?` : `Delete this ${noun} for good?`}
                </p>
                <div className="flex flex-wrap gap-2">
                  <Button
                    variant="primary"
                    disabled={busy}
                    onClick={() =>
                      void (confirming === 'retire'
                        ? run(() => onRetire(true))
                        : run(onDelete, (text) => setMessage({ text, offerRetire: true })))
                    }
                  >
                    {busy ? 'Working…' : confirming === 'retire' ? `Yes, retire it` : `Yes, delete it`}
                  </Button>
                  <Button onClick={() => setConfirming(null)}>Keep it</Button>
                </div>
              </div>
            )}
          </>
        )}
        {message && (
          <div role="alert" className="grid gap-2 rounded border-2 border-replace p-3">
            <p>{message.text}</p>
            {message.offerRetire && (
              <div>
                <Button variant="primary" disabled={busy} onClick={() => void run(() => onRetire(true))}>
                  Retire it instead
                </Button>
              </div>
            )}
          </div>
        )}
      </div>
    </PanelSection>
  );
}
