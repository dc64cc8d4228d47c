import type { SessionUser } from '../../access/current-user';
import type { AppContext } from '../../context';
import { AppError } from '../../http/app-error';
import { walkthroughBankOf } from './bank-tree.repository';
import { findVisibleOrder } from './order-guard';
import { flagsOfOrder, photoKeysOfOrder, readingsOfOrder, siteAndBankOf, unitsByIds, type StoredReading } from './record.repository';
import { renderSignedRecord, thumbnailsFor, type BandName, type SignedRecord } from './record-pdf';
import { safetyCardFor } from './safety-card';
import { findPerson } from './work-orders.repository';

const methodNames: Record<string, string> = {
  'open-pairs': 'Pairs, third open',
  shorted: 'One to two shorted',
  'line-currents': 'Line currents',
  'per-element': 'Per element',
};

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const yesNo = (v: unknown) => (v === true ? 'yes' : v === false ? 'no' : '–');

/** A line for a reading of a contactor, reactor, fuse set or the bank, from what was entered (the shared input contract). */
function describeOther(r: StoredReading, stepNumberOf: (target: string, id: number) => number | undefined): { label: string; text: string } {
  const i = r.input;
  const step = stepNumberOf(r.target, r.targetId);
  const where = step === undefined ? '' : ` (step ${step})`;
  switch (r.target) {
    case 'contactor':
      return {
        label: `Contactor${where}`,
        text: `counter ${String(i.operationsCounter ?? '–')} operations, contacts ${String(i.contactCondition ?? '–')}`,
      };
    case 'reactor':
      return {
        label: `Reactor${where}`,
        text: `thermal switch ${i.thermalSwitchClosed === true ? 'closed' : i.thermalSwitchClosed === false ? 'OPEN' : '–'}${num(i.temperatureC) === null ? '' : `, ${String(i.temperatureC)} °C`}`,
      };
    case 'fuse-set': {
      const continuity = Array.isArray(i.continuity) ? i.continuity.map((c) => (c === true ? 'ok' : 'BLOWN')).join(' / ') : '–';
      return { label: `Fuses${where}`, text: `continuity ${continuity}; rating matches the register: ${yesNo(i.ratingMatchesRegister)}` };
    }
    default:
      return {
        label: 'Bank',
        text: [
          num(i.controllerPf) === null ? null : `controller PF ${String(i.controllerPf)}`,
          num(i.voltageThdPct) === null ? null : `voltage THD ${String(i.voltageThdPct)} %`,
          `cleaning ${yesNo(i.cleaningDone)}`,
          `filters ${yesNo(i.filtersDone)}`,
        ]
          .filter(Boolean)
          .join(', '),
      };
  }
}

/**
 * The signed record of a sealed order as a PDF, for anyone who may see the order. An order
 * that is not sealed has no signed record yet (409).
 */
export async function signedRecordPdf(ctx: AppContext, user: SessionUser, id: number): Promise<Buffer> {
  const order = await findVisibleOrder(ctx.db, user, id);
  if (order.state !== 'sealed' || !order.signedAt) {
    throw new AppError('conflict', `Work order ${id} is ${order.state}; its signed record exists once a supervisor seals it.`);
  }
  const [place, bank, readings, flagRows, photoKeys, assignee, acknowledger] = await Promise.all([
    siteAndBankOf(ctx.db, order.bankId),
    walkthroughBankOf(ctx.db, order.bankId),
    readingsOfOrder(ctx.db, id),
    flagsOfOrder(ctx.db, id),
    photoKeysOfOrder(ctx.db, id),
    order.assigneeId ? findPerson(ctx.db, order.assigneeId) : undefined,
    order.safetyAcknowledgedById ? findPerson(ctx.db, order.safetyAcknowledgedById) : undefined,
  ]);
  if (!place || !bank) throw new AppError('not_found', `The bank of work order ${id} does not exist.`);

  // The latest reading of each unit counts (a re-measure replaces the first one).
  const latest = new Map<number, StoredReading>();
  for (const r of readings) if (r.target === 'capacitor-unit') latest.set(r.targetId, r);
  const units = await unitsByIds(ctx.db, [...latest.keys()]);
  const unitRows = units
    .sort((a, b) => a.stepNumber - b.stepNumber || a.unit.position - b.unit.position)
    .map(({ unit, stepNumber }) => {
      const r = latest.get(unit.id)!;
      const legs = r.evaluation.legsUF;
      return {
        label: `${stepNumber}.${unit.position}`,
        serial: unit.serial,
        method: methodNames[String(r.input.method)] ?? String(r.input.method ?? '–'),
        legsUF: Array.isArray(legs) && legs.every((v) => typeof v === 'number') ? (legs as number[]) : null,
        kvarAtRated: num(r.evaluation.kvarAtRated),
        nameplateKvar: unit.nameplateKvar,
        deviationPct: r.deviationPct ?? num(r.evaluation.deviationPct),
        band: (r.band ?? null) as BandName | null,
      };
    });
  const stepOfComponent = new Map<string, number>();
  for (const s of bank.steps) {
    if (s.contactor) stepOfComponent.set(`contactor:${s.contactor.id}`, s.number);
    if (s.reactor) stepOfComponent.set(`reactor:${s.reactor.id}`, s.number);
    if (s.fuseSet) stepOfComponent.set(`fuse-set:${s.fuseSet.id}`, s.number);
  }
  const record: SignedRecord = {
    orderId: order.id,
    kind: order.kind,
    title: order.title,
    siteName: place.siteName,
    siteAddress: place.siteAddress,
    bankName: place.bankName,
    bankLocation: place.bankLocation,
    dueOn: order.dueOn,
    createdAt: order.createdAt,
    submittedAt: order.submittedAt,
    assigneeName: assignee?.name ?? null,
    units: unitRows,
    otherReadings: readings
      .filter((r) => r.target !== 'capacitor-unit')
      .map((r) => describeOther(r, (target, targetId) => stepOfComponent.get(`${target}:${targetId}`))),
    flags: flagRows.map((f) => ({ kind: f.kind, severity: f.severity, message: f.message, state: f.state })),
    safety: {
      acknowledgedAt: order.safetyAcknowledgedAt,
      acknowledgedByName: acknowledger?.name ?? null,
      dischargeWaitS: safetyCardFor(bank, { at: null, byName: null }).dischargeWaitS,
    },
    photos: await thumbnailsFor(ctx.store, photoKeys),
    signature: {
      signedByName: order.signedByName ?? '–',
      signedAt: order.signedAt,
      meaning: order.signatureMeaning ?? '',
    },
    engineeringVersions: [...new Set(readings.map((r) => r.engineeringVersion))],
    generatedAt: new Date(),
  };
  return renderSignedRecord(record);
}
