import {
  boolean,
  date,
  double,
  index,
  int,
  json,
  mysqlEnum,
  mysqlTable,
  smallint,
  text,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { bands, flagStates, priorities, workOrderKinds, workOrderStates } from '@varden/schemas';
import { at, createdAt, id, ref, updatedAt } from './columns';
import { users } from './access';
import { banks, capacitorUnits, sites } from './register';

/**
 * Work: inspection plans, work orders with their transitions, readings with their evaluations,
 * flags, photos. State names are Varden's own (docs/glossary.md).
 */


export const inspectionPlans = mysqlTable(
  'inspection_plans',
  {
    id: id(),
    bankId: ref('bank_id')
      .notNull()
      .references(() => banks.id),
    name: varchar('name', { length: 120 }).notNull(),
    intervalMonths: smallint('interval_months').notNull(),
    /** Days before the due date that the order is created. */
    leadDays: smallint('lead_days').notNull().default(14),
    /** The readings the checklist asks for, e.g. ["capacitance", "contactor", "fuses"]. */
    checklist: json('checklist').$type<string[]>().notNull(),
    nextDueOn: date('next_due_on', { mode: 'string' }).notNull(),
    active: boolean('active').notNull().default(true),
    version: int('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('inspection_plans_next_due').on(t.active, t.nextDueOn)],
);

export const workOrders = mysqlTable(
  'work_orders',
  {
    id: id(),
    kind: mysqlEnum('kind', workOrderKinds).notNull(),
    siteId: ref('site_id')
      .notNull()
      .references(() => sites.id),
    bankId: ref('bank_id')
      .notNull()
      .references(() => banks.id),
    planId: ref('plan_id').references(() => inspectionPlans.id),
    /** The flag a corrective order was raised from. */
    flagId: ref('flag_id'),
    title: varchar('title', { length: 200 }).notNull(),
    instructions: text('instructions').notNull(),
    checklist: json('checklist').$type<string[]>().notNull(),
    dueOn: date('due_on', { mode: 'string' }).notNull(),
    priority: mysqlEnum('priority', priorities).notNull().default('normal'),
    assigneeId: ref('assignee_id').references(() => users.id),
    state: mysqlEnum('state', workOrderStates).notNull().default('queued'),
    /** True once sealed (signed off); a database trigger refuses every later change. */
    locked: boolean('locked').notNull().default(false),
    safetyAcknowledgedAt: at('safety_acknowledged_at'),
    safetyAcknowledgedById: ref('safety_acknowledged_by_id').references(() => users.id),
    submittedAt: at('submitted_at'),
    signedAt: at('signed_at'),
    signedById: ref('signed_by_id').references(() => users.id),
    signedByName: varchar('signed_by_name', { length: 200 }),
    signatureMeaning: varchar('signature_meaning', { length: 400 }),
    createdById: ref('created_by_id').references(() => users.id),
    version: int('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    // A plan creates at most one order per due date, whatever the number of scheduler instances.
    uniqueIndex('work_orders_plan_due').on(t.planId, t.dueOn),
    index('work_orders_state_due').on(t.state, t.dueOn),
    index('work_orders_assignee_due').on(t.assigneeId, t.dueOn),
    index('work_orders_site_due').on(t.siteId, t.dueOn),
    // A site's list filtered by state, and its count, read only the rows they answer with.
    index('work_orders_site_state_due').on(t.siteId, t.state, t.dueOn),
    index('work_orders_bank').on(t.bankId),
  ],
);

export const workOrderTransitions = mysqlTable(
  'work_order_transitions',
  {
    id: id(),
    workOrderId: ref('work_order_id')
      .notNull()
      .references(() => workOrders.id),
    fromState: mysqlEnum('from_state', workOrderStates),
    toState: mysqlEnum('to_state', workOrderStates).notNull(),
    actorId: ref('actor_id').references(() => users.id),
    comment: varchar('comment', { length: 1000 }).notNull().default(''),
    at: at('at').notNull(),
  },
  (t) => [index('work_order_transitions_order').on(t.workOrderId, t.at)],
);

const readingTargets = ['capacitor-unit', 'contactor', 'reactor', 'fuse-set', 'bank'] as const;

export const readings = mysqlTable(
  'readings',
  {
    id: id(),
    workOrderId: ref('work_order_id')
      .notNull()
      .references(() => workOrders.id),
    /** Sent by the phone with every write; a retry with the same key returns the stored reading. */
    idempotencyKey: varchar('idempotency_key', { length: 64 }).notNull(),
    target: mysqlEnum('target', readingTargets).notNull(),
    targetId: ref('target_id').notNull(),
    /** What the technician entered, as validated by the shared schema. */
    input: json('input').$type<Record<string, unknown>>().notNull(),
    /** What packages/engineering made of it, with the version that computed it. */
    evaluation: json('evaluation').$type<Record<string, unknown>>().notNull(),
    engineeringVersion: varchar('engineering_version', { length: 20 }).notNull(),
    band: mysqlEnum('band', bands),
    deviationPct: double('deviation_pct'),
    recordedById: ref('recorded_by_id')
      .notNull()
      .references(() => users.id),
    recordedAt: at('recorded_at').notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('readings_idempotency').on(t.idempotencyKey),
    index('readings_order').on(t.workOrderId),
    // deviation_pct rides along so a unit's drift is fitted from the index alone, never the wide rows.
    index('readings_target').on(t.target, t.targetId, t.recordedAt, t.deviationPct),
  ],
);

/** The newest evaluation of each capacitor unit, so health pages never scan the history. */
export const unitLatestEvaluations = mysqlTable('unit_latest_evaluations', {
  unitId: ref('unit_id')
    .primaryKey()
    .references(() => capacitorUnits.id),
  readingId: ref('reading_id')
    .notNull()
    .references(() => readings.id),
  band: mysqlEnum('band', bands).notNull(),
  deviationPct: double('deviation_pct').notNull(),
  kvarAtRated: double('kvar_at_rated').notNull(),
  legsUF: json('legs_uf').$type<number[]>().notNull(),
  recordedAt: at('recorded_at').notNull(),
  /**
   * The unit's drift fitted when this reading was stored (projectDrift over the readings of the
   * five years before it), so the fleet's projected replacements never read the history. Both
   * null with fewer than two readings; replace_by also null when the unit is not losing
   * capacitance.
   */
  driftRatePctPerYear: double('drift_rate_pct_per_year'),
  replaceBy: date('replace_by', { mode: 'string' }),
  /**
   * The points that drift was fitted over, [epoch milliseconds, deviation %] oldest first: the
   * unit's next reading fits its drift from these and itself, never reading the history. Null
   * only on a row written without them (the reading then reads the history once).
   */
  driftPoints: json('drift_points').$type<Array<[number, number]>>(),
}, (t) => [index('unit_latest_evaluations_replace_by').on(t.replaceBy)]);

export const flagKinds = [
  'replace',
  'watch',
  'unbalance',
  'remeasure',
  'tuning-drift',
  'contactor-endurance',
  'case-temperature',
  'blown-fuse',
] as const;

export const flags = mysqlTable(
  'flags',
  {
    id: id(),
    kind: mysqlEnum('kind', flagKinds).notNull(),
    severity: mysqlEnum('severity', ['advisory', 'action']).notNull(),
    siteId: ref('site_id')
      .notNull()
      .references(() => sites.id),
    bankId: ref('bank_id')
      .notNull()
      .references(() => banks.id),
    target: mysqlEnum('target', readingTargets).notNull(),
    targetId: ref('target_id').notNull(),
    readingId: ref('reading_id').references(() => readings.id),
    message: varchar('message', { length: 500 }).notNull(),
    state: mysqlEnum('state', flagStates).notNull().default('open'),
    correctiveOrderId: ref('corrective_order_id').references(() => workOrders.id),
    raisedAt: at('raised_at').notNull(),
    clearedAt: at('cleared_at'),
  },
  (t) => [index('flags_state').on(t.state, t.raisedAt), index('flags_target').on(t.target, t.targetId)],
);

export const photos = mysqlTable(
  'photos',
  {
    id: id(),
    workOrderId: ref('work_order_id')
      .notNull()
      .references(() => workOrders.id),
    readingId: ref('reading_id').references(() => readings.id),
    target: mysqlEnum('target', readingTargets),
    targetId: ref('target_id'),
    idempotencyKey: varchar('idempotency_key', { length: 64 }).notNull(),
    caption: varchar('caption', { length: 300 }).notNull().default(''),
    displayKey: varchar('display_key', { length: 200 }).notNull(),
    thumbnailKey: varchar('thumbnail_key', { length: 200 }).notNull(),
    widthPx: int('width_px').notNull(),
    heightPx: int('height_px').notNull(),
    bytes: int('bytes').notNull(),
    takenById: ref('taken_by_id')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('photos_idempotency').on(t.idempotencyKey), index('photos_order').on(t.workOrderId)],
);
