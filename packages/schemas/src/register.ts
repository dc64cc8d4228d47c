import { z } from 'zod';
import { isoDate, listQuery, patchOf, positive, version } from './common';

// Contracts for the register: sites, banks, steps, capacitor units, contactors, reactors, fuse sets.
// The web forms and the API validate with the same schemas.

const text = (max: number) => z.string().trim().max(max, `At most ${max} characters`);
const name = (max: number) => z.string().trim().min(1, 'Required').max(max, `At most ${max} characters`);
const powerFactor = z
  .number({ error: 'Enter a power factor' })
  .gt(0, 'A power factor is above 0')
  .max(1, 'A power factor is at most 1');
const frequencyHz = z.union([z.literal(50), z.literal(60)], { error: 'Network frequency is 50 or 60 Hz' });

export const tariffBases = ['pf-threshold', 'tan-phi-limit'] as const;

const siteFields = z.object({
  name: name(160),
  address: text(400).default(''),
  voltageV: positive('Network voltage').max(36_000, 'Varden covers networks up to 36 kV'),
  frequencyHz,
  transformerKva: positive('Transformer rating').max(100_000, 'At most 100,000 kVA'),
  transformerImpedancePct: positive('Transformer impedance').max(25, 'Impedance is at most 25 %'),
  utilityShortCircuitKva: positive('Utility short-circuit power').nullable().default(null),
  targetPf: powerFactor,
  tariffBasis: z.enum(tariffBases, { error: 'Choose a PF threshold or a tan φ limit' }),
  /** PF threshold (0–1] or tan φ limit (≥ 0) depending on tariffBasis. */
  tariffLimit: z.number({ error: 'Enter the tariff limit' }).min(0, 'The tariff limit is not negative').max(5, 'At most 5'),
  pricePerKvarh: z.number({ error: 'Enter a price (0 when not charged)' }).min(0, 'A price is not negative').max(100),
  currency: z
    .string()
    .trim()
    .regex(/^[A-Z]{3}$/, 'A three-letter currency code such as EUR or USD')
    .default('EUR'),
  timeZone: text(64).min(1).default('UTC'),
  plannedLoadKw: positive('Planned load').nullable().default(null),
  plannedLoadPf: powerFactor.nullable().default(null),
});

const refineTariff = <T extends { tariffBasis?: string; tariffLimit?: number }>(v: T, ctx: z.RefinementCtx) => {
  if (v.tariffBasis === 'pf-threshold' && v.tariffLimit !== undefined && (v.tariffLimit <= 0 || v.tariffLimit > 1)) {
    ctx.addIssue({ code: 'custom', path: ['tariffLimit'], message: 'A PF threshold is above 0 and at most 1' });
  }
};

export const siteCreate = siteFields.strict().superRefine(refineTariff);
export const siteUpdate = patchOf(siteFields).extend({ version, retired: z.boolean().optional() }).strict().superRefine(refineTariff);
export type SiteCreate = z.input<typeof siteCreate>;
export type SiteUpdate = z.input<typeof siteUpdate>;

