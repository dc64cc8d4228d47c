import { omega, openPairReadingsFromLegs, ratedLegUF, shortedReadingsFromLegs, type Triple } from '@varden/engineering';
import type { ChecklistItem, ReadingInput, WalkthroughBank, WorkOrderKind, WorkOrderState } from '@varden/schemas';
import { and, eq, sql } from 'drizzle-orm';
import sharp from 'sharp';
import type { SessionUser } from '../access/current-user';
import type { AppContext } from '../context';
import { banks, flags, inspectionPlans, sites, users, workOrders, workOrderTransitions } from '../db/schema/index';
import { raiseCorrectiveOrder } from '../modules/flags/flags.service';
import { addPhoto } from '../modules/photos/photos.service';
import { inspectionInstructions } from '../modules/plans/due-inspections';
import { recordReading } from '../modules/readings/readings.service';
import { withAccess } from '../modules/users/repository';
import { walkthroughBankOf } from '../modules/work-orders/bank-tree.repository';
import { addDays, addMonths, utcDate } from '../modules/work-orders/calendar';
import type { ReadingInputValue } from '../modules/readings/evaluation-types';

/**
 * The demo's work (../shared/demo-scenario.md): an inspection plan every six months per bank
 * and three years of orders behind it, with readings evaluated by the readings service exactly
 * as a phone's would be. Everything is invented. The story:
 * - Alder Quay Bank A: step 3's capacitors lose about 12 % over the three years, so its tuning
 *   frequency creeps from 189 Hz towards 200 Hz; the latest inspection (awaiting review) finds
 *   them past the replace threshold.
 * - Alder Quay Bank B: step 2's unit has its over-pressure disconnector operated (a leg reads
 *   near zero); the inspection awaits review and a corrective order is dispatched.
 * - Brinmoor: the step 2 contactor is at about 85 % of its electrical endurance and a step 3
 *   fuse blew last month; a technician is on site with the corrective order for it.
 * - Castellan: every unit ages about 1.5 % a year and step 5's unit is unbalanced (max/min
 *   about 1.09); a supervisor sent the latest inspection back to re-measure it.
 */

type Method = 'open-pairs' | 'shorted' | 'line-currents';

interface BankStory {
  site: string;
  bank: string;
  method: Method;
  /** Technicians taking turns, by e-mail. */
  technicians: string[];
  planner: string;
  /** Deviation from nameplate (%) of a unit `years` before today. */
  deviationPct: (step: number, position: number, years: number) => number;
  /** Leg factors (C12, C23, C31) of a unit, for a fault in one leg. */
  legFactors?: (step: number, position: number, years: number) => Triple;
  /** Contactor operations per year, by step. */
  operationsPerYear: (step: number) => number;
  controllerPf: number;
  /** The load the controller showed beside its PF, when the technician noted it (kW). */
  loadKw?: number;
  voltageThdPct: number;
}

const supervisors = ['supervisor@demo.varden.test', 'amadou.whitloe@demo.varden.test'];

/** Small fixed scatter, the same at every seeding: a hash of the inputs mapped to −1 … 1. */
function scatter(...parts: number[]): number {
  let h = 2166136261;
  for (const p of parts) {
    h ^= Math.round(p * 1000);
    h = Math.imul(h, 16777619);
  }
  return ((h >>> 0) % 2001) / 1000 - 1;
}

