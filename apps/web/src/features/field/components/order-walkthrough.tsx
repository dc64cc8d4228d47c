import { useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { WorkOrderDetail } from '@varden/schemas';
import { lazy, Suspense, useCallback, useId, useState, type ReactNode } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Button, buttonClassName } from '../../../components/button';
import { FormAlert } from '../../../components/form/form-alert';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatDateTime } from '../../../lib/date-format';
import { fieldQueries, sentBackReason, transitionOrder } from '../api/field-queries';
import { stateWords } from '../api/state-words';
import { pendingMoveOf, readingItemsOf } from '../outbox/outbox-queries';
import { fieldOutbox, useOutboxSnapshot, useWhenSent } from '../outbox/use-field-outbox';
import { FieldGroup } from './component-card';
import { NotesField } from './field-controls';
import { PhotoCapture } from './photo-capture';
import { SafetyCardPanel, type Acknowledgement } from './safety-card-panel';
import { SyncState, useSyncSummary } from './sync-state';
import type { BankCard as BankCardForm } from './bank-card';
import type { WalkStep as WalkStepForm } from './walk-step';
import { WaitingList } from './waiting-list';
import { partsOfStep } from './step-parts';

/**
 * The walk's forms (react-hook-form, the engineering checks, every component's card) are not
 * part of the order's first load: a technician reads the order and its safety card first, and
 * they load while the card is read (or at once when the order is already under way).
 */
let walkModules: { WalkStep: typeof WalkStepForm; BankCard: typeof BankCardForm } | undefined;

/** Starts loading the walk's forms; the order page's loader calls it beside the order's data. */
export const loadWalkForms = () =>
  Promise.all([import('./walk-step'), import('./bank-card')]).then(([{ WalkStep }, { BankCard }]) => {
    walkModules = { WalkStep, BankCard };
    return walkModules;
  });

// Loaded already (the loader waited for them): drawn at once. React.lazy alone would still show
// its fallback for one frame, and the forms replacing it would push the page down (CLS 0.12).
const LazyWalkStep = lazy(() => loadWalkForms().then((m) => ({ default: m.WalkStep })));
const LazyBankCard = lazy(() => loadWalkForms().then((m) => ({ default: m.BankCard })));

/** Whether the walk shows as soon as the order opens (the card is acknowledged), so its forms must be there first. */
export const walkShownAtOnce = (order: WorkOrderDetail) => order.state === 'on-site' || order.state === 'awaiting-review' || order.state === 'sealed';

type Part = { key: string; label: string; recorded: number; total: number };

/** The walk's parts: step 1…n, then the whole bank (controller, cleaning, photos of the order). */
function partsOf(order: WorkOrderDetail, isRecorded: (target: string, id: number) => boolean): Part[] {
  const parts: Part[] = order.bank.steps.map((step) => {
    const p = partsOfStep(step, order.checklist);
    const targets: Array<[string, number]> = [
      ...p.units.map((u): [string, number] => ['capacitor-unit', u.id]),
      ...(p.contactor ? [['contactor', p.contactor.id] as [string, number]] : []),
      ...(p.reactor ? [['reactor', p.reactor.id] as [string, number]] : []),
      ...(p.fuseSet ? [['fuse-set', p.fuseSet.id] as [string, number]] : []),
    ];
    return { key: `step-${step.number}`, label: `Step ${step.number}`, recorded: targets.filter(([t, id]) => isRecorded(t, id)).length, total: targets.length };
  });
  if (order.checklist.includes('bank') || order.checklist.includes('photos')) {
    const bankAsked = order.checklist.includes('bank');
    parts.push({ key: 'bank', label: 'Whole bank', recorded: bankAsked && isRecorded('bank', order.bank.id) ? 1 : 0, total: bankAsked ? 1 : 0 });
  }
  return parts;
}