export const site = siteFields.extend({
  id: z.number(),
  bankCount: z.number(),
  retiredAt: z.string().nullable(),
  version: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Site = z.infer<typeof site>;

export const siteListQuery = listQuery(['name', '-name', 'voltageV', '-voltageV', 'createdAt', '-createdAt'] as const, 'name').extend({
  includeRetired: z.enum(['true', 'false']).default('false'),
});

const bankFields = z.object({
  siteId: z.number().int().positive(),
  name: name(120),
  location: text(200).default(''),
  controllerTargetPf: powerFactor.nullable().default(null),
  detuned: z.boolean().default(false),
  detuningFactor: z
    .number()
    .gt(0, 'A detuning factor is above 0 (e.g. 0.07 for 7 %)')
    .lt(0.5, 'A detuning factor is below 0.5 (e.g. 0.07 for 7 %)')
    .nullable()
    .default(null),
  commissionedOn: isoDate.nullable().default(null),
});
const refineDetuning = <T extends { detuned?: boolean; detuningFactor?: number | null }>(v: T, ctx: z.RefinementCtx) => {
  if (v.detuned === true && (v.detuningFactor === null || v.detuningFactor === undefined)) {
    ctx.addIssue({ code: 'custom', path: ['detuningFactor'], message: 'A detuned bank needs its detuning factor' });
  }
  if (v.detuned === false && v.detuningFactor !== null && v.detuningFactor !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['detuningFactor'], message: 'Leave empty for a bank that is not detuned' });
  }
};
export const bankCreate = bankFields.strict().superRefine(refineDetuning);
export const bankUpdate = patchOf(bankFields.omit({ siteId: true })).extend({ version, retired: z.boolean().optional() }).strict().superRefine(refineDetuning);
export type BankCreate = z.input<typeof bankCreate>;
export const bank = bankFields.extend({
  id: z.number(),
  siteName: z.string(),
  stepCount: z.number(),
  retiredAt: z.string().nullable(),
  version: z.number(),
});
export type Bank = z.infer<typeof bank>;
export const bankListQuery = listQuery(['name', '-name', 'createdAt', '-createdAt'] as const, 'name').extend({
  siteId: z.coerce.number().int().positive().optional(),
});

const stepFields = z.object({
  bankId: z.number().int().positive(),
  number: z.number().int().min(1, 'Steps are numbered from 1').max(64, 'At most 64 steps'),
  ratedKvar: positive('Rated output').max(5000, 'At most 5000 kvar per step'),
});
export const stepCreate = stepFields.strict();
export const stepUpdate = patchOf(stepFields.omit({ bankId: true })).extend({ version, retired: z.boolean().optional() }).strict();
export const step = stepFields.extend({ id: z.number(), retiredAt: z.string().nullable(), version: z.number() });
export type Step = z.infer<typeof step>;
export const stepListQuery = listQuery(['number', '-number'] as const, 'number').extend({
  bankId: z.coerce.number().int().positive().optional(),
});

export const connections = ['delta', 'star', 'single-phase'] as const;
export const tolerancePresets = ['iec', 'ieee', 'custom'] as const;

const unitFields = z.object({
  stepId: z.number().int().positive(),
  position: z.number().int().min(1, 'Positions are numbered from 1').max(32, 'At most 32 units in a step'),
  nameplateKvar: positive('Nameplate output').max(2000, 'At most 2000 kvar per unit'),
  nameplateVoltageV: positive('Rated voltage').max(36_000, 'At most 36 kV'),
  nameplateFrequencyHz: frequencyHz,
  connection: z.enum(connections, { error: 'Connection is delta, star or single-phase' }),
  /** Per delta leg, per star phase, or the single element; computed from the nameplate when omitted. */
  capacitanceUF: positive('Capacitance').max(1_000_000).nullable().default(null),
  tolerancePreset: z.enum(tolerancePresets).default('iec'),
  toleranceMinusPct: z.number().min(-50).max(0, 'The lower tolerance is 0 or below').optional(),
  tolerancePlusPct: z.number().min(0, 'The upper tolerance is 0 or above').max(50).optional(),
  temperatureCategory: text(16).default(''),
  dischargeTimeS: z.number().int().min(1, 'At least 1 s').max(3600, 'At most 3600 s').default(180),
  serial: text(80).default(''),
  maker: text(120).default(''),
  model: text(120).default(''),
  installedOn: isoDate.nullable().default(null),
});
export const unitCreate = unitFields.strict();
export const unitUpdate = patchOf(unitFields.omit({ stepId: true })).extend({ version }).strict();
export type UnitCreate = z.input<typeof unitCreate>;
export const unit = unitFields.extend({
  id: z.number(),
  capacitanceUF: z.number(),
  capacitanceGiven: z.boolean(),
  ratedCapacitanceUF: z.number(),
  toleranceMinusPct: z.number(),
  tolerancePlusPct: z.number(),
  removedOn: z.string().nullable(),
  removalReason: z.string().nullable(),
  replacedById: z.number().nullable(),
  warnings: z.array(z.string()),
  version: z.number(),
});
export type Unit = z.infer<typeof unit>;
export const unitListQuery = listQuery(['position', '-position', 'serial', '-serial', 'installedOn', '-installedOn'] as const, 'position').extend({
  stepId: z.coerce.number().int().positive().optional(),
  bankId: z.coerce.number().int().positive().optional(),
  includeRemoved: z.enum(['true', 'false']).default('false'),
});