const stories: BankStory[] = [
  {
    site: 'Alder Quay Cold Store',
    bank: 'Bank A',
    method: 'open-pairs',
    technicians: ['technician@demo.varden.test', 'bex.ardalan@demo.varden.test'],
    planner: 'planner@demo.varden.test',
    // Step 3 loses about 12 % over three years, a little faster lately; the others age slowly.
    deviationPct: (step, position, years) =>
      step === 3 ? -12 * Math.pow(Math.max(0, 3 - years) / 3, 1.3) + 0.2 * scatter(step, position, years) : -0.6 - 0.3 * (3 - years) + 0.4 * scatter(step, position, years),
    operationsPerYear: (step) => 7000 - step * 600,
    controllerPf: 0.95,
    voltageThdPct: 2.8,
  },
  {
    site: 'Alder Quay Cold Store',
    bank: 'Bank B',
    method: 'open-pairs',
    technicians: ['bex.ardalan@demo.varden.test', 'technician@demo.varden.test'],
    planner: 'planner@demo.varden.test',
    deviationPct: (step, position, years) => -1 - 0.5 * (3 - years) + 0.4 * scatter(step, position, years),
    // Step 2's disconnector operated since the last inspection: one leg is all but gone.
    legFactors: (step, _position, years) => (step === 2 && years < 0.1 ? [1, 1, 0.005] : [1, 1, 1]),
    operationsPerYear: (step) => 4500 - step * 400,
    controllerPf: 0.93,
    voltageThdPct: 2.6,
  },
  {
    site: 'Brinmoor Pumping Station',
    bank: 'Pump hall bank',
    method: 'line-currents',
    technicians: ['nils.okoro-reyes@demo.varden.test'],
    planner: 'ysolde.farrant@demo.varden.test',
    // Slow ageing: a 14 % step tuned at 133.6 Hz comes within 10 % of the 3rd harmonic after about 2 % loss.
    deviationPct: (step, position, years) => -0.3 - 0.3 * (3 - years) + 0.2 * scatter(step, position, years),
    // Step 2 switches far more often than the rest: about 85 % of 100 000 operations by last month.
    operationsPerYear: (step) => (step === 2 ? 12_800 : 5200 - step * 300),
    controllerPf: 0.91,
    voltageThdPct: 4.4,
  },
  {
    site: 'Castellan Polymers, Plant 2',
    bank: 'Extruder bank',
    method: 'shorted',
    technicians: ['priya.lindqvale@demo.varden.test'],
    planner: 'planner@demo.varden.test',
    deviationPct: (step, position, years) => -0.2 - 1.5 * (3 - years) + 0.2 * scatter(step, position, years),
    // Step 5's C23 leg falls behind the other two: max/min grows to about 1.09.
    legFactors: (step, _position, years) => {
      const u = Math.min(1, Math.max(0, 3 - years) / 3);
      return step === 5 ? [1 + 0.035 * u, 1 - 0.05 * u, 1 + 0.035 * u] : [1, 1, 1];
    },
    operationsPerYear: (step) => 9000 - step * 500,
    controllerPf: 0.94,
    // The extruder line's technicians note the load beside the controller's PF.
    loadKw: 900,
    voltageThdPct: 3.1,
  },
];

const checklistOf = (detuned: boolean): ChecklistItem[] => [
  'capacitance',
  'visual',
  'case-temperature',
  'contactor',
  ...(detuned ? (['reactor'] as const) : []),
  'fuses',
  'bank',
];

const round = (v: number, digits: number) => Number(v.toFixed(digits));
const at = (date: string, hour: number, minute = 0) => new Date(`${date}T${String(hour).padStart(2, '0')}:${String(minute).padStart(2, '0')}:00Z`);
const yearsBefore = (date: string, today: string) => (Date.parse(`${today}T00:00:00Z`) - Date.parse(`${date}T00:00:00Z`)) / (365.25 * 86_400_000);

interface People {
  byEmail: Map<string, SessionUser>;
}

function someone(people: People, email: string): SessionUser {
  const user = people.byEmail.get(email);
  if (!user) throw new Error(`The demo account ${email} is missing: seed the accounts first.`);
  return user;
}

/** The line currents a delta unit of legs `legsUF` draws through its step's series reactor (star equivalent per phase). */
function lineCurrentsThroughReactor(legsUF: Triple, voltageV: number, frequencyHz: number, inductanceMH: number): Triple {
  const w = omega(frequencyHz);
  const xl = w * inductanceMH * 1e-3;
  return legsUF.map((leg) => voltageV / Math.sqrt(3) / (1 / (w * 3 * leg * 1e-6) - xl)) as Triple;
}

let keyCounter = 0;
const key = () => `demo-${Date.now().toString(36)}-${(keyCounter++).toString(36).padStart(5, '0')}`;

interface Visit {
  /** Years before today the readings were taken (drives the story's values). */
  years: number;
  /** When the readings start. */
  start: Date;
  /** Faults to show on this visit. */
  blownFuseStep?: number;
  fuseSetsOnly?: number[];
  unitsOnly?: number[];
  notes?: Record<number, string>;
}

