import * as z from 'zod/mini';
import { isoDate, listQuery, patchOf, positive, queryId, recordId, required, text, version } from './common';

// Contracts for the register: sites, banks, steps, capacitor units, contactors, reactors, fuse sets.
// The web forms and the API validate with the same schemas.

const name = required;
const powerFactor = z
  .number({ error: 'Enter a power factor' })
  .check(z.gt(0, 'A power factor is above 0'), z.lte(1, 'A power factor is at most 1'));
/** An optional text with an empty default. */
const textOrEmpty = (max: number) => z._default(text(max), '');
/** A value that may be left out: null by default. */
const orNull = <T extends z.ZodMiniType>(schema: T) => z._default(z.nullable(schema), null as never);
const frequencyHz = z.union([z.literal(50), z.literal(60)], { error: 'Network frequency is 50 or 60 Hz' });

export const tariffBases = ['pf-threshold', 'tan-phi-limit'] as const;

const siteFields = z.object({
  name: name(160),
  address: textOrEmpty(400),
  voltageV: positive('Network voltage').check(z.lte(36_000, 'Varden covers networks up to 36 kV')),
  frequencyHz,
  transformerKva: positive('Transformer rating').check(z.lte(100_000, 'At most 100,000 kVA')),
  transformerImpedancePct: positive('Transformer impedance').check(z.lte(25, 'Impedance is at most 25 %')),
  utilityShortCircuitKva: orNull(positive('Utility short-circuit power')),
  targetPf: powerFactor,
  tariffBasis: z.enum(tariffBases, { error: 'Choose a PF threshold or a tan φ limit' }),
  /** PF threshold (0–1] or tan φ limit (≥ 0) depending on tariffBasis. */
  tariffLimit: z.number({ error: 'Enter the tariff limit' }).check(z.gte(0, 'The tariff limit is not negative'), z.lte(5, 'At most 5')),
  pricePerKvarh: z.number({ error: 'Enter a price (0 when not charged)' }).check(z.gte(0, 'A price is not negative'), z.lte(100)),
  currency: z._default(z.string().check(z.trim(), z.regex(/^[A-Z]{3}$/, 'A three-letter currency code such as EUR or USD')), 'EUR'),
  timeZone: z._default(text(64).check(z.minLength(1)), 'UTC'),
  plannedLoadKw: orNull(positive('Planned load')),
  plannedLoadPf: orNull(powerFactor),
});

const refineTariff = z.superRefine<{ tariffBasis?: string; tariffLimit?: number }>((v, ctx) => {
  if (v.tariffBasis === 'pf-threshold' && v.tariffLimit !== undefined && (v.tariffLimit <= 0 || v.tariffLimit > 1)) {
    ctx.addIssue({ code: 'custom', path: ['tariffLimit'], message: 'A PF threshold is above 0 and at most 1' });
  }
});

export const siteCreate = z.strictObject(siteFields.shape).check(refineTariff);
export const siteUpdate = z.strictObject({ ...patchOf(siteFields), version, retired: z.optional(z.boolean()) }).check(refineTariff);
export type SiteCreate = z.input<typeof siteCreate>;
export type SiteUpdate = z.input<typeof siteUpdate>;