function PartPicker({ parts, current, onPick }: { parts: Part[]; current: string; onPick: (key: string) => void }) {
  return (
    <nav aria-label="Parts of the bank">
      <ul className="flex flex-wrap gap-2">
        {parts.map((part) => {
          const done = part.total > 0 && part.recorded === part.total;
          return (
            <li key={part.key}>
              <button
                type="button"
                aria-current={part.key === current ? 'step' : undefined}
                onClick={() => onPick(part.key)}
                className={buttonClassName(part.key === current ? 'primary' : 'secondary', 'min-w-touch')}
              >
                {part.label}
                {part.total > 0 && (
                  <span className="numeric text-base font-normal">
                    {done ? '✓' : `${part.recorded}/${part.total}`}
                    <span className="sr-only">{done ? ' all recorded' : ' recorded'}</span>
                  </span>
                )}
              </button>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}

/**
 * An order on the technician's phone: its header with the sync state, the safety card, then
 * the walk through the bank step by step with the readings its checklist asks for, what is
 * still waiting to send, and a bottom bar with the one next action (acknowledge the card, send
 * what waits, submit for review).
 */
export function OrderWalkthrough({ orderId }: { orderId: number }) {
  const queryClient = useQueryClient();
  const { data: order } = useSuspenseQuery(fieldQueries.order(orderId));
  const { items } = useOutboxSnapshot();
  const [searchParams, setSearchParams] = useSearchParams();
  const refresh = useCallback(() => void queryClient.invalidateQueries({ queryKey: fieldQueries.order(orderId).queryKey }), [queryClient, orderId]);
  useWhenSent(orderId, refresh);

  const pendingMove = pendingMoveOf(items, order.id);
  const onSite = order.state === 'on-site' || (pendingMove?.payload.kind === 'transition' && pendingMove.payload.to === 'on-site');
  const acknowledgement: Acknowledgement =
    order.state === 'on-site' || order.state === 'awaiting-review' || order.state === 'sealed'
      ? order.safetyAcknowledgedAt
        ? { kind: 'recorded', at: order.safetyAcknowledgedAt, byName: order.safetyCard.acknowledgedByName }
        : { kind: 'on-phone' }
      : onSite
        ? { kind: 'on-phone' }
        : { kind: 'none' };
  const editable = onSite && !order.locked;
  const returned = order.state === 'sent-back' ? sentBackReason(order) : null;

  const isRecorded = (target: string, id: number) =>
    order.readings.some((r) => r.target === target && r.targetId === id) ||
    readingItemsOf(items, order.id, target as 'bank', id).length > 0;
  const parts = partsOf(order, isRecorded);
  const current = parts.find((p) => p.key === searchParams.get('part'))?.key ?? parts[0]?.key ?? '';
  const currentIndex = parts.findIndex((p) => p.key === current);
  const next = parts[currentIndex + 1];
  const pick = (key: string) => {
    setSearchParams((params) => {
      params.set('part', key);
      return params;
    });
    document.getElementById('walk')?.focus();
  };
  const step = order.bank.steps.find((s) => `step-${s.number}` === current);
  const WalkStep = walkModules?.WalkStep ?? LazyWalkStep;
  const BankCard = walkModules?.BankCard ?? LazyBankCard;

  return (
    <div className="relative -mx-4 -my-6 grid min-w-0 grid-cols-[minmax(0,1fr)] desk:-mx-8 desk:-my-8">
      <OrderHeader order={order} />
      <div className="grid w-full min-w-0 max-w-[48rem] gap-6 px-4 py-6 desk:px-8">
        {returned && (
          <div role="note" className="grid gap-1 rounded-md border-2 border-watch bg-surface p-4" data-testid="sent-back-reason">
            <p className="font-semibold">Sent back to you{returned.by ? ` by ${returned.by}` : ''}, {formatDateTime(returned.at)}</p>
            <p>{returned.comment || 'No reason was given.'}</p>
          </div>
        )}
        {order.instructions && (
          <section className="grid gap-1 rounded-md border border-line bg-surface p-4" aria-label="Instructions">
            <p className="font-semibold">Instructions</p>
            <p className="whitespace-pre-line">{order.instructions}</p>
          </section>
        )}
        <SafetyCardPanel card={order.safetyCard} acknowledgement={acknowledgement} />

        {acknowledgement.kind !== 'none' && (
          <>
            <PartPicker parts={parts} current={current} onPick={pick} />
            <section id="walk" tabIndex={-1} aria-label={parts[currentIndex]?.label ?? 'Walk'} className="grid gap-4 focus-visible:outline-none">
              <h2 className="text-xl font-semibold">{parts[currentIndex]?.label}</h2>
              <Suspense fallback={<p className="text-ink-muted">Loading the forms…</p>}>
                {step && <WalkStep key={step.id} order={order} step={step} editable={editable} />}
                {current === 'bank' && (
                  <>
                    {order.checklist.includes('bank') && (
                      <BankCard orderId={order.id} bank={order.bank} readings={order.readings.filter((r) => r.target === 'bank' && r.targetId === order.bank.id)} editable={editable} />
                    )}
                    {order.checklist.includes('photos') && (
                      <section className="grid gap-3 rounded-md border border-line bg-surface p-4 desk:p-6" aria-label="Photos of the order">
                        <FieldGroup legend="Photos of the whole order">
                          <PhotoCapture orderId={order.id} subject="the order" stored={order.photos} />
                        </FieldGroup>
                      </section>
                    )}
                  </>
                )}
              </Suspense>
              {next && (
                <Button className="w-full desk:w-auto" onClick={() => pick(next.key)}>
                  Go on to {next.label.toLowerCase()}
                </Button>
              )}
            </section>
            <WaitingList orderId={order.id} />
          </>
        )}
      </div>
      <NextActionBar order={order} onSite={onSite} />
    </div>
  );
}

/** The order and its sync state, kept at the top of the screen while the technician scrolls. */
function OrderHeader({ order }: { order: WorkOrderDetail }) {
  return (
    <>
      <title>{`${order.title} · Varden`}</title>
      <p className="px-4 pt-2 text-base desk:px-8">
        <Link to={paths.todaysOrders.getHref()} className="inline-flex min-h-touch items-center">
          ‹ Today’s orders
        </Link>
      </p>
      <header className="sticky top-0 z-30 flex items-center justify-between gap-3 border-b border-line bg-paper px-4 py-2 desk:px-8">
        <div className="min-w-0">
          <h1 className="line-clamp-2 text-lg font-semibold break-words desk:text-2xl">{order.title}</h1>
          <p className="truncate text-base text-ink-muted">
            {order.bankName} · {order.siteName} · {stateWords[order.state].short}
          </p>
        </div>
        <SyncState orderId={order.id} className="max-w-[60%] shrink-0" />
      </header>
      <p className="px-4 pt-3 text-base text-ink-muted desk:px-8">Due {formatDate(order.dueOn)}</p>
    </>
  );
}

/** The bottom bar: the one thing to do next, large enough for a gloved thumb. */
function NextActionBar({ order, onSite }: { order: WorkOrderDetail; onSite: boolean }) {
  const queryClient = useQueryClient();
  const sync = useSyncSummary(order.id);
  const { items } = useOutboxSnapshot();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [comment, setComment] = useState('');
  const confirmId = useId();
  const refresh = async () => {
    await queryClient.invalidateQueries({ queryKey: fieldQueries.order(order.id).queryKey });
    await queryClient.invalidateQueries({ queryKey: fieldQueries.myOrders().queryKey });
  };

  const acknowledge = async () => {
    setBusy(true);
    setError(null);
    try {
      await transitionOrder({ id: order.id, to: 'on-site', version: order.version });
      await refresh();
    } catch (caught) {
      // No signal: the acknowledgement is kept on the phone and sent first when it returns.
      if (isApiError(caught) && (caught.isUnreachable || caught.status >= 500)) {
        await fieldOutbox().add({ orderId: order.id, label: 'Safety card acknowledged', payload: { kind: 'transition', to: 'on-site', version: order.version, comment: '' } });
      } else {
        setError(caught instanceof Error ? caught.message : 'The acknowledgement was not recorded.');
        await refresh();
      }
    } finally {
      setBusy(false);
    }
  };

  const submit = async () => {
    setBusy(true);
    setError(null);
    try {
      await transitionOrder({ id: order.id, to: 'awaiting-review', version: order.version, comment: comment.trim() });
      setConfirming(false);
      await refresh();
    } catch (caught) {
      setError(caught instanceof Error ? caught.message : 'The order was not submitted.');
      await refresh();
    } finally {
      setBusy(false);
    }
  };

  const recordedCount = order.readings.length;
  const photoCount = order.photos.length;
  const waitingOfOrder = items.filter((item) => item.orderId === order.id);
  let action: ReactNode;
  let hint: string | null = null;

  if (order.state === 'awaiting-review' || order.state === 'sealed' || order.state === 'withdrawn' || order.state === 'queued') {
    hint = stateWords[order.state].long;
    action = (
      <Link to={paths.todaysOrders.getHref()} className={buttonClassName('secondary', 'w-full')}>
        Back to today’s orders
      </Link>
    );
  } else if (!onSite) {
    action = (
      <Button variant="primary" className="w-full" disabled={busy} onClick={() => void acknowledge()}>
        {order.state === 'sent-back' ? 'I have made the bank safe — resume' : 'I have made the bank safe — start'}
      </Button>
    );
  } else if (sync.refused > 0) {
    hint = 'The server did not accept something: check it before submitting.';
    action = (
      <a href="#waiting-to-send" className={buttonClassName('primary', 'w-full')}>
        Check {sync.refused} not accepted
      </a>
    );
  } else if (sync.waiting > 0) {
    hint = sync.online ? 'Sent automatically; submit once everything is stored.' : 'No signal: everything stays on this phone and goes out when the signal returns.';
    action = (
      <Button className="w-full" disabled={!sync.online || sync.sending} onClick={() => void fieldOutbox().sendNow()}>
        {sync.online ? (sync.sending ? `Sending — ${sync.waiting} waiting` : `Send now — ${sync.waiting} waiting`) : `Offline — ${sync.waiting} waiting`}
      </Button>
    );
  } else if (confirming) {
    action = (
      <div className="grid gap-3" role="group" aria-labelledby={confirmId}>
        <p id={confirmId} className="font-semibold">
          Submit {recordedCount} {recordedCount === 1 ? 'reading' : 'readings'} and {photoCount} {photoCount === 1 ? 'photo' : 'photos'} for review? The supervisor reviews them; you cannot add to them unless the order is sent back.
        </p>
        <NotesField label="Note for the supervisor (optional)" value={comment} maxLength={1000} onChange={(event) => setComment(event.target.value)} />
        <div className="grid grid-cols-2 gap-2">
          <Button onClick={() => setConfirming(false)} disabled={busy}>
            Not yet
          </Button>
          <Button variant="primary" onClick={() => void submit()} disabled={busy || !sync.online}>
            Submit now
          </Button>
        </div>
      </div>
    );
  } else {
    if (recordedCount === 0) hint = 'Record at least one reading first.';
    action = (
      <Button variant="primary" className="w-full" disabled={recordedCount === 0 || waitingOfOrder.length > 0} onClick={() => setConfirming(true)}>
        Submit for review
      </Button>
    );
  }

  return (
    <div data-print="hide" className="sticky bottom-0 z-30 border-t-2 border-line-strong bg-surface px-4 py-3 desk:px-8" data-testid="next-action">
      <div className="grid max-w-[44rem] gap-2">
        {error && <FormAlert>{error}</FormAlert>}
        {hint && <p className="text-base text-ink-muted">{hint}</p>}
        {action}
      </div>
    </div>
  );
}