/** The readings a technician takes on one visit, in the order they walk the bank. */
function readingsFor(story: BankStory, bank: WalkthroughBank, visit: Visit, commissionedYearsAgo: number): ReadingInputValue[] {
  const list: ReadingInput[] = [];
  let minute = 0;
  const when = () => new Date(visit.start.getTime() + (minute += 3) * 60_000).toISOString();
  const { years } = visit;
  for (const step of bank.steps) {
    for (const unit of step.units) {
      if (visit.unitsOnly && !visit.unitsOnly.includes(step.number)) continue;
      const rated = ratedLegUF({ kvar: unit.nameplateKvar, voltageV: unit.nameplateVoltageV, frequencyHz: unit.nameplateFrequencyHz, connection: unit.connection });
      const dev = story.deviationPct(step.number, unit.position, years);
      const factors = story.legFactors?.(step.number, unit.position, years) ?? [1, 1, 1];
      const legs = factors.map((f, i) => rated * (1 + dev / 100) * f * (1 + 0.002 * scatter(step.number, unit.position, years, i))) as Triple;
      const failed = factors.some((f) => f < 0.1);
      const base = {
        target: 'capacitor-unit' as const,
        targetId: unit.id,
        idempotencyKey: key(),
        recordedAt: when(),
        caseTemperatureC: round(36 + 4 * scatter(step.number, years, 7) + (failed ? 9 : 0), 1),
        ambientTemperatureC: round(23 + 2 * scatter(years, 3), 1),
        visual: { bulging: failed, disconnectorOperated: failed, leakage: false, discoloration: false, hotTerminals: false },
        notes: failed ? 'Case lid raised and the disconnector has operated. Unit left isolated.' : (visit.notes?.[step.number] ?? ''),
      };
      if (story.method === 'line-currents' && step.reactor) {
        const voltageV = round(404 + 3 * scatter(years, 11), 1);
        const currentsA = lineCurrentsThroughReactor(legs, voltageV, 50, step.reactor.inductanceMH).map((i) => round(i, 1)) as Triple;
        list.push({ ...base, method: 'line-currents', currentsA, measuredVoltageV: voltageV, measuredFrequencyHz: 50, voltageThdPct: story.voltageThdPct });
      } else {
        const readings = story.method === 'shorted' ? shortedReadingsFromLegs(legs) : openPairReadingsFromLegs(legs);
        list.push({ ...base, method: story.method === 'shorted' ? 'shorted' : 'open-pairs', readingsUF: readings.map((r) => round(r, 1)) as Triple });
      }
    }
    if (visit.unitsOnly || visit.fuseSetsOnly) {
      if (visit.fuseSetsOnly?.includes(step.number) && step.fuseSet) {
        list.push({ target: 'fuse-set', targetId: step.fuseSet.id, idempotencyKey: key(), recordedAt: when(), continuity: [true, true, true], ratingMatchesRegister: true, notes: 'New fuses fitted after the unit checked healthy.' });
      }
      continue;
    }
    if (step.contactor) {
      const operations = Math.round(story.operationsPerYear(step.number) * (commissionedYearsAgo - years));
      list.push({
        target: 'contactor',
        targetId: step.contactor.id,
        idempotencyKey: key(),
        recordedAt: when(),
        operationsCounter: step.contactor.counterAtInstall + Math.max(0, operations),
        contactCondition: operations > 0.75 * step.contactor.ratedOperations ? 'worn' : 'good',
        prechargeResistorsOhm: [],
      });
    }
    if (step.reactor) {
      const l = step.reactor.inductanceMH;
      list.push({
        target: 'reactor',
        targetId: step.reactor.id,
        idempotencyKey: key(),
        recordedAt: when(),
        inductanceMH: [0, 1, 2].map((i) => round(l * (1 + 0.01 * scatter(step.number, years, i)), 3)) as Triple,
        thermalSwitchClosed: true,
        temperatureC: round(58 + 5 * scatter(step.number, years), 1),
      });
    }
    if (step.fuseSet) {
      const blown = visit.blownFuseStep === step.number;
      list.push({
        target: 'fuse-set',
        targetId: step.fuseSet.id,
        idempotencyKey: key(),
        recordedAt: when(),
        continuity: blown ? [true, false, true] : [true, true, true],
        ratingMatchesRegister: true,
        notes: blown ? 'L2 fuse open. Left out until the step is investigated.' : '',
      });
    }
  }
  if (!visit.unitsOnly && !visit.fuseSetsOnly) {
    list.push({
      target: 'bank',
      targetId: bank.id,
      idempotencyKey: key(),
      recordedAt: when(),
      controllerPf: round(story.controllerPf + 0.01 * scatter(years, 5), 2),
      ...(story.loadKw ? { loadKw: round(story.loadKw * (1 + 0.04 * scatter(years, 11)), 0) } : {}),
      voltageThdPct: round(story.voltageThdPct + 0.3 * scatter(years, 9), 1),
      cleaningDone: true,
      filtersDone: true,
    });
  }
  // Values the server would ask to confirm are the story's own: confirmed as the technician would.
  return list.map((r) => ({ ...r, confirmImplausible: true, notes: r.notes ?? '' })) as ReadingInputValue[];
}

