import type { WorkOrderDetail } from '@varden/schemas';
import type { ReactNode } from 'react';
import { formatDateTime } from '../../../lib/date-format';
import { formatCalendarDate } from '../lib/calendar-date';
import { unitResultRows } from '../lib/order-results';
import { kindLabels } from '../lib/work-order-words';
import { OrderFlags, OtherReadings, TechnicianNotes } from './order-findings';
import { PhotoStrip } from './photo-strip';
import { SignatureBlock } from './signature-block';
import { UnitResults } from './unit-results';

/** A title inside a sentence: "Isolate and lock out" → "isolate and lock out", "PPE" stays. */
const inSentence = (title: string) => (/^[A-Z][a-z]/.test(title) ? title[0]!.toLowerCase() + title.slice(1) : title);

function RecordSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="grid gap-3 border-t border-line-strong pt-4 print:pt-3">
      <h2 className="text-lg font-semibold print:break-after-avoid">{title}</h2>
      {children}
    </section>
  );
}

/**
 * The signed record of an order as it prints: header, unit results, the other readings, flags,
 * photo thumbnails, the safety acknowledgement, the technician's notes and the signature.
 */
export function SignedRecord({ order }: { order: WorkOrderDetail }) {
  const card = order.safetyCard;
  const versions = [...new Set(order.readings.map((r) => r.engineeringVersion))].join(', ');
  return (
    <article aria-labelledby="record-title" className="grid gap-6 rounded-md border border-line bg-surface p-4 desk:p-8 print:border-0 print:p-0">
      <header className="grid gap-3">
        <p className="text-sm font-medium tracking-wide text-ink-muted uppercase">Varden · maintenance record</p>
        <h1 id="record-title" className="text-xl font-semibold desk:text-2xl">
          <span className="numeric">#{order.id}</span> {order.title}
        </h1>
        <dl className="grid gap-x-6 gap-y-1 desk:grid-cols-[auto_1fr_auto_1fr] print:grid-cols-[auto_1fr_auto_1fr]">
          <dt className="text-ink-muted">Site</dt>
          <dd>{order.siteName}</dd>
          <dt className="text-ink-muted">Bank</dt>
          <dd>
            {order.bankName}
            {order.bank.location ? `, ${order.bank.location}` : ''}
          </dd>
          <dt className="text-ink-muted">Kind</dt>
          <dd>{kindLabels[order.kind]}</dd>
          <dt className="text-ink-muted">Due</dt>
          <dd className="numeric">{formatCalendarDate(order.dueOn)}</dd>
          <dt className="text-ink-muted">Technician</dt>
          <dd>{order.assigneeName ?? '—'}</dd>
          <dt className="text-ink-muted">Submitted</dt>
          <dd className="numeric">{order.submittedAt ? formatDateTime(order.submittedAt) : '—'}</dd>
        </dl>
      </header>

      <RecordSection title="Capacitor units">
        <UnitResults rows={unitResultRows(order)} withPrevious={false} linkOrders={false} caption="Each capacitor unit’s result on this order" />
      </RecordSection>
      <RecordSection title="Contactors, reactors, fuses and the bank">
        <OtherReadings order={order} />
      </RecordSection>
      <RecordSection title="Flags">
        <OrderFlags order={order} />
      </RecordSection>
      <RecordSection title="Photos">
        <PhotoStrip photos={order.photos} />
      </RecordSection>
      <RecordSection title="Safety acknowledgement">
        {card.acknowledgedAt ? (
          <p>
            {card.acknowledgedByName ?? order.assigneeName ?? 'The technician'} acknowledged the safety card on{' '}
            <time dateTime={card.acknowledgedAt} className="numeric">
              {formatDateTime(card.acknowledgedAt)}
            </time>{' '}
            before starting: {card.steps.map((step) => inSentence(step.title)).join('; ')}. Discharge wait{' '}
            <span className="numeric font-medium">{card.dischargeWaitS}&nbsp;s</span>
            {card.dischargeWaitFromNameplates ? ', from the units’ nameplates' : ' (a cautious default: no nameplate gave one)'}.
          </p>
        ) : (
          <p className="text-ink-muted">No acknowledgement recorded.</p>
        )}
        <p className="text-sm text-ink-muted">{card.deferral}</p>
      </RecordSection>
      <RecordSection title="Technician’s notes">
        <TechnicianNotes order={order} />
      </RecordSection>
      <RecordSection title="Signature">
        <SignatureBlock order={order} />
      </RecordSection>
      <footer data-record="" className="border-t border-line pt-3 text-sm text-ink-muted">
        Results computed by Varden’s engineering package{versions ? ` (version ${versions})` : ''}. Record of work order #{order.id}
        {order.locked ? ', sealed and locked.' : ', not yet sealed: a draft.'}
      </footer>
    </article>
  );
}
