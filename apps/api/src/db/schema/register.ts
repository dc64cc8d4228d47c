import { sql } from 'drizzle-orm';
import {
  boolean,
  date,
  decimal,
  double,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  smallint,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref, updatedAt } from './columns';

/**
 * The register: site → bank → step → components. Nothing with history is deleted: a record is
 * retired (retired_at) or a unit removed (removed_on), so every reading keeps what it refers to.
 */

export const sites = mysqlTable(
  'sites',
  {
    id: id(),
    name: varchar('name', { length: 160 }).notNull(),
    address: varchar('address', { length: 400 }).notNull().default(''),
    voltageV: double('voltage_v').notNull(),
    frequencyHz: smallint('frequency_hz').notNull(),
    transformerKva: double('transformer_kva').notNull(),
    transformerImpedancePct: double('transformer_impedance_pct').notNull(),
    utilityShortCircuitKva: double('utility_short_circuit_kva'),
    targetPf: decimal('target_pf', { precision: 4, scale: 3, mode: 'number' }).notNull(),
    tariffBasis: mysqlEnum('tariff_basis', ['pf-threshold', 'tan-phi-limit']).notNull(),
    /** The PF below which, or the tan φ above which, reactive energy is charged. */
    tariffLimit: decimal('tariff_limit', { precision: 5, scale: 3, mode: 'number' }).notNull(),
    pricePerKvarh: decimal('price_per_kvarh', { precision: 10, scale: 5, mode: 'number' }).notNull().default(0),
    currency: varchar('currency', { length: 3 }).notNull().default('EUR'),
    timeZone: varchar('time_zone', { length: 64 }).notNull().default('UTC'),
    /** The site's load entered by a planner, used when no controller reading is recorded. */
    plannedLoadKw: double('planned_load_kw'),
    plannedLoadPf: decimal('planned_load_pf', { precision: 4, scale: 3, mode: 'number' }),
    retiredAt: at('retired_at'),
    version: int('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('sites_name').on(t.name)],
);

export const banks = mysqlTable(
  'banks',
  {
    id: id(),
    siteId: ref('site_id')
      .notNull()
      .references(() => sites.id),
    name: varchar('name', { length: 120 }).notNull(),
    location: varchar('location', { length: 200 }).notNull().default(''),
    controllerTargetPf: decimal('controller_target_pf', { precision: 4, scale: 3, mode: 'number' }),
    detuned: boolean('detuned').notNull().default(false),
    /** X_L / X_C at the fundamental, e.g. 0.07; null when the bank is not detuned. */
    detuningFactor: decimal('detuning_factor', { precision: 6, scale: 4, mode: 'number' }),
    commissionedOn: date('commissioned_on', { mode: 'string' }),
    retiredAt: at('retired_at'),
    version: int('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('banks_site_name').on(t.siteId, t.name)],
);

export const steps = mysqlTable(
  'steps',
  {
    id: id(),
    bankId: ref('bank_id')
      .notNull()
      .references(() => banks.id),
    number: smallint('number').notNull(),
    /** Rated output at network voltage (for a detuned step, the effective output with its reactor). */
    ratedKvar: double('rated_kvar').notNull(),
    retiredAt: at('retired_at'),
    version: int('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('steps_bank_number').on(t.bankId, t.number)],
);

export const capacitorUnits = mysqlTable(
  'capacitor_units',
  {
    id: id(),
    stepId: ref('step_id')
      .notNull()
      .references(() => steps.id),
    position: smallint('position').notNull(),
    nameplateKvar: double('nameplate_kvar').notNull(),
    nameplateVoltageV: double('nameplate_voltage_v').notNull(),
    nameplateFrequencyHz: smallint('nameplate_frequency_hz').notNull(),
    connection: mysqlEnum('connection', ['delta', 'star', 'single-phase']).notNull(),
    /** Per delta leg, per star phase or the single element; computed from the nameplate when not given. */
    capacitanceUF: double('capacitance_uf').notNull(),
    capacitanceGiven: boolean('capacitance_given').notNull().default(false),
    tolerancePreset: mysqlEnum('tolerance_preset', ['iec', 'ieee', 'custom']).notNull().default('iec'),
    toleranceMinusPct: double('tolerance_minus_pct').notNull().default(-5),
    tolerancePlusPct: double('tolerance_plus_pct').notNull().default(10),
    temperatureCategory: varchar('temperature_category', { length: 16 }).notNull().default(''),
    dischargeTimeS: int('discharge_time_s').notNull().default(180),
    serial: varchar('serial', { length: 80 }).notNull().default(''),
    maker: varchar('maker', { length: 120 }).notNull().default(''),
    model: varchar('model', { length: 120 }).notNull().default(''),
    installedOn: date('installed_on', { mode: 'string' }),
    removedOn: date('removed_on', { mode: 'string' }),
    removalReason: varchar('removal_reason', { length: 300 }),
    replacedById: ref('replaced_by_id'),
    /** Equal to position while the unit is in service, null once removed: one unit per position. */
    activePosition: smallint('active_position').generatedAlwaysAs(sql`IF(removed_on IS NULL, position, NULL)`, {
      mode: 'stored',
    }),
    version: int('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('capacitor_units_active_position').on(t.stepId, t.activePosition), index('capacitor_units_step').on(t.stepId)],
);

export const contactors = mysqlTable(
  'contactors',
  {
    id: id(),
    stepId: ref('step_id')
      .notNull()
      .references(() => steps.id),
    ratedOperations: int('rated_operations').notNull(),
    counterAtInstall: int('counter_at_install').notNull().default(0),
    maker: varchar('maker', { length: 120 }).notNull().default(''),
    model: varchar('model', { length: 120 }).notNull().default(''),
    installedOn: date('installed_on', { mode: 'string' }),
    removedOn: date('removed_on', { mode: 'string' }),
    version: int('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('contactors_step').on(t.stepId)],
);

export const reactors = mysqlTable(
  'reactors',
  {
    id: id(),
    stepId: ref('step_id')
      .notNull()
      .references(() => steps.id),
    inductanceMH: double('inductance_mh').notNull(),
    ratedCurrentA: double('rated_current_a').notNull(),
    detuningFactor: decimal('detuning_factor', { precision: 6, scale: 4, mode: 'number' }).notNull(),
    maker: varchar('maker', { length: 120 }).notNull().default(''),
    model: varchar('model', { length: 120 }).notNull().default(''),
    installedOn: date('installed_on', { mode: 'string' }),
    removedOn: date('removed_on', { mode: 'string' }),
    version: int('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('reactors_step').on(t.stepId)],
);

export const fuseSets = mysqlTable(
  'fuse_sets',
  {
    id: id(),
    stepId: ref('step_id')
      .notNull()
      .references(() => steps.id),
    ratedCurrentA: double('rated_current_a').notNull(),
    type: varchar('type', { length: 40 }).notNull().default('gG'),
    installedOn: date('installed_on', { mode: 'string' }),
    removedOn: date('removed_on', { mode: 'string' }),
    version: int('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('fuse_sets_step').on(t.stepId)],
);
