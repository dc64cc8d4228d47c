import { z } from 'zod';
import { listQuery } from './common';

// Contracts for what a technician records and what the server makes of it. Every write carries
// an idempotency key made on the phone, so a retry after a lost answer stores nothing twice.

const idempotencyKey = z
  .string({ error: 'Each reading carries an idempotency key' })
  .regex(/^[A-Za-z0-9_-]{16,64}$/, 'The idempotency key is 16–64 letters, digits, - or _');
const finite = (what: string) => z.number({ error: `${what}: enter a number` });
const positive = (what: string) => finite(what).gt(0, `${what} must be above 0`);
const triple = (what: string) =>
  z.tuple([positive(`${what} 1`), positive(`${what} 2`), positive(`${what} 3`)], { error: `${what}: three values` });
const notes = z.string().trim().max(2000, 'At most 2000 characters').default('');

export const fieldMethods = ['open-pairs', 'shorted', 'line-currents', 'per-element'] as const;
export type FieldMethod = (typeof fieldMethods)[number];

export const visualChecks = z
  .object({
    bulging: z.boolean().default(false),
    disconnectorOperated: z.boolean().default(false),
    leakage: z.boolean().default(false),
    discoloration: z.boolean().default(false),
    hotTerminals: z.boolean().default(false),
  })
  .strict();

const base = {
  idempotencyKey,
  notes,
  /** The technician confirms a value the server found implausible (the warning told them why). */
  confirmImplausible: z.boolean().default(false),
  /**
   * When the reading was taken on the phone, which may send it much later (no signal in the
   * switch-room). The server uses its own clock when absent and refuses a time in the future.
   */
  recordedAt: z.iso.datetime({ offset: true, error: 'A date and time such as 2026-05-04T09:30:00Z' }).optional(),
};

export const capacitorReadingInput = z
  .object({
    ...base,
    target: z.literal('capacitor-unit'),
    targetId: z.number().int().positive(),
    method: z.enum(fieldMethods, { error: 'Choose the measurement method' }),
    /** open-pairs: M12, M23, M31; shorted: M1, M2, M3 (µF). */
    readingsUF: triple('Reading').optional(),
    /** per-element: one value for a single-phase unit or three legs C12, C23, C31 (µF). */
    elementsUF: z.array(positive('Capacitance')).min(1).max(3).optional(),
    /** line-currents: I1, I2, I3 (A) at the measured voltage and frequency. */
    currentsA: triple('Current').optional(),
    measuredVoltageV: positive('Measured voltage').max(36_000).optional(),
    measuredFrequencyHz: positive('Measured frequency').min(40, 'Between 40 and 70 Hz').max(70, 'Between 40 and 70 Hz').optional(),
    voltageThdPct: finite('Voltage THD').min(0).max(100).optional(),
    caseTemperatureC: finite('Case temperature').min(-40, 'At least −40 °C').max(150, 'At most 150 °C').optional(),
    ambientTemperatureC: finite('Ambient temperature').min(-40).max(70).optional(),
    visual: visualChecks.default({
      bulging: false,
      disconnectorOperated: false,
      leakage: false,
      discoloration: false,
      hotTerminals: false,
    }),
    dischargeResistorOhm: positive('Discharge resistance').optional(),
    insulationResistanceMOhm: positive('Insulation resistance').optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    const need = (field: 'readingsUF' | 'elementsUF' | 'currentsA' | 'measuredVoltageV' | 'measuredFrequencyHz', message: string) => {
      if (v[field] === undefined) ctx.addIssue({ code: 'custom', path: [field], message });
    };
    if (v.method === 'open-pairs' || v.method === 'shorted') need('readingsUF', 'Enter the three readings');
    if (v.method === 'per-element') need('elementsUF', 'Enter the capacitance of each element');
    if (v.method === 'line-currents') {
      need('currentsA', 'Enter the three line currents');
      need('measuredVoltageV', 'Enter the voltage measured with the currents');
      need('measuredFrequencyHz', 'Enter the frequency measured with the currents');
    }
  });

export const contactorReadingInput = z
  .object({
    ...base,
    target: z.literal('contactor'),
    targetId: z.number().int().positive(),
    operationsCounter: z.number().int().min(0, 'A counter is not negative'),
    contactCondition: z.enum(['good', 'worn', 'burnt'], { error: 'Choose the contact condition' }),
    prechargeResistorsOhm: z.array(positive('Pre-charge resistance')).max(3).default([]),
  })
  .strict();