export const site = z.extend(siteFields, {
  id: z.number(),
  bankCount: z.number(),
  retiredAt: z.nullable(z.string()),
  version: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Site = z.infer<typeof site>;

export const siteListQuery = z.extend(listQuery(['name', '-name', 'voltageV', '-voltageV', 'createdAt', '-createdAt'] as const, 'name'), {
  includeRetired: z._default(z.enum(['true', 'false']), 'false'),
});

const bankFields = z.object({
  siteId: recordId,
  name: name(120),
  location: textOrEmpty(200),
  controllerTargetPf: orNull(powerFactor),
  detuned: z._default(z.boolean(), false),
  detuningFactor: orNull(
    z.number().check(z.gt(0, 'A detuning factor is above 0 (e.g. 0.07 for 7 %)'), z.lt(0.5, 'A detuning factor is below 0.5 (e.g. 0.07 for 7 %)')),
  ),
  commissionedOn: orNull(isoDate),
});
const refineDetuning = z.superRefine<{ detuned?: boolean; detuningFactor?: number | null }>((v, ctx) => {
  if (v.detuned === true && (v.detuningFactor === null || v.detuningFactor === undefined)) {
    ctx.addIssue({ code: 'custom', path: ['detuningFactor'], message: 'A detuned bank needs its detuning factor' });
  }
  if (v.detuned === false && v.detuningFactor !== null && v.detuningFactor !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['detuningFactor'], message: 'Leave empty for a bank that is not detuned' });
  }
});
export const bankCreate = z.strictObject(bankFields.shape).check(refineDetuning);
export const bankUpdate = z
  .strictObject({ ...patchOf(z.omit(bankFields, { siteId: true })), version, retired: z.optional(z.boolean()) })
  .check(refineDetuning);
export type BankCreate = z.input<typeof bankCreate>;
export const bank = z.extend(bankFields, {
  id: z.number(),
  siteName: z.string(),
  stepCount: z.number(),
  retiredAt: z.nullable(z.string()),
  version: z.number(),
});
export type Bank = z.infer<typeof bank>;
export const bankListQuery = z.extend(listQuery(['name', '-name', 'createdAt', '-createdAt'] as const, 'name'), {
  siteId: z.optional(queryId),
});

const stepFields = z.object({
  bankId: recordId,
  number: z.number().check(z.int(), z.gte(1, 'Steps are numbered from 1'), z.lte(64, 'At most 64 steps')),
  ratedKvar: positive('Rated output').check(z.lte(5000, 'At most 5000 kvar per step')),
});
export const stepCreate = z.strictObject(stepFields.shape);
export const stepUpdate = z.strictObject({ ...patchOf(z.omit(stepFields, { bankId: true })), version, retired: z.optional(z.boolean()) });
export const step = z.extend(stepFields, { id: z.number(), retiredAt: z.nullable(z.string()), version: z.number() });
export type Step = z.infer<typeof step>;
export const stepListQuery = z.extend(listQuery(['number', '-number'] as const, 'number'), {
  bankId: z.optional(queryId),
});

export const connections = ['delta', 'star', 'single-phase'] as const;
export const tolerancePresets = ['iec', 'ieee', 'custom'] as const;

const unitFields = z.object({
  stepId: recordId,
  position: z.number().check(z.int(), z.gte(1, 'Positions are numbered from 1'), z.lte(32, 'At most 32 units in a step')),
  nameplateKvar: positive('Nameplate output').check(z.lte(2000, 'At most 2000 kvar per unit')),
  nameplateVoltageV: positive('Rated voltage').check(z.lte(36_000, 'At most 36 kV')),
  nameplateFrequencyHz: frequencyHz,
  connection: z.enum(connections, { error: 'Connection is delta, star or single-phase' }),
  /** Per delta leg, per star phase, or the single element; computed from the nameplate when omitted. */
  capacitanceUF: orNull(positive('Capacitance').check(z.lte(1_000_000))),
  tolerancePreset: z._default(z.enum(tolerancePresets), 'iec'),
  toleranceMinusPct: z.optional(z.number().check(z.gte(-50), z.lte(0, 'The lower tolerance is 0 or below'))),
  tolerancePlusPct: z.optional(z.number().check(z.gte(0, 'The upper tolerance is 0 or above'), z.lte(50))),
  temperatureCategory: textOrEmpty(16),
  dischargeTimeS: z._default(z.number().check(z.int(), z.gte(1, 'At least 1 s'), z.lte(3600, 'At most 3600 s')), 180),
  serial: textOrEmpty(80),
  maker: textOrEmpty(120),
  model: textOrEmpty(120),
  installedOn: orNull(isoDate),
});
export const unitCreate = z.strictObject(unitFields.shape);
export const unitUpdate = z.strictObject({ ...patchOf(z.omit(unitFields, { stepId: true })), version });
export type UnitCreate = z.input<typeof unitCreate>;
export const unit = z.extend(unitFields, {
  id: z.number(),
  capacitanceUF: z.number(),
  capacitanceGiven: z.boolean(),
  ratedCapacitanceUF: z.number(),
  toleranceMinusPct: z.number(),
  tolerancePlusPct: z.number(),
  removedOn: z.nullable(z.string()),
  removalReason: z.nullable(z.string()),
  replacedById: z.nullable(z.number()),
  warnings: z.array(z.string()),
  version: z.number(),
});
export type Unit = z.infer<typeof unit>;
export const unitListQuery = z.extend(listQuery(['position', '-position', 'serial', '-serial', 'installedOn', '-installedOn'] as const, 'position'), {
  stepId: z.optional(queryId),
  bankId: z.optional(queryId),
  includeRemoved: z._default(z.enum(['true', 'false']), 'false'),
});

