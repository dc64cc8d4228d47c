// A contractor's fleet, invented, written straight into MariaDB with multi-row INSERTs through
// Drizzle and the real schema: sites → banks → steps → capacitor units, contactors, fuse sets
// and reactors; five years of work orders with their transitions; readings evaluated by the
// same functions the readings service calls (packages/engineering underneath), the flags they
// raise and each unit's latest evaluation. Ids are assigned here, so rows can point at each
// other without reading anything back.
import { ENGINEERING_VERSION, projectDrift, ratedLegUF, reactorInductanceMH } from '@varden/engineering';
import type { WorkOrderState } from '@varden/schemas';
import { sql } from 'drizzle-orm';
import type { MySqlTable } from 'drizzle-orm/mysql-core';
import type { Pool } from 'mysql2/promise';
import type { Database } from '../../apps/api/src/db/client';
import {
  banks,
  capacitorUnits,
  contactors,
  flags,
  fuseSets,
  inspectionPlans,
  reactors,
  readings,
  sites,
  steps,
  unitLatestEvaluations,
  userRoles,
  users,
  viewerSiteGrants,
  workOrders,
  workOrderTransitions,
} from '../../apps/api/src/db/schema/index';
import { evaluateCapacitorReading } from '../../apps/api/src/modules/readings/evaluate-capacitor';
import { evaluateBankReading, evaluateContactorReading, evaluateFuseReading } from '../../apps/api/src/modules/readings/evaluate-components';
import type { FlagDraft, InputFor, Outcome } from '../../apps/api/src/modules/readings/evaluation-types';
import { driftWindowMs, replaceBelowPct } from '../../apps/api/src/modules/readings/readings.repository';
import { hashPassword } from '../../apps/api/src/security/password-hashing';
import { BulkSink } from './bulk-sink';

export interface FleetSize {
  sites: number;
  /** Banks per site, steps per bank, units per step: 10 × 8 × 3 gives the issue's 500/4,000/12,000 at 50 sites. */
  banksPerSite: number;
  stepsPerBank: number;
  unitsPerStep: number;
  /** Orders per bank over the five years (40 gives 20,000 at 500 banks). */
  ordersPerBank: number;
}

export const fullFleet: FleetSize = { sites: 50, banksPerSite: 10, stepsPerBank: 8, unitsPerStep: 3, ordersPerBank: 40 };
export const tenthFleet: FleetSize = { ...fullFleet, sites: 5 };

/** The one password every generated person signs in with; hashed once. */
export const fleetPassword = 'bench-fleet-password-2026';

export interface GeneratedFleet {
  counts: Record<string, number>;
  seconds: number;
  technicianEmail: string;
  plannerEmail: string;
  supervisorEmail: string;
  viewerEmail: string;
  siteIds: number[];
  /** Orders on site, assigned to the bench technician, one per bank, with a unit of that bank each. */
  openOrders: Array<{ orderId: number; bankId: number; units: Array<{ id: number; legUF: number }> }>;
  /** A unit with a full five-year history. */
  sampleUnitId: number;
}