/** Replacing a unit: the old one leaves with a date and a reason, the new one takes its position. */
export const unitReplace = z
  .object({
    removedOn: isoDate,
    reason: name(300),
    replacement: unitFields.omit({ stepId: true, position: true }).strict(),
    version,
  })
  .strict();

const contactorFields = z.object({
  stepId: z.number().int().positive(),
  ratedOperations: z.number().int().min(1000, 'At least 1000 operations').max(10_000_000),
  counterAtInstall: z.number().int().min(0, 'A counter is not negative').default(0),
  maker: text(120).default(''),
  model: text(120).default(''),
  installedOn: isoDate.nullable().default(null),
});
export const contactorCreate = contactorFields.strict();
export const contactorUpdate = patchOf(contactorFields.omit({ stepId: true })).extend({ version, removedOn: isoDate.nullable().optional() }).strict();
export const contactor = contactorFields.extend({ id: z.number(), removedOn: z.string().nullable(), version: z.number() });

const reactorFields = z.object({
  stepId: z.number().int().positive(),
  inductanceMH: positive('Inductance').max(1000),
  ratedCurrentA: positive('Rated current').max(5000),
  detuningFactor: z.number().gt(0, 'Above 0 (e.g. 0.07)').lt(0.5, 'Below 0.5 (e.g. 0.07)'),
  maker: text(120).default(''),
  model: text(120).default(''),
  installedOn: isoDate.nullable().default(null),
});
export const reactorCreate = reactorFields.strict();
export const reactorUpdate = patchOf(reactorFields.omit({ stepId: true })).extend({ version, removedOn: isoDate.nullable().optional() }).strict();
export const reactor = reactorFields.extend({ id: z.number(), removedOn: z.string().nullable(), version: z.number() });

const fuseSetFields = z.object({
  stepId: z.number().int().positive(),
  ratedCurrentA: positive('Rated current').max(5000),
  type: text(40).min(1).default('gG'),
  installedOn: isoDate.nullable().default(null),
});
export const fuseSetCreate = fuseSetFields.strict();
export const fuseSetUpdate = patchOf(fuseSetFields.omit({ stepId: true })).extend({ version, removedOn: isoDate.nullable().optional() }).strict();
export const fuseSet = fuseSetFields.extend({ id: z.number(), removedOn: z.string().nullable(), version: z.number() });

export const componentListQuery = listQuery(['id', '-id'] as const, 'id').extend({
  stepId: z.coerce.number().int().positive().optional(),
  bankId: z.coerce.number().int().positive().optional(),
});

/** CSV import of a bank's register: a preview (dryRun) or the import itself, all or nothing. */
export const registerImportRequest = z
  .object({
    csv: z.string().min(1, 'The file is empty').max(900_000, 'The file is larger than 900 kB'),
    dryRun: z.boolean().default(true),
  })
  .strict();
export const registerImportColumns = [
  'step',
  'step_kvar',
  'position',
  'kvar',
  'voltage_v',
  'frequency_hz',
  'connection',
  'capacitance_uf',
  'serial',
  'maker',
  'model',
  'installed_on',
] as const;
export const registerImportRow = z.object({ line: z.number(), errors: z.array(z.string()) });
export const registerImportResponse = z.object({
  rows: z.array(registerImportRow),
  created: z.object({ steps: z.number(), units: z.number() }),
  dryRun: z.boolean(),
});
export type RegisterImportResponse = z.infer<typeof registerImportResponse>;