/** Replacing a unit: the old one leaves with a date and a reason, the new one takes its position. */
export const unitReplace = z.strictObject({
  removedOn: isoDate,
  reason: name(300),
  replacement: z.strictObject(z.omit(unitFields, { stepId: true, position: true }).shape),
  version,
});

const contactorFields = z.object({
  stepId: recordId,
  ratedOperations: z.number().check(z.int(), z.gte(1000, 'At least 1000 operations'), z.lte(10_000_000)),
  counterAtInstall: z._default(z.number().check(z.int(), z.gte(0, 'A counter is not negative')), 0),
  maker: textOrEmpty(120),
  model: textOrEmpty(120),
  installedOn: orNull(isoDate),
});
export const contactorCreate = z.strictObject(contactorFields.shape);
export const contactorUpdate = z.strictObject({ ...patchOf(z.omit(contactorFields, { stepId: true })), version, removedOn: z.optional(z.nullable(isoDate)) });
export const contactor = z.extend(contactorFields, { id: z.number(), removedOn: z.nullable(z.string()), version: z.number() });

const reactorFields = z.object({
  stepId: recordId,
  inductanceMH: positive('Inductance').check(z.lte(1000)),
  ratedCurrentA: positive('Rated current').check(z.lte(5000)),
  detuningFactor: z.number().check(z.gt(0, 'Above 0 (e.g. 0.07)'), z.lt(0.5, 'Below 0.5 (e.g. 0.07)')),
  maker: textOrEmpty(120),
  model: textOrEmpty(120),
  installedOn: orNull(isoDate),
});
export const reactorCreate = z.strictObject(reactorFields.shape);
export const reactorUpdate = z.strictObject({ ...patchOf(z.omit(reactorFields, { stepId: true })), version, removedOn: z.optional(z.nullable(isoDate)) });
export const reactor = z.extend(reactorFields, { id: z.number(), removedOn: z.nullable(z.string()), version: z.number() });

const fuseSetFields = z.object({
  stepId: recordId,
  ratedCurrentA: positive('Rated current').check(z.lte(5000)),
  type: z._default(text(40).check(z.minLength(1)), 'gG'),
  installedOn: orNull(isoDate),
});
export const fuseSetCreate = z.strictObject(fuseSetFields.shape);
export const fuseSetUpdate = z.strictObject({ ...patchOf(z.omit(fuseSetFields, { stepId: true })), version, removedOn: z.optional(z.nullable(isoDate)) });
export const fuseSet = z.extend(fuseSetFields, { id: z.number(), removedOn: z.nullable(z.string()), version: z.number() });

export const componentListQuery = z.extend(listQuery(['id', '-id'] as const, 'id'), {
  stepId: z.optional(queryId),
  bankId: z.optional(queryId),
});

/** CSV import of a bank's register: a preview (dryRun) or the import itself, all or nothing. */
export const registerImportRequest = z.strictObject({
  csv: z.string().check(z.minLength(1, 'The file is empty'), z.maxLength(900_000, 'The file is larger than 900 kB')),
  dryRun: z._default(z.boolean(), true),
});
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