export const reactorReadingInput = z
  .object({
    ...base,
    target: z.literal('reactor'),
    targetId: z.number().int().positive(),
    inductanceMH: triple('Inductance').optional(),
    thermalSwitchClosed: z.boolean({ error: 'Record the thermal switch' }),
    temperatureC: finite('Reactor temperature').min(-40).max(200).optional(),
  })
  .strict();

export const fuseReadingInput = z
  .object({
    ...base,
    target: z.literal('fuse-set'),
    targetId: z.number().int().positive(),
    /** Continuity of each of the three fuses. */
    continuity: z.tuple([z.boolean(), z.boolean(), z.boolean()]),
    ratingMatchesRegister: z.boolean(),
  })
  .strict();

export const bankReadingInput = z
  .object({
    ...base,
    target: z.literal('bank'),
    targetId: z.number().int().positive(),
    controllerPf: finite('Controller PF').min(-1, 'Between −1 and 1').max(1, 'Between −1 and 1').optional(),
    /** The site's load when the controller's PF was read, if the controller shows it. */
    loadKw: positive('Load').optional(),
    voltageThdPct: finite('Voltage THD').min(0).max(100).optional(),
    cleaningDone: z.boolean().default(false),
    filtersDone: z.boolean().default(false),
  })
  .strict();

export const readingInput = z.discriminatedUnion('target', [
  capacitorReadingInput,
  contactorReadingInput,
  reactorReadingInput,
  fuseReadingInput,
  bankReadingInput,
]);
export type ReadingInput = z.input<typeof readingInput>;

export const bands = ['healthy', 'watch', 'replace', 'remeasure'] as const;

export const raisedFlag = z.object({
  kind: z.string(),
  severity: z.enum(['advisory', 'action']),
  message: z.string(),
  /** True when an open flag of this kind on this target already existed, so no new one was raised. */
  alreadyOpen: z.boolean().optional(),
});

export const reading = z.object({
  id: z.number(),
  workOrderId: z.number(),
  target: z.enum(['capacitor-unit', 'contactor', 'reactor', 'fuse-set', 'bank']),
  targetId: z.number(),
  /** The key the phone sent it with: a retry with the same key answers this same reading. */
  idempotencyKey: z.string(),
  input: z.record(z.string(), z.unknown()),
  /** For a capacitor: legsUF, kvarAtRated, deviationPct, legDeviationsPct, unbalanceRatio, band, reasons. */
  evaluation: z.record(z.string(), z.unknown()),
  band: z.enum(bands).nullable(),
  /** Capacitor units: deviation of kvar at rated conditions from nameplate, %. */
  deviationPct: z.number().nullable(),
  engineeringVersion: z.string(),
  flags: z.array(raisedFlag),
  recordedByName: z.string(),
  recordedAt: z.string(),
});
export type Reading = z.infer<typeof reading>;

/** One reading in a capacitor unit's history: the rows of its table and the points of its trend chart. */
export const unitReading = z.object({
  id: z.number(),
  recordedAt: z.string(),
  workOrderId: z.number(),
  workOrderState: z.string(),
  method: z.enum(fieldMethods),
  legsUF: z.array(z.number()),
  kvarAtRated: z.number(),
  deviationPct: z.number(),
  band: z.enum(bands),
});
export type UnitReading = z.infer<typeof unitReading>;
export const unitReadingListQuery = listQuery(['-recordedAt', 'recordedAt'] as const, '-recordedAt');

export const photo = z.object({
  id: z.number(),
  workOrderId: z.number(),
  readingId: z.number().nullable(),
  target: z.string().nullable(),
  targetId: z.number().nullable(),
  caption: z.string(),
  widthPx: z.number(),
  heightPx: z.number(),
  displayUrl: z.string(),
  thumbnailUrl: z.string(),
  createdAt: z.string(),
});
export type Photo = z.infer<typeof photo>;

export const photoUploadFields = z
  .object({
    idempotencyKey,
    caption: z.string().trim().max(300).default(''),
    readingId: z.coerce.number().int().positive().optional(),
    target: z.enum(['capacitor-unit', 'contactor', 'reactor', 'fuse-set', 'bank']).optional(),
    targetId: z.coerce.number().int().positive().optional(),
  })
  .strict();

export const flagStates = ['open', 'in-hand', 'cleared'] as const;
export const flag = z.object({
  id: z.number(),
  kind: z.string(),
  severity: z.enum(['advisory', 'action']),
  siteId: z.number(),
  siteName: z.string(),
  bankId: z.number(),
  bankName: z.string(),
  target: z.string(),
  targetId: z.number(),
  readingId: z.number().nullable(),
  message: z.string(),
  state: z.enum(flagStates),
  correctiveOrderId: z.number().nullable(),
  raisedAt: z.string(),
});
export type Flag = z.infer<typeof flag>;