interface OrderPlan {
  kind: WorkOrderKind;
  bankId: number;
  siteId: number;
  planId: number | null;
  title: string;
  instructions: string;
  checklist: ChecklistItem[];
  dueOn: string;
  priority?: 'low' | 'normal' | 'high' | 'urgent';
  createdBy: SessionUser | null;
  createdAt: Date;
  assignee: SessionUser | null;
  dispatchedAt?: Date;
}

/** Writes one transition row. */
async function transition(ctx: AppContext, orderId: number, from: WorkOrderState | null, to: WorkOrderState, actor: SessionUser | null, when: Date, comment = '') {
  await ctx.db.insert(workOrderTransitions).values({ workOrderId: orderId, fromState: from, toState: to, actorId: actor?.id ?? null, comment, at: when });
}

/** An order created and, when it has an assignee, dispatched, with the transitions that took it there. */
async function openOrder(ctx: AppContext, o: OrderPlan, state: 'queued' | 'dispatched' | 'on-site', acknowledgedAt?: Date): Promise<number> {
  const [created] = await ctx.db
    .insert(workOrders)
    .values({
      kind: o.kind,
      siteId: o.siteId,
      bankId: o.bankId,
      planId: o.planId,
      title: o.title,
      instructions: o.instructions,
      checklist: o.checklist,
      dueOn: o.dueOn,
      priority: o.priority ?? 'normal',
      assigneeId: o.assignee?.id ?? null,
      state,
      createdById: o.createdBy?.id ?? null,
      createdAt: o.createdAt,
      ...(state === 'on-site' && acknowledgedAt ? { safetyAcknowledgedAt: acknowledgedAt, safetyAcknowledgedById: o.assignee?.id ?? null } : {}),
    })
    .$returningId();
  const id = created!.id;
  await transition(ctx, id, null, 'queued', o.createdBy, o.createdAt, o.planId ? `Created from the inspection plan “${o.title}”` : 'Created by hand');
  if (state !== 'queued') await transition(ctx, id, 'queued', 'dispatched', o.createdBy ?? null, o.dispatchedAt ?? new Date(o.createdAt.getTime() + 86_400_000));
  if (state === 'on-site' && acknowledgedAt) await transition(ctx, id, 'dispatched', 'on-site', o.assignee, acknowledgedAt);
  return id;
}

async function record(ctx: AppContext, technician: SessionUser, orderId: number, readings: ReadingInputValue[]): Promise<void> {
  for (const input of readings) await recordReading(ctx, technician, orderId, input);
}

/** A picture for the demo's photos: a plain panel with a label, made here (no camera in a seed). */
async function demoPicture(label: string, colour: string): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="960" height="720"><rect width="960" height="720" fill="${colour}"/><rect x="180" y="140" width="600" height="440" rx="24" fill="#ECE7DC" stroke="#1C2A38" stroke-width="8"/><text x="480" y="380" font-family="sans-serif" font-size="40" text-anchor="middle" fill="#1C2A38">${label}</text></svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}

async function photo(ctx: AppContext, technician: SessionUser, orderId: number, caption: string, colour: string, target?: { target: 'capacitor-unit' | 'fuse-set'; targetId: number }) {
  try {
    const buffer = await demoPicture(caption, colour);
    await addPhoto(ctx, technician, orderId, { idempotencyKey: key(), caption, ...(target ?? {}) }, { buffer, size: buffer.length });
  } catch (error) {
    // A demo without its photos is still a demo; the file store may be unreachable at seed time.
    ctx.log.warn({ err: error }, 'demo photo not stored');
  }
}

