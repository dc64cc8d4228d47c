import * as z from 'zod/mini';
import { queryId, recordId } from './common';
import { fieldMethods } from './readings';

// Contracts for what a technician records. Every write carries an idempotency key made on the
// phone, so a retry after a lost answer stores nothing twice.

const idempotencyKey = z
  .string({ error: 'Each reading carries an idempotency key' })
  .check(z.regex(/^[A-Za-z0-9_-]{16,64}$/, 'The idempotency key is 16–64 letters, digits, - or _'));
const finite = (what: string) => z.number({ error: `${what}: enter a number` });
const positive = (what: string) => finite(what).check(z.gt(0, `${what} must be above 0`));
const triple = (what: string) =>
  z.tuple([positive(`${what} 1`), positive(`${what} 2`), positive(`${what} 3`)], { error: `${what}: three values` });
const notes = z._default(z.string().check(z.trim(), z.maxLength(2000, 'At most 2000 characters')), '');
const unchecked = z._default(z.boolean(), false);

export const visualChecks = z.strictObject({
  bulging: unchecked,
  disconnectorOperated: unchecked,
  leakage: unchecked,
  discoloration: unchecked,
  hotTerminals: unchecked,
});

const base = {
  idempotencyKey,
  notes,
  /** The technician confirms a value the server found implausible (the warning told them why). */
  confirmImplausible: unchecked,
  /**
   * When the reading was taken on the phone, which may send it much later (no signal in the
   * switch-room). The server uses its own clock when absent and refuses a time in the future.
   */
  recordedAt: z.optional(z.iso.datetime({ offset: true, error: 'A date and time such as 2026-05-04T09:30:00Z' })),
};

export const capacitorReadingInput = z
  .strictObject({
    ...base,
    target: z.literal('capacitor-unit'),
    targetId: recordId,
    method: z.enum(fieldMethods, { error: 'Choose the measurement method' }),
    /** open-pairs: M12, M23, M31; shorted: M1, M2, M3 (µF). */
    readingsUF: z.optional(triple('Reading')),
    /** per-element: one value for a single-phase unit or three legs C12, C23, C31 (µF). */
    elementsUF: z.optional(z.array(positive('Capacitance')).check(z.minLength(1), z.maxLength(3))),
    /** line-currents: I1, I2, I3 (A) at the measured voltage and frequency. */
    currentsA: z.optional(triple('Current')),
    measuredVoltageV: z.optional(positive('Measured voltage').check(z.lte(36_000))),
    measuredFrequencyHz: z.optional(positive('Measured frequency').check(z.gte(40, 'Between 40 and 70 Hz'), z.lte(70, 'Between 40 and 70 Hz'))),
    voltageThdPct: z.optional(finite('Voltage THD').check(z.gte(0), z.lte(100))),
    caseTemperatureC: z.optional(finite('Case temperature').check(z.gte(-40, 'At least −40 °C'), z.lte(150, 'At most 150 °C'))),
    ambientTemperatureC: z.optional(finite('Ambient temperature').check(z.gte(-40), z.lte(70))),
    visual: z._default(visualChecks, {
      bulging: false,
      disconnectorOperated: false,
      leakage: false,
      discoloration: false,
      hotTerminals: false,
    }),
    dischargeResistorOhm: z.optional(positive('Discharge resistance')),
    insulationResistanceMOhm: z.optional(positive('Insulation resistance')),
  })
  .check(
    z.superRefine((v, ctx) => {
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
    }),
  );

export const contactorReadingInput = z.strictObject({
  ...base,
  target: z.literal('contactor'),
  targetId: recordId,
  operationsCounter: z.number().check(z.int(), z.gte(0, 'A counter is not negative')),
  contactCondition: z.enum(['good', 'worn', 'burnt'], { error: 'Choose the contact condition' }),
  prechargeResistorsOhm: z._default(z.array(positive('Pre-charge resistance')).check(z.maxLength(3)), []),
});

export const reactorReadingInput = z.strictObject({
  ...base,
  target: z.literal('reactor'),
  targetId: recordId,
  inductanceMH: z.optional(triple('Inductance')),
  thermalSwitchClosed: z.boolean({ error: 'Record the thermal switch' }),
  temperatureC: z.optional(finite('Reactor temperature').check(z.gte(-40), z.lte(200))),
});

export const fuseReadingInput = z.strictObject({
  ...base,
  target: z.literal('fuse-set'),
  targetId: recordId,
  /** Continuity of each of the three fuses. */
  continuity: z.tuple([z.boolean(), z.boolean(), z.boolean()]),
  ratingMatchesRegister: z.boolean(),
});

export const bankReadingInput = z.strictObject({
  ...base,
  target: z.literal('bank'),
  targetId: recordId,
  controllerPf: z.optional(finite('Controller PF').check(z.gte(-1, 'Between −1 and 1'), z.lte(1, 'Between −1 and 1'))),
  /** The site's load when the controller's PF was read, if the controller shows it. */
  loadKw: z.optional(positive('Load')),
  voltageThdPct: z.optional(finite('Voltage THD').check(z.gte(0), z.lte(100))),
  cleaningDone: unchecked,
  filtersDone: unchecked,
});

export const readingInput = z.discriminatedUnion('target', [
  capacitorReadingInput,
  contactorReadingInput,
  reactorReadingInput,
  fuseReadingInput,
  bankReadingInput,
]);
export type ReadingInput = z.input<typeof readingInput>;

export const photoUploadFields = z.strictObject({
  idempotencyKey,
  caption: z._default(z.string().check(z.trim(), z.maxLength(300)), ''),
  readingId: z.optional(queryId),
  target: z.optional(z.enum(['capacitor-unit', 'contactor', 'reactor', 'fuse-set', 'bank'])),
  targetId: z.optional(queryId),
});