/** mulberry32: a small seeded generator, so every run generates the same fleet. */
function seeded(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const DAY = 86_400_000;
const isoDay = (d: Date) => d.toISOString().slice(0, 10);
const addMonths = (d: Date, months: number) => {
  const r = new Date(d);
  r.setUTCMonth(r.getUTCMonth() + months);
  return r;
};

const siteWords = ['North', 'Harbour', 'Quarry', 'Mill', 'Ridge', 'Foundry', 'Delta', 'Lakeside', 'Granary', 'Terminal'];
const siteKinds = ['works', 'plant', 'depot', 'campus', 'yard'];

/**
 * Generates the fleet into an empty, migrated database. `now` is the end of the five years.
 */
export async function generateFleet(db: Database, pool: Pool, size: FleetSize, now = new Date()): Promise<GeneratedFleet> {
  const started = Date.now();
  const sink = await BulkSink.open(pool);
  const random = seeded(8 * size.sites + 1);
  const pick = <T>(list: readonly T[]) => list[Math.floor(random() * list.length)]!;
  const gauss = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const start = addMonths(now, -60);

  // People: planners, technicians, supervisors, a viewer; one Argon2id hash for all.
  const passwordHash = await hashPassword(fleetPassword);
  const people: Array<typeof users.$inferInsert> = [];
  const roleRows: Array<typeof userRoles.$inferInsert> = [];
  const person = (role: 'planner' | 'technician' | 'supervisor' | 'viewer', n: number) => {
    const id = people.length + 1;
    people.push({ id, email: `${role}${n}@fleet.bench`, name: `${role[0]!.toUpperCase()}${role.slice(1)} ${n}`, passwordHash, active: true, passwordChangedAt: start });
    roleRows.push({ userId: id, role });
    return id;
  };
  const planners = Array.from({ length: 4 }, (_, i) => person('planner', i + 1));
  const technicians = Array.from({ length: Math.max(6, size.sites) }, (_, i) => person('technician', i + 1));
  const supervisors = Array.from({ length: 3 }, (_, i) => person('supervisor', i + 1));
  const viewer = person('viewer', 1);
  const benchTechnician = technicians[0]!;

  const siteRows: Array<typeof sites.$inferInsert> = [];
  const bankRows: Array<typeof banks.$inferInsert> = [];
  const stepRows: Array<typeof steps.$inferInsert> = [];
  const unitRows: Array<typeof capacitorUnits.$inferInsert> = [];
  const contactorRows: Array<typeof contactors.$inferInsert> = [];
  const fuseRows: Array<typeof fuseSets.$inferInsert> = [];
  const reactorRows: Array<typeof reactors.$inferInsert> = [];
  const planRows: Array<typeof inspectionPlans.$inferInsert> = [];
  const orderRows: Array<typeof workOrders.$inferInsert> = [];
  const transitionRows: Array<typeof workOrderTransitions.$inferInsert> = [];
  const readingRows: Array<typeof readings.$inferInsert> = [];
  const flagRows = new Map<number, typeof flags.$inferInsert>();
  const latestRows = new Map<number, typeof unitLatestEvaluations.$inferInsert & { recordedAt: Date }>();
  const unitPoints = new Map<number, Array<{ at: Date; deviationPct: number }>>();
  const openOrders: GeneratedFleet['openOrders'] = [];
  const sealedOrderIds: number[] = [];

  // What each array has handed to the sink so far; a bank's rows are final once its loop ends.
  const sent = new Map<unknown[], number>();
  const handOver = <T extends MySqlTable>(table: T, rows: Array<T['$inferInsert']>) => {
    sink.addAll(table, rows.slice(sent.get(rows) ?? 0));
    sent.set(rows, rows.length);
  };
  const handOverAll = () => {
    handOver(users, people);
    handOver(userRoles, roleRows);
    handOver(sites, siteRows);
    handOver(banks, bankRows);
    handOver(steps, stepRows);
    handOver(capacitorUnits, unitRows);
    handOver(contactors, contactorRows);
    handOver(fuseSets, fuseRows);
    handOver(reactors, reactorRows);
    handOver(inspectionPlans, planRows);
    handOver(workOrders, orderRows);
    // The bulky rows leave memory once handed over (less garbage to collect); a bank's flags are
    // final once its loop ends, since only later readings of the same target clear them.
    sink.addAll(workOrderTransitions, transitionRows.splice(0));
    sink.addAll(readings, readingRows.splice(0));
    sink.addAll(flags, [...flagRows.values()]);
    flagRows.clear();
    // The drift the readings service stores beside each latest evaluation, with the points it was fitted over (unitDrift).
    for (const latest of latestRows.values()) {
      const from = latest.recordedAt.getTime() - driftWindowMs;
      const points = (unitPoints.get(latest.unitId) ?? [])
        .filter((p) => p.at.getTime() >= from && p.at <= latest.recordedAt)
        .sort((a, b) => a.at.getTime() - b.at.getTime());
      const drift = points.length < 2 ? null : projectDrift({ points: points.map((p) => ({ date: p.at.toISOString(), deviationPct: p.deviationPct })), replaceBelowPct });
      sink.add(unitLatestEvaluations, {
        ...latest,
        driftRatePctPerYear: drift?.ratePctPerYear ?? null,
        replaceBy: drift?.replaceBy?.slice(0, 10) ?? null,
        driftPoints: points.map((p) => [p.at.getTime(), p.deviationPct]),
      });
    }
    latestRows.clear();
    unitPoints.clear();
  };

  let readingId = 0;
  let flagId = 0;
  let transitionId = 0;
  const key = () => `fleet-${(readingId + 1).toString(36)}-${Math.floor(random() * 2 ** 40).toString(36)}`.padEnd(16, '0');

  /** Flags not cleared, per target and then per "kind target id", as the service's open-flag check sees them. */
  const openFlags = new Map<string, Map<string, number>>();
  const flagKeyOf = (f: { kind: string; target: string; targetId: number }) => `${f.kind} ${f.target} ${f.targetId}`;

  function storeReading(
    order: { id: number; siteId: number; bankId: number; assigneeId: number },
    input: { target: FlagDraft['target']; targetId: number } & Record<string, unknown>,
    outcome: Outcome,
    recordedAt: Date,
  ): number {
    const id = ++readingId;
    const targetKey = `${input.target} ${input.targetId}`;
    let open = openFlags.get(targetKey);
    if (!open) openFlags.set(targetKey, (open = new Map()));
    const drafts = outcome.flags.filter((f, i, all) => all.findIndex((g) => flagKeyOf(g) === flagKeyOf(f)) === i);
    outcome.evaluation.flags = drafts.map((f) => ({ kind: f.kind, severity: f.severity, message: f.message, alreadyOpen: open.has(flagKeyOf(f)) }));
    // A later reading without the finding clears the earlier flag on the target (a planner would).
    for (const [k, fid] of open) {
      if (drafts.some((d) => flagKeyOf(d) === k)) continue;
      const row = flagRows.get(fid)!;
      row.state = 'cleared';
      row.clearedAt = new Date(recordedAt.getTime() + 7 * DAY);
      open.delete(k);
    }
    for (const draft of drafts) {
      if (open.has(flagKeyOf(draft))) continue;
      const fid = ++flagId;
      flagRows.set(fid, { id: fid, ...draft, siteId: order.siteId, bankId: order.bankId, readingId: id, state: 'open', raisedAt: recordedAt });
      open.set(flagKeyOf(draft), fid);
    }
    readingRows.push({
      id,
      workOrderId: order.id,
      idempotencyKey: key(),
      target: input.target,
      targetId: input.targetId,
      input: {},
      evaluation: outcome.evaluation,
      engineeringVersion: ENGINEERING_VERSION,
      band: outcome.band,
      deviationPct: outcome.deviationPct,
      recordedById: order.assigneeId,
      recordedAt,
    });
    const row = readingRows[readingRows.length - 1]!;
    row.input = { ...input, idempotencyKey: row.idempotencyKey };
    if (outcome.unitResult) {
      latestRows.set(input.targetId, { unitId: input.targetId, readingId: id, recordedAt, ...outcome.unitResult });
      unitPoints.set(input.targetId, [...(unitPoints.get(input.targetId) ?? []), { at: recordedAt, deviationPct: outcome.unitResult.deviationPct }]);
    }
    return id;
  }

  function transitions(orderId: number, path: WorkOrderState[], from: Date, actors: number[]): void {
    let at = from;
    let previous: WorkOrderState | null = null;
    path.forEach((state, i) => {
      transitionRows.push({ id: ++transitionId, workOrderId: orderId, fromState: previous, toState: state, actorId: actors[i] ?? actors[0]!, comment: state === 'sent-back' ? 'Photo of the nameplate is missing.' : '', at });
      previous = state;
      at = new Date(at.getTime() + (0.5 + random() * 2) * DAY);
    });
  }

  for (let s = 0; s < size.sites; s++) {
    const siteId = s + 1;
    const sixty = s % 7 === 3;
    const voltageV = sixty ? 480 : 400;
    const frequencyHz = sixty ? 60 : 50;
    siteRows.push({
      id: siteId,
      name: `${siteWords[s % siteWords.length]} ${siteKinds[Math.floor(s / siteWords.length) % siteKinds.length]} ${s + 1}`,
      address: `${100 + s} Switchgear Road`,
      voltageV,
      frequencyHz,
      transformerKva: pick([1000, 1600, 2000, 2500]),
      transformerImpedancePct: pick([5, 6, 6.5]),
      utilityShortCircuitKva: random() < 0.5 ? 250_000 : null,
      targetPf: 0.95,
      tariffBasis: s % 3 === 0 ? 'tan-phi-limit' : 'pf-threshold',
      tariffLimit: s % 3 === 0 ? 0.4 : 0.9,
      pricePerKvarh: 0.012 + random() * 0.01,
      currency: sixty ? 'USD' : 'EUR',
      plannedLoadKw: 600 + Math.round(random() * 1200),
      plannedLoadPf: 0.82,
    });
    const technician = technicians[s % technicians.length]!;
    for (let b = 0; b < size.banksPerSite; b++) {
      const bankId = bankRows.length + 1;
      const detuned = b % 3 === 2;
      const commissioned = new Date(start.getTime() - (30 + random() * 300) * DAY);
      bankRows.push({
        id: bankId,
        siteId,
        name: `Bank ${String.fromCharCode(65 + b)}`,
        location: `Switch-room ${1 + Math.floor(b / 4)}`,
        controllerTargetPf: 0.96,
        detuned,
        detuningFactor: detuned ? 0.07 : null,
        commissionedOn: isoDay(commissioned),
      });
      const unitsOfBank: Array<{ unit: typeof capacitorUnits.$inferInsert & { id: number }; step: { id: number; number: number }; startPct: number; ratePct: number; failAt: number | null }> = [];
      const contactorsOfBank: Array<{ id: number; step: { id: number; number: number }; perMonth: number }> = [];
      const fusesOfBank: Array<{ id: number; step: { id: number; number: number }; ratedCurrentA: number }> = [];
      for (let st = 0; st < size.stepsPerBank; st++) {
        const stepId = stepRows.length + 1;
        const ratedKvar = st < 2 ? 25 : 50;
        stepRows.push({ id: stepId, bankId, number: st + 1, ratedKvar });
        const step = { id: stepId, number: st + 1 };
        // Detuned steps carry 440 V units behind a 7 % reactor; the step's output stays at its rating.
        const unitVoltageV = detuned ? (voltageV === 400 ? 440 : 525) : voltageV;
        const nameplateKvar = ratedKvar / size.unitsPerStep;
        for (let u = 0; u < size.unitsPerStep; u++) {
          const id = unitRows.length + 1;
          const legUF = ratedLegUF({ kvar: nameplateKvar, voltageV: unitVoltageV, frequencyHz, connection: 'delta' });
          const unit = {
            id,
            stepId,
            position: u + 1,
            nameplateKvar,
            nameplateVoltageV: unitVoltageV,
            nameplateFrequencyHz: frequencyHz,
            connection: 'delta' as const,
            capacitanceUF: legUF,
            serial: `VB${(100000 + id).toString()}`,
            maker: 'Invented Capacitor Works',
            model: `DK-${Math.round(nameplateKvar)}`,
            installedOn: isoDay(commissioned),
          };
          unitRows.push(unit);
          const roll = random();
          unitsOfBank.push({
            unit,
            step,
            startPct: 1 + gauss() * 1.2,
            // Most units lose a little each year; some age fast; a few fail outright.
            ratePct: roll < 0.03 ? -(1.5 + random() * 2) : -(0.1 + random() * 0.4),
            failAt: roll > 0.99 ? 0.3 + random() * 0.7 : null,
          });
        }
        const stepLegs = (): [number, number, number] => {
          const legUF = ratedLegUF({ kvar: nameplateKvar, voltageV: unitVoltageV, frequencyHz, connection: 'delta' }) * size.unitsPerStep;
          return [legUF, legUF, legUF];
        };
        const contactorId = contactorRows.length + 1;
        contactorRows.push({ id: contactorId, stepId, ratedOperations: 100_000, counterAtInstall: 0, maker: 'Invented Switchgear', model: 'CK-50', installedOn: isoDay(commissioned) });
        contactorsOfBank.push({ id: contactorId, step, perMonth: 300 + Math.floor(random() * 900) });
        const fuseId = fuseRows.length + 1;
        fuseRows.push({ id: fuseId, stepId, ratedCurrentA: ratedKvar === 25 ? 63 : 125, type: 'gG', installedOn: isoDay(commissioned) });
        fusesOfBank.push({ id: fuseId, step, ratedCurrentA: ratedKvar === 25 ? 63 : 125 });
        if (detuned) {
          reactorRows.push({
            id: reactorRows.length + 1,
            stepId,
            inductanceMH: reactorInductanceMH({ detuningFactor: 0.07, legsUF: stepLegs(), frequencyHz }),
            ratedCurrentA: (ratedKvar * 1000) / (Math.sqrt(3) * voltageV) * 1.1,
            detuningFactor: 0.07,
            maker: 'Invented Magnetics',
            model: `RK-${ratedKvar}`,
            installedOn: isoDay(commissioned),
          });
        }
      }

      const planId = planRows.length + 1;
      planRows.push({ id: planId, bankId, name: 'Four-monthly inspection', intervalMonths: 4, leadDays: 14, checklist: ['capacitance', 'contactor', 'fuses', 'controller'], nextDueOn: isoDay(addMonths(start, 64)) });

      // The bank's 40 orders: 15 inspections with readings every four months (the first a
      // baseline), one on site now, one queued for the next visit, the rest corrective or
      // cleaning visits spread over the years in plausible states.
      const siteRef = { id: siteId, voltageV, frequencyHz, targetPf: 0.95, tariffBasis: siteRows[s]!.tariffBasis!, tariffLimit: siteRows[s]!.tariffLimit! };
      const bankRef = { id: bankId, name: bankRows[bankRows.length - 1]!.name, detuned, detuningFactor: detuned ? 0.07 : null };
      const inspections = Math.min(15, size.ordersPerBank - 2);
      for (let k = 0; k < size.ordersPerBank; k++) {
        const orderId = orderRows.length + 1;
        let dueOn: Date;
        let state: WorkOrderState;
        let kind: 'inspection' | 'corrective' | 'baseline' = 'inspection';
        let title: string;
        let assigneeId: number | null = technician;
        const withReadings = k < inspections;
        if (withReadings) {
          dueOn = new Date(addMonths(start, 4 * k).getTime() + Math.floor(random() * 10) * DAY);
          kind = k === 0 ? 'baseline' : 'inspection';
          title = k === 0 ? 'Baseline measurement' : 'Four-monthly inspection';
          state = k === inspections - 1 && b % 5 === 1 ? 'awaiting-review' : 'sealed';
        } else if (k === inspections) {
          dueOn = new Date(now.getTime() + (random() * 10 - 5) * DAY);
          title = 'Four-monthly inspection';
          state = 'on-site';
          assigneeId = benchTechnician;
        } else if (k === inspections + 1) {
          dueOn = addMonths(now, 4);
          title = 'Four-monthly inspection';
          state = 'queued';
          assigneeId = null;
        } else {
          const t = random();
          dueOn = new Date(start.getTime() + t * (now.getTime() + 30 * DAY - start.getTime()));
          kind = random() < 0.6 ? 'corrective' : 'inspection';
          title = kind === 'corrective' ? `Replace unit, step ${1 + Math.floor(random() * size.stepsPerBank)}` : 'Clean filters and check ventilation';
          const age = (now.getTime() - dueOn.getTime()) / DAY;
          if (age > 45) state = random() < 0.93 ? 'sealed' : 'withdrawn';
          else state = pick(['queued', 'dispatched', 'on-site', 'awaiting-review', 'sent-back', 'sealed'] as const);
          if (state === 'queued') assigneeId = random() < 0.5 ? null : technician;
        }
        const created = new Date(dueOn.getTime() - 14 * DAY);
        const supervisor = supervisors[bankId % supervisors.length]!;
        const planner = planners[bankId % planners.length]!;
        const sealed = state === 'sealed';
        const submittedAt = ['awaiting-review', 'sealed', 'sent-back'].includes(state) ? new Date(dueOn.getTime() + 0.4 * DAY) : null;
        orderRows.push({
          id: orderId,
          kind,
          siteId,
          bankId,
          planId: kind === 'inspection' && withReadings ? planId : null,
          title,
          instructions: 'Isolate the bank, wait for the discharge time, prove dead, then measure each unit.',
          checklist: ['capacitance', 'contactor', 'fuses', 'controller'],
          dueOn: isoDay(dueOn),
          priority: kind === 'corrective' ? 'high' : 'normal',
          assigneeId,
          state,
          locked: false,
          safetyAcknowledgedAt: ['on-site', 'awaiting-review', 'sent-back', 'sealed'].includes(state) ? dueOn : null,
          safetyAcknowledgedById: ['on-site', 'awaiting-review', 'sent-back', 'sealed'].includes(state) ? assigneeId : null,
          submittedAt,
          signedAt: sealed ? new Date(dueOn.getTime() + 2 * DAY) : null,
          signedById: sealed ? supervisor : null,
          signedByName: sealed ? `Supervisor ${supervisors.indexOf(supervisor) + 1}` : null,
          signatureMeaning: sealed ? 'I have reviewed the readings, results, flags and photos of this order and accept them as the maintenance record.' : null,
          createdById: planner,
          createdAt: created,
          updatedAt: submittedAt ?? created,
        });
        if (sealed) sealedOrderIds.push(orderId);
        const path: WorkOrderState[] = {
          queued: ['queued'],
          dispatched: ['queued', 'dispatched'],
          'on-site': ['queued', 'dispatched', 'on-site'],
          'awaiting-review': ['queued', 'dispatched', 'on-site', 'awaiting-review'],
          'sent-back': ['queued', 'dispatched', 'on-site', 'awaiting-review', 'sent-back'],
          sealed: ['queued', 'dispatched', 'on-site', 'awaiting-review', 'sealed'],
          withdrawn: ['queued', 'withdrawn'],
        }[state] as WorkOrderState[];
        const actorOf = (st: WorkOrderState) => (st === 'sealed' || st === 'sent-back' ? supervisor : st === 'on-site' || st === 'awaiting-review' ? (assigneeId ?? planner) : planner);
        transitions(orderId, path, created, path.map(actorOf));

        if (state === 'on-site' && assigneeId === benchTechnician) {
          openOrders.push({ orderId, bankId, units: unitsOfBank.map((u) => ({ id: u.unit.id, legUF: u.unit.capacitanceUF })) });
        }
        if (!withReadings) continue;

        const order = { id: orderId, siteId, bankId, assigneeId: assigneeId! };
        const years = (dueOn.getTime() - start.getTime()) / (365.25 * DAY);
        let at = new Date(dueOn.getTime() + 9 * 3600_000);
        const tick = () => (at = new Date(at.getTime() + (60 + Math.floor(random() * 240)) * 1000));
        for (const u of unitsOfBank) {
          const rated = u.unit.capacitanceUF;
          const pct = u.startPct + u.ratePct * years;
          const failed = u.failAt !== null && years / 5 >= u.failAt;
          const legs = [0, 1, 2].map((leg) => rated * (1 + (pct + gauss() * 0.25) / 100) * (failed && leg === 2 ? 0.03 : 1));
          const input: InputFor<'capacitor-unit'> = {
            idempotencyKey: '',
            notes: '',
            confirmImplausible: false,
            target: 'capacitor-unit',
            targetId: u.unit.id,
            method: 'per-element',
            elementsUF: legs.map((v) => Math.round(v * 100) / 100),
            caseTemperatureC: Math.round(28 + random() * 14),
            ambientTemperatureC: 24,
            visual: { bulging: failed && random() < 0.5, disconnectorOperated: false, leakage: false, discoloration: false, hotTerminals: false },
            recordedAt: tick().toISOString(),
          };
          const outcome = evaluateCapacitorReading(input, {
            unit: { ...u.unit, toleranceMinusPct: -5, tolerancePlusPct: 10 },
            step: u.step,
            bank: bankRef,
            site: siteRef,
            reactor: null,
            unitsInStep: size.unitsPerStep,
            orderKind: kind,
          });
          storeReading(order, { ...input }, outcome, at);
        }
        const c = contactorsOfBank[k % contactorsOfBank.length]!;
        const contactorInput: InputFor<'contactor'> = {
          idempotencyKey: '',
          notes: '',
          confirmImplausible: false,
          target: 'contactor',
          targetId: c.id,
          operationsCounter: Math.round(c.perMonth * years * 12),
          contactCondition: years > 4 && random() < 0.2 ? 'worn' : 'good',
          prechargeResistorsOhm: [],
          recordedAt: tick().toISOString(),
        };
        storeReading(order, { ...contactorInput }, evaluateContactorReading(contactorInput, { contactor: { id: c.id, ratedOperations: 100_000, counterAtInstall: 0 }, step: c.step, previousCounter: null }), at);
        // Ten fuse checks per bank over the years: one on each of the first ten inspections.
        if (k < 10) {
          const f = fusesOfBank[k % fusesOfBank.length]!;
          const fuseInput: InputFor<'fuse-set'> = {
            idempotencyKey: '',
            notes: '',
            confirmImplausible: false,
            target: 'fuse-set',
            targetId: f.id,
            continuity: [true, true, random() > 0.03],
            ratingMatchesRegister: true,
            recordedAt: tick().toISOString(),
          };
          storeReading(order, { ...fuseInput }, evaluateFuseReading(fuseInput, { fuseSet: { id: f.id, ratedCurrentA: f.ratedCurrentA, type: 'gG' }, step: f.step }), at);
        }
        const bankInput: InputFor<'bank'> = {
          idempotencyKey: '',
          notes: '',
          confirmImplausible: false,
          target: 'bank',
          targetId: bankId,
          controllerPf: Math.round((0.93 + random() * 0.05) * 1000) / 1000,
          loadKw: Math.round(500 + random() * 1000),
          cleaningDone: true,
          filtersDone: detuned,
          recordedAt: tick().toISOString(),
        };
        storeReading(order, { ...bankInput }, evaluateBankReading(bankInput, { bank: bankRef, site: siteRef }), at);
      }
      handOverAll();
      await sink.drain();
    }
  }
  const computedAt = Date.now();

  sink.addAll(viewerSiteGrants, siteRows.slice(0, Math.min(3, siteRows.length)).map((site) => ({ userId: viewer, siteId: site.id! })));
  handOverAll();
  await sink.close();
  // Seal last: once locked, the database's triggers refuse readings on an order.
  for (let i = 0; i < sealedOrderIds.length; i += 5000) {
    await db.execute(sql`UPDATE work_orders SET locked = TRUE WHERE id IN (${sql.join(sealedOrderIds.slice(i, i + 5000).map((id) => sql`${id}`), sql`, `)})`);
  }
  const seconds = (Date.now() - started) / 1000;
  console.log(`  fleet of ${size.sites} sites: ${sink.rowsWritten} rows; computing ended at ${((computedAt - started) / 1000).toFixed(1)} s, the last row stored at ${seconds.toFixed(1)} s`);

  return {
    counts: {
      sites: siteRows.length,
      banks: bankRows.length,
      steps: stepRows.length,
      capacitorUnits: unitRows.length,
      contactors: contactorRows.length,
      fuseSets: fuseRows.length,
      reactors: reactorRows.length,
      workOrders: orderRows.length,
      transitions: transitionId,
      readings: readingId,
      flags: flagId,
      latestEvaluations: unitRows.length,
      users: people.length,
    },
    seconds,
    technicianEmail: `technician1@fleet.bench`,
    plannerEmail: 'planner1@fleet.bench',
    supervisorEmail: 'supervisor1@fleet.bench',
    viewerEmail: 'viewer1@fleet.bench',
    siteIds: siteRows.map((s) => s.id!),
    openOrders,
    sampleUnitId: 1,
  };
}