/** Moves an on-site order to its review outcome with the transitions of the way there. */
async function finish(
  ctx: AppContext,
  orderId: number,
  technician: SessionUser,
  submittedAt: Date,
  outcome: { state: 'awaiting-review' } | { state: 'sent-back'; by: SessionUser; at: Date; reason: string } | { state: 'sealed'; by: SessionUser; at: Date },
) {
  await transition(ctx, orderId, 'on-site', 'awaiting-review', technician, submittedAt);
  if (outcome.state === 'awaiting-review') {
    await ctx.db.update(workOrders).set({ state: 'awaiting-review', submittedAt, version: 3 }).where(eq(workOrders.id, orderId));
    return;
  }
  await transition(ctx, orderId, 'awaiting-review', outcome.state, outcome.by, outcome.at, outcome.state === 'sent-back' ? outcome.reason : '');
  if (outcome.state === 'sent-back') {
    await ctx.db.update(workOrders).set({ state: 'sent-back', submittedAt, version: 4 }).where(eq(workOrders.id, orderId));
    return;
  }
  await ctx.db
    .update(workOrders)
    .set({
      state: 'sealed',
      submittedAt,
      signedAt: outcome.at,
      signedById: outcome.by.id,
      signedByName: outcome.by.name,
      signatureMeaning: 'I have reviewed the readings, results, flags and photos of this order and accept them as the maintenance record.',
      locked: true,
      version: 4,
    })
    .where(eq(workOrders.id, orderId));
}

export async function seedDemoWork(ctx: AppContext): Promise<void> {
  const today = utcDate();
  const records = await withAccess(ctx.db, await ctx.db.select().from(users));
  const people: People = {
    byEmail: new Map(records.map((u) => [u.email, { id: u.id, email: u.email, name: u.name, roles: u.roles, siteIds: u.siteIds }])),
  };
  const [henrike, amadou] = supervisors.map((e) => someone(people, e)) as [SessionUser, SessionUser];

  const bankRows = await ctx.db
    .select({ id: banks.id, name: banks.name, siteId: banks.siteId, siteName: sites.name, commissionedOn: banks.commissionedOn, detuned: banks.detuned })
    .from(banks)
    .innerJoin(sites, eq(sites.id, banks.siteId));

  for (const story of stories) {
    const row = bankRows.find((b) => b.siteName === story.site && b.name === story.bank);
    if (!row) throw new Error(`The demo register lacks ${story.site}, ${story.bank}: seed the register first.`);
    const bank = (await walkthroughBankOf(ctx.db, row.id))!;
    const commissionedYearsAgo = yearsBefore(row.commissionedOn ?? '2020-01-01', today);
    const planner = someone(people, story.planner);
    const checklist = checklistOf(row.detuned);
    const planName = `Half-yearly inspection, ${story.bank}`;

    // The date the current half-yearly inspection falls due, per bank.
    const currentDue = {
      'Bank A': addDays(today, 5),
      'Bank B': addDays(today, -4),
      'Pump hall bank': addDays(today, -25),
      'Extruder bank': addDays(today, -1),
    }[story.bank]!;
    const [plan] = await ctx.db
      .insert(inspectionPlans)
      .values({ bankId: row.id, name: planName, intervalMonths: 6, leadDays: 21, checklist, nextDueOn: addMonths(currentDue, 6) })
      .$returningId();
    const planId = plan!.id;

    const inspection = (dueOn: string, assignee: SessionUser): OrderPlan => ({
      kind: 'inspection',
      bankId: row.id,
      siteId: row.siteId,
      planId,
      title: planName,
      instructions: inspectionInstructions(checklist),
      checklist,
      dueOn,
      createdBy: null,
      createdAt: at(addDays(dueOn, -21), 2, 7),
      assignee,
      dispatchedAt: at(addDays(dueOn, -18), 8, 40),
    });

    // Three years of sealed half-yearly inspections, oldest first so each reading follows the one before.
    for (let k = 6; k >= 1; k--) {
      const dueOn = addMonths(currentDue, -6 * k);
      const technician = someone(people, story.technicians[k % story.technicians.length]!);
      const done = addDays(dueOn, -2);
      const start = at(done, 8, 15);
      const id = await openOrder(ctx, inspection(dueOn, technician), 'on-site', start);
      await record(ctx, technician, id, readingsFor(story, bank, { years: yearsBefore(done, today), start }, commissionedYearsAgo));
      await finish(ctx, id, technician, at(done, 12, 10), { state: 'sealed', by: k % 2 ? henrike : amadou, at: at(addDays(done, 2), 10, 30) });
    }

    // This half-year's inspection, and what it led to.
    const technician = someone(people, story.technicians[0]!);
    if (story.bank === 'Bank A') {
      const done = addDays(today, -1);
      const start = at(done, 8, 5);
      const id = await openOrder(ctx, inspection(currentDue, technician), 'on-site', start);
      await record(ctx, technician, id, readingsFor(story, bank, { years: 1 / 365, start, notes: { 3: 'Both units of step 3 read low again; the reactor runs warm.' } }, commissionedYearsAgo));
      await photo(ctx, technician, id, 'Step 3 units, as found', '#5B6B78', { target: 'capacitor-unit', targetId: bank.steps[2]!.units[0]!.id });
      await finish(ctx, id, technician, at(done, 11, 50), { state: 'awaiting-review' });
      // A corrective order from a year ago, withdrawn: the controller fault was a loose CT lead.
      const withdrawnDue = addMonths(today, -8);
      const wid = await openOrder(
        ctx,
        {
          kind: 'corrective',
          bankId: row.id,
          siteId: row.siteId,
          planId: null,
          title: 'Re-measure step 4 after the controller reported a step fault',
          instructions: 'The controller logged a step 4 fault twice in a week. Measure the step and check the contactor.',
          checklist: ['capacitance', 'contactor'],
          dueOn: withdrawnDue,
          priority: 'high',
          createdBy: planner,
          createdAt: at(addDays(withdrawnDue, -6), 9, 0),
          assignee: null,
        },
        'queued',
      );
      await transition(ctx, wid, 'queued', 'withdrawn', planner, at(addDays(withdrawnDue, -4), 15, 20), 'The fault was a loose CT lead at the controller; no capacitor work needed.');
      await ctx.db.update(workOrders).set({ state: 'withdrawn', version: 2 }).where(eq(workOrders.id, wid));
      await openOrder(
        ctx,
        {
          kind: 'inspection',
          bankId: row.id,
          siteId: row.siteId,
          planId: null,
          title: 'Clean the panel filters and check the fans',
          instructions: 'The store runs its blast freezers hard in the season: clean the inlet filters and check that both panel fans start with the thermostat.',
          checklist: ['visual', 'bank'],
          dueOn: addDays(today, 26),
          priority: 'low',
          createdBy: planner,
          createdAt: at(addDays(today, -2), 10, 0),
          assignee: null,
        },
        'queued',
      );
    }

    if (story.bank === 'Bank B') {
      const done = addDays(today, -6);
      const start = at(done, 13, 0);
      const id = await openOrder(ctx, inspection(currentDue, technician), 'on-site', start);
      await record(ctx, technician, id, readingsFor(story, bank, { years: 6 / 365, start }, commissionedYearsAgo));
      const failedUnit = bank.steps[1]!.units[0]!;
      await photo(ctx, technician, id, 'Step 2 unit: disconnector operated', '#8A3A2A', { target: 'capacitor-unit', targetId: failedUnit.id });
      await finish(ctx, id, technician, at(done, 15, 40), { state: 'awaiting-review' });
      // The planner turned the replace flag into a corrective order at once, and dispatched it.
      const [flag] = await ctx.db
        .select({ id: flags.id })
        .from(flags)
        .where(and(eq(flags.kind, 'replace'), eq(flags.target, 'capacitor-unit'), eq(flags.targetId, failedUnit.id), eq(flags.state, 'open')));
      if (flag) {
        const { workOrder } = await raiseCorrectiveOrder(ctx, planner, flag.id, { assigneeId: someone(people, 'technician@demo.varden.test').id, dueOn: addDays(today, 4) });
        const raisedAt = at(addDays(today, -5), 9, 10);
        await ctx.db.update(workOrderTransitions).set({ at: raisedAt }).where(eq(workOrderTransitions.workOrderId, workOrder.id));
        await transition(ctx, workOrder.id, 'queued', 'dispatched', planner, at(addDays(today, -5), 9, 25), 'Replacement unit is in the van; fit it and take its baseline readings.');
        await ctx.db.update(workOrders).set({ state: 'dispatched', createdAt: raisedAt, version: 2 }).where(eq(workOrders.id, workOrder.id));
      }
    }

    if (story.bank === 'Pump hall bank') {
      // Last month's inspection: step 2's contactor near its endurance, a blown fuse in step 3.
      const done = addDays(currentDue, -3);
      const start = at(done, 7, 45);
      const id = await openOrder(ctx, inspection(currentDue, technician), 'on-site', start);
      await record(ctx, technician, id, readingsFor(story, bank, { years: yearsBefore(done, today), start, blownFuseStep: 3 }, commissionedYearsAgo));
      await photo(ctx, technician, id, 'Step 3 fuses, L2 open', '#4B5867', { target: 'fuse-set', targetId: bank.steps[2]!.fuseSet!.id });
      await finish(ctx, id, technician, at(done, 11, 5), { state: 'sealed', by: amadou, at: at(addDays(done, 1), 16, 0) });
      // The blown fuse's corrective order: the technician is on site with it now.
      const [flag] = await ctx.db
        .select({ id: flags.id })
        .from(flags)
        .where(and(eq(flags.kind, 'blown-fuse'), eq(flags.bankId, row.id), eq(flags.state, 'open')));
      if (flag) {
        const { workOrder } = await raiseCorrectiveOrder(ctx, planner, flag.id, { assigneeId: technician.id, dueOn: addDays(today, 2), priority: 'high' });
        const raisedAt = at(addDays(done, 2), 8, 30);
        // On site since an hour and a half before the seed runs, whatever its hour (a reading may never be dated ahead).
        const onSiteAt = new Date(Date.now() - 90 * 60_000);
        await ctx.db.update(workOrderTransitions).set({ at: raisedAt }).where(eq(workOrderTransitions.workOrderId, workOrder.id));
        await transition(ctx, workOrder.id, 'queued', 'dispatched', planner, at(addDays(done, 2), 8, 45));
        await transition(ctx, workOrder.id, 'dispatched', 'on-site', technician, onSiteAt);
        await ctx.db
          .update(workOrders)
          .set({ state: 'on-site', createdAt: raisedAt, safetyAcknowledgedAt: onSiteAt, safetyAcknowledgedById: technician.id, version: 3 })
          .where(eq(workOrders.id, workOrder.id));
        await record(ctx, technician, workOrder.id, readingsFor(story, bank, { years: 0, start: new Date(onSiteAt.getTime() + 15 * 60_000), unitsOnly: [3], fuseSetsOnly: [3] }, commissionedYearsAgo));
      }
      // A quarterly check by hand, dispatched for next week.
      await openOrder(
        ctx,
        {
          kind: 'inspection',
          bankId: row.id,
          siteId: row.siteId,
          planId: null,
          title: 'Quarterly visual and controller check',
          instructions: 'Look over the panel, read the controller’s alarms and PF, and check the step 2 contactor’s counter.',
          checklist: ['visual', 'contactor', 'bank'],
          dueOn: addDays(today, 8),
          createdBy: planner,
          createdAt: at(addDays(today, -5), 11, 0),
          assignee: someone(people, 'bex.ardalan@demo.varden.test'),
          dispatchedAt: at(addDays(today, -4), 9, 0),
        },
        'dispatched',
      );
    }

    if (story.bank === 'Extruder bank') {
      const done = addDays(today, -3);
      const start = at(done, 14, 20);
      const id = await openOrder(ctx, inspection(currentDue, technician), 'on-site', start);
      await record(ctx, technician, id, readingsFor(story, bank, { years: 3 / 365, start }, commissionedYearsAgo));
      await photo(ctx, technician, id, 'Step 5 unit terminals', '#3D5A6B', { target: 'capacitor-unit', targetId: bank.steps[4]!.units[0]!.id });
      await finish(ctx, id, technician, at(done, 17, 0), {
        state: 'sent-back',
        by: henrike,
        at: at(addDays(done, 1), 9, 15),
        reason: 'Step 5’s unit reads about 9 % unbalanced. Re-measure it with a second meter before we accept the result, and check the terminal torque.',
      });
      await openOrder(
        ctx,
        {
          kind: 'inspection',
          bankId: row.id,
          siteId: row.siteId,
          planId: null,
          title: 'Thermography at load (yearly)',
          instructions: 'Infrared survey of the bank with the extruders running, at 40 % of normal load or more; record the load.',
          checklist: ['case-temperature', 'visual', 'bank', 'photos'],
          dueOn: addDays(today, 20),
          createdBy: planner,
          createdAt: at(addDays(today, -2), 14, 0),
          assignee: null,
        },
        'queued',
      );
    }
  }
  // A flag is raised when its reading arrives; the seeded readings arrive all at once, so each
  // flag takes the time its reading was taken, as it would have had on the day.
  await ctx.db.execute(sql`update flags f join readings r on r.id = f.reading_id set f.raised_at = r.recorded_at`);
}
