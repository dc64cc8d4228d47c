import { randomUUID } from 'node:crypto';
import { assessCapacitor, ENGINEERING_VERSION, maxDischargeResistanceOhm, projectDrift } from '@varden/engineering';
import { and, count, eq } from 'drizzle-orm';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { flags, readings, unitLatestEvaluations } from '../../apps/api/src/db/schema/index';
import { createStepWithUnits, createUser, createWorkOrder, sessionCookieFor } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

// Hand-worked figures, [DERIVED] engineering-reference.md §1: C_Δ = Q/(3·ω·U²) and a star
// phase C_Y = 3·C_Δ; full-precision π as the reference asks.
const w50 = 2 * Math.PI * 50;
const legOf = (kvar: number, voltageV: number, w = w50) => (kvar * 1e3) / (3 * w * voltageV * voltageV) * 1e6;
const C_DELTA_50KVAR_400V = legOf(50, 400); // 331.57 µF, the reference's check value
const kvarOfLegs = (legsUF: number[], voltageV: number, w = w50) => w * voltageV * voltageV * legsUF.reduce((s, c) => s + c, 0) * 1e-9;

// Forward models written out by hand, independent of packages/engineering:
// open pairs M12 = C12 + C23·C31/(C23 + C31), cyclic ([DERIVED] §2(a));
const openPairs = ([a, b, c]: number[]) => [a! + (b! * c!) / (b! + c!), b! + (c! * a!) / (c! + a!), c! + (a! * b!) / (a! + b!)];
// one terminal against the other two shorted M1 = C12 + C31, M2 = C12 + C23, M3 = C23 + C31 ([DERIVED] §2(b));
const shorted = ([a, b, c]: number[]) => [a! + c!, a! + b!, b! + c!];
// line currents |I1|² = I12² + I31² + I12·I31 … with I_ij = ω·C_ij·U ([DERIVED] §2(c)).
const lineCurrents = ([a, b, c]: number[], voltageV: number, w: number) => {
  const [x, y, z] = [a!, b!, c!].map((leg) => w * leg * 1e-6 * voltageV) as [number, number, number];
  return [Math.sqrt(x * x + z * z + x * z), Math.sqrt(x * x + y * y + x * y), Math.sqrt(y * y + z * z + y * z)];
};

let app: TestApp;
let tech: { id: number; cookie: string };
let otherTech: { id: number; cookie: string };
let planner: string;
let supervisor: string;

const key = () => `r${randomUUID().replace(/-/g, '')}`;

beforeAll(async () => {
  app = await startTestApp();
  const [t1, t2, p, s] = await Promise.all([
    createUser(app.ctx, { roles: ['technician'], name: 'Tove Technician' }),
    createUser(app.ctx, { roles: ['technician'] }),
    createUser(app.ctx, { roles: ['planner'] }),
    createUser(app.ctx, { roles: ['supervisor'] }),
  ]);
  tech = { id: t1.user.id, cookie: await sessionCookieFor(app.ctx, t1.user.id) };
  otherTech = { id: t2.user.id, cookie: await sessionCookieFor(app.ctx, t2.user.id) };
  planner = await sessionCookieFor(app.ctx, p.user.id);
  supervisor = await sessionCookieFor(app.ctx, s.user.id);
});
afterAll(async () => {
  await app.close();
});

type StepOptions = Parameters<typeof createStepWithUnits>[1];
async function onSiteOrder(options: StepOptions = {}, order: { kind?: 'inspection' | 'baseline'; state?: 'on-site' | 'dispatched' | 'sealed' } = {}) {
  const step = await createStepWithUnits(app.ctx, options);
  const orderId = await createWorkOrder(app.ctx, { bank: step, state: order.state ?? 'on-site', assigneeId: tech.id, kind: order.kind ?? 'inspection' });
  return { ...step, orderId };
}

async function record(orderId: number, body: Record<string, unknown>, cookie = tech.cookie) {
  const res = await app.request(`/api/work-orders/${orderId}/readings`, { method: 'POST', json: { idempotencyKey: key(), ...body }, cookie });
  return { status: res.status, body: await res.json() };
}

const unitReading = (unitId: number, over: Record<string, unknown>) => ({ target: 'capacitor-unit', targetId: unitId, ...over });

async function rowsOf(orderId: number) {
  const [row] = await app.ctx.db.select({ n: count() }).from(readings).where(eq(readings.workOrderId, orderId));
  return row!.n;
}
async function flagsOn(target: string, targetId: number) {
  return app.ctx.db
    .select()
    .from(flags)
    .where(and(eq(flags.target, target as 'capacitor-unit'), eq(flags.targetId, targetId)));
}

describe('capacitor units: the server evaluates every field method', () => {
  test('hand-worked: 50 kvar 400 V 50 Hz delta, open pairs at 1.5 × 331.57 µF → legs at nameplate, healthy', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    // [DERIVED] engineering-reference.md §1: C_Δ = 331.57 µF; §2(a): balanced open pairs read M = 1.5·C_Δ.
    expect(C_DELTA_50KVAR_400V).toBeCloseTo(331.57, 2);
    const m = 1.5 * C_DELTA_50KVAR_400V;
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'open-pairs', readingsUF: [m, m, m] }));
    expect(res.status).toBe(201);
    const e = res.body.evaluation;
    for (const leg of e.legsUF) expect(leg).toBeCloseTo(331.57, 2);
    expect(e.kvarAtRated).toBeCloseTo(50, 6);
    expect(e.deviationPct).toBeCloseTo(0, 6);
    expect(res.body).toMatchObject({
      workOrderId: orderId,
      target: 'capacitor-unit',
      targetId: unitIds[0],
      band: 'healthy',
      engineeringVersion: ENGINEERING_VERSION,
      flags: [],
      recordedByName: 'Tove Technician',
    });
    expect(res.body.deviationPct).toBeCloseTo(0, 6);
  });

  test('hand-worked: a 12 % loss on every leg (shorted method) → 44 kvar, replace, one action flag, latest evaluation stored', async () => {
    const { orderId, unitIds, bankId, siteId } = await onSiteOrder();
    const legs = [0.88, 0.88, 0.88].map((k) => k * C_DELTA_50KVAR_400V);
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'shorted', readingsUF: shorted(legs) }));
    expect(res.status).toBe(201);
    // Q = ω·U²·ΣC [DERIVED] §1 → 0.88 × 50 = 44 kvar; replace below −10 % [COMMON] §3 (common practice).
    expect(res.body.evaluation.kvarAtRated).toBeCloseTo(44, 6);
    expect(res.body.evaluation.deviationPct).toBeCloseTo(-12, 6);
    expect(res.body.band).toBe('replace');
    expect(res.body.flags).toEqual([expect.objectContaining({ kind: 'replace', severity: 'action', alreadyOpen: false })]);
    expect(res.body.flags[0].message).toMatch(/Step 1, unit 1: 44\.0 kvar at rated conditions, 12\.0 % below nameplate/);

    const raised = await flagsOn('capacitor-unit', unitIds[0]!);
    expect(raised).toHaveLength(1);
    expect(raised[0]).toMatchObject({ kind: 'replace', severity: 'action', siteId, bankId, readingId: res.body.id, state: 'open' });
    const [latest] = await app.ctx.db.select().from(unitLatestEvaluations).where(eq(unitLatestEvaluations.unitId, unitIds[0]!));
    expect(latest).toMatchObject({ readingId: res.body.id, band: 'replace' });
    expect(latest!.kvarAtRated).toBeCloseTo(44, 6);
    latest!.legsUF.forEach((leg) => expect(leg).toBeCloseTo(legs[0]!, 6));
  });

  test('open pairs with one weak leg: legs recovered, figures equal assessCapacitor computed here; the diluted raw reading is not what is judged', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const legs = [C_DELTA_50KVAR_400V, 0.9 * C_DELTA_50KVAR_400V * 0.98, C_DELTA_50KVAR_400V];
    const readingsUF = openPairs(legs);
    // [DERIVED] §2(a): the open-pair method dilutes a leg fault (a 10 % leg loss reads about −6.7 % on one pair).
    expect(readingsUF[1]! / (1.5 * C_DELTA_50KVAR_400V) - 1).toBeGreaterThan(-0.1);
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'open-pairs', readingsUF }));
    expect(res.status).toBe(201);
    res.body.evaluation.legsUF.forEach((leg: number, i: number) => expect(leg).toBeCloseTo(legs[i]!, 6));
    const expected = assessCapacitor({ nameplate: { kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' }, measuredUF: legs });
    expect(res.body.evaluation.kvarAtRated).toBeCloseTo(expected.kvarAtRated, 6);
    expect(res.body.evaluation.kvarAtRated).toBeCloseTo(kvarOfLegs(legs, 400), 6);
    expect(res.body.evaluation.legDeviationsPct[1]).toBeCloseTo(expected.legDeviationsPct[1]!, 6);
    expect(res.body.band).toBe(expected.band);
    expect(res.body.band).toBe('replace'); // leg 2-3 is 11.8 % below: replace below −10 % [COMMON] §3
    expect(res.body.evaluation.reasons).toEqual(expected.reasons);
  });

  test('line currents at a measured 410 V 50.2 Hz are normalised to rated conditions', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const legs = [0.97, 0.94, 0.96].map((k) => k * C_DELTA_50KVAR_400V);
    const wm = 2 * Math.PI * 50.2;
    const currentsA = lineCurrents(legs, 410, wm);
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'line-currents', currentsA, measuredVoltageV: 410, measuredFrequencyHz: 50.2 }));
    expect(res.status).toBe(201);
    res.body.evaluation.legsUF.forEach((leg: number, i: number) => expect(leg).toBeCloseTo(legs[i]!, 5));
    // Q_rated = Q_measured·(U_N/U_m)²·(f_N/f_m) [DERIVED] §2(c).
    const measuredKvar = kvarOfLegs(legs, 410, wm);
    expect(res.body.evaluation.kvarAtRated).toBeCloseTo(measuredKvar * (400 / 410) ** 2 * (50 / 50.2), 5);
    expect(res.body.evaluation.lineCurrents.capacitorKvarAtMeasured).toBeCloseTo(measuredKvar, 5);
    // Leg 2-3 6 % below: watch below −5 % [COMMON] §3 (common practice).
    expect(res.body.band).toBe('watch');
    expect(res.body.evaluation.reasons.join(' ')).toMatch(/leg 2-3 6\.0 % below nameplate/);
    expect(res.body.evaluation.warnings).toEqual([]);
  });

  test('line currents with voltage THD above 5 % carry a warning of upward bias', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const currentsA = lineCurrents([1, 1, 1].map(() => C_DELTA_50KVAR_400V), 400, w50);
    const res = await record(
      orderId,
      unitReading(unitIds[0]!, { method: 'line-currents', currentsA, measuredVoltageV: 400, measuredFrequencyHz: 50, voltageThdPct: 8 }),
    );
    expect(res.status).toBe(201);
    // [DERIVED] §2(c): a 5 % 5th harmonic adds about 3 %; 8 % of 5th: √(1 + (5·0.08)²)/√(1 + 0.08²) − 1 ≈ 7.4 %.
    expect(res.body.evaluation.lineCurrents.harmonicBiasPct).toBeCloseTo((Math.sqrt(1 + 0.4 ** 2) / Math.sqrt(1 + 0.08 ** 2) - 1) * 100, 6);
    expect(res.body.evaluation.warnings[0]).toMatch(/THD 8 % biases the line-current method upward/);
  });

  test("per element: a star unit's phases are judged at full size; a single-phase unit takes one value", async () => {
    const star = await onSiteOrder({ nameplate: { connection: 'star' } });
    const cy = 3 * C_DELTA_50KVAR_400V; // C_Y = 994.72 µF [DERIVED] §1 check value
    expect(cy).toBeCloseTo(994.72, 2);
    const phases = [cy, cy, 0.85 * cy];
    const res = await record(star.orderId, unitReading(star.unitIds[0]!, { method: 'per-element', elementsUF: phases }));
    expect(res.status).toBe(201);
    expect(res.body.evaluation.legDeviationsPct[2]).toBeCloseTo(-15, 6);
    // Star of phases: Q = ω·U²·(C1C2 + C2C3 + C3C1)/ΣC [DERIVED] §1 (star–delta).
    const [c1, c2, c3] = phases as [number, number, number];
    const kvar = w50 * 400 ** 2 * ((c1 * c2 + c2 * c3 + c3 * c1) / (c1 + c2 + c3)) * 1e-9;
    expect(res.body.evaluation.kvarAtRated).toBeCloseTo(kvar, 6);
    expect(res.body.band).toBe('replace');

    const single = await onSiteOrder({ nameplate: { kvar: 10, connection: 'single-phase' } });
    const c = (10e3 / (w50 * 400 ** 2)) * 1e6; // Q = ω·C·U² [DERIVED] §1
    const ok = await record(single.orderId, unitReading(single.unitIds[0]!, { method: 'per-element', elementsUF: [c * 0.97] }));
    expect(ok.status).toBe(201);
    expect(ok.body.evaluation.deviationPct).toBeCloseTo(-3, 6);
    expect(ok.body.band).toBe('healthy');
    const wrong = await record(single.orderId, unitReading(single.unitIds[0]!, { method: 'open-pairs', readingsUF: [c, c, c] }));
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.method).toMatch(/per element/);
  });
});

describe('implausible and impossible values', () => {
  test('more than 30 % above nameplate is refused until confirmed, then stored as remeasure', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const m = 1.5 * 1.4 * C_DELTA_50KVAR_400V;
    const body = unitReading(unitIds[0]!, { method: 'open-pairs', readingsUF: [m, m, m] });
    const refused = await record(orderId, body);
    expect(refused.status).toBe(400);
    expect(refused.body.error).toMatchObject({ code: 'invalid', confirmable: true });
    expect(refused.body.error.fields.readingsUF).toMatch(/40\.0 % above its nameplate.*confirm it/);
    expect(await rowsOf(orderId)).toBe(0);

    const confirmed = await record(orderId, { ...body, confirmImplausible: true });
    expect(confirmed.status).toBe(201);
    expect(confirmed.body.band).toBe('remeasure');
    expect(confirmed.body.evaluation.confirmedImplausible).toHaveLength(1);
    expect(confirmed.body.flags).toEqual([expect.objectContaining({ kind: 'remeasure', severity: 'advisory' })]);
  });

  test('12 % above nameplate needs no confirmation and is banded remeasure ([COMMON] §3: above +10 %)', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'per-element', elementsUF: [1.12, 1.12, 1.12].map((k) => k * C_DELTA_50KVAR_400V) }));
    expect(res.status).toBe(201);
    expect(res.body.band).toBe('remeasure');
  });

  test('readings no real unit can give are a 400 with the engineering message, even when "confirmed"', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const cases = [
      { method: 'open-pairs', readingsUF: [100, 300, 300], field: 'readingsUF' },
      { method: 'shorted', readingsUF: [100, 100, 300], field: 'readingsUF' },
      { method: 'line-currents', currentsA: [10, 10, 30], measuredVoltageV: 400, measuredFrequencyHz: 50, field: 'currentsA' },
    ];
    for (const { field, ...rest } of cases) {
      const res = await record(orderId, unitReading(unitIds[0]!, { ...rest, confirmImplausible: true }));
      expect(res.status, rest.method).toBe(400);
      expect(res.body.error.code).toBe('invalid');
      expect(res.body.error.fields[field]).toMatch(/cannot come from a real unit/);
      expect(res.body.error.confirmable).toBeUndefined();
    }
    expect(await rowsOf(orderId)).toBe(0);
  });

  test('a case temperature above 100 °C must be confirmed', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const m = 1.5 * C_DELTA_50KVAR_400V;
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'open-pairs', readingsUF: [m, m, m], caseTemperatureC: 120 }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.caseTemperatureC).toMatch(/above 100 °C.*confirm/);
  });

  test('random readings never cause a 5xx: either stored or a 400 with field messages', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const value = fc.oneof(fc.double({ min: 1e-6, max: 1e7, noNaN: true }), fc.constantFrom(0.001, 497.36, 1e6));
    await fc.assert(
      fc.asyncProperty(fc.constantFrom('open-pairs', 'shorted'), fc.tuple(value, value, value), fc.boolean(), async (method, readingsUF, confirmImplausible) => {
        const res = await record(orderId, unitReading(unitIds[0]!, { method, readingsUF, confirmImplausible }));
        expect([201, 400]).toContain(res.status);
        if (res.status === 400) expect(Object.keys(res.body.error.fields ?? {}).length).toBeGreaterThan(0);
      }),
      { numRuns: 40 },
    );
  });
});

describe('checks around the capacitance', () => {
  test('case temperature: above 55 °C investigate (advisory), above 65 °C an action ([STD] §3)', async () => {
    const { orderId, unitIds } = await onSiteOrder({ units: 2 });
    const m = 1.5 * C_DELTA_50KVAR_400V;
    const warm = await record(orderId, unitReading(unitIds[0]!, { method: 'open-pairs', readingsUF: [m, m, m], caseTemperatureC: 58 }));
    expect(warm.body.evaluation.caseTemperature.level).toBe('investigate');
    expect(warm.body.flags).toEqual([expect.objectContaining({ kind: 'case-temperature', severity: 'advisory' })]);
    const hot = await record(orderId, unitReading(unitIds[1]!, { method: 'open-pairs', readingsUF: [m, m, m], caseTemperatureC: 67 }));
    expect(hot.body.evaluation.caseTemperature.level).toBe('over-limit');
    expect(hot.body.flags).toEqual([expect.objectContaining({ kind: 'case-temperature', severity: 'action' })]);
  });

  test('a bulging case means replace even with the capacitance at nameplate (NETA MTS 7.20 visual, [STD-memory])', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const m = 1.5 * C_DELTA_50KVAR_400V;
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'open-pairs', readingsUF: [m, m, m], visual: { bulging: true } }));
    expect(res.status).toBe(201);
    expect(res.body.band).toBe('replace');
    expect(res.body.evaluation.capacitanceBand).toBe('healthy');
    expect(res.body.flags[0]).toMatchObject({ kind: 'replace', severity: 'action' });
    expect(res.body.flags[0].message).toMatch(/bulging/);
  });

  test('discharge resistor above R ≤ t/(C·ln(√2·U/U_R)) and insulation below the NETA minimum are reasons and a watch flag', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    // [DERIVED] §3 with IEC 60831-1, 75 V within 3 min [STD-summary]; per delta leg at 400 V.
    const maxOhm = maxDischargeResistanceOhm({ capacitanceUF: C_DELTA_50KVAR_400V, voltageV: 400, seconds: 180, residualV: 75 });
    expect(maxOhm).toBeCloseTo(180 / (C_DELTA_50KVAR_400V * 1e-6 * Math.log((Math.SQRT2 * 400) / 75)), 3);
    const m = 1.5 * C_DELTA_50KVAR_400V;
    const res = await record(
      orderId,
      unitReading(unitIds[0]!, { method: 'open-pairs', readingsUF: [m, m, m], dischargeResistorOhm: maxOhm * 1.5, insulationResistanceMOhm: 60 }),
    );
    expect(res.status).toBe(201);
    expect(res.body.evaluation.dischargeResistor).toMatchObject({ ok: false, residualV: 75, seconds: 180 });
    expect(res.body.evaluation.dischargeResistor.maxOhm).toBeCloseTo(maxOhm, 6);
    // ANSI/NETA MTS Table 100.1 [STD]: up to 600 V → 1000 V DC test, 100 MΩ minimum.
    expect(res.body.evaluation.insulation).toMatchObject({ ok: false, minimumMOhm: 100, testVoltageVdc: 1000 });
    expect(res.body.flags).toEqual([expect.objectContaining({ kind: 'watch', severity: 'advisory' })]);
    expect(res.body.flags[0].message).toMatch(/discharge resistance.*insulation resistance 60 MΩ/);
  });

  test('unbalanced legs within the bands raise an unbalance flag (max/min above 1.08, IEC 60871-1 from memory)', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const legs = [1.04, 0.955, 1.0].map((k) => k * C_DELTA_50KVAR_400V);
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'per-element', elementsUF: legs }));
    expect(res.body.evaluation.unbalanceRatio).toBeCloseTo(1.04 / 0.955, 6);
    expect(res.body.band).toBe('watch');
    expect(res.body.flags.map((f: { kind: string }) => f.kind)).toEqual(['unbalance']);
  });

  test("a baseline reading outside the unit's tolerance is noted (IEC 60831-1 −5 … +10 %, from memory)", async () => {
    const { orderId, unitIds } = await onSiteOrder({}, { kind: 'baseline' });
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'per-element', elementsUF: [0.94, 0.94, 0.94].map((k) => k * C_DELTA_50KVAR_400V) }));
    expect(res.body.evaluation.tolerance).toEqual({ minPct: -5, maxPct: 10, within: false });
    expect(res.body.evaluation.reasons.join(' ')).toMatch(/outside its tolerance/);
  });
});

describe("detuned steps: the step's tuning after each unit reading", () => {
  // A 7 % step at 50 Hz with 440 V capacitors: design tuning 50/√0.07 = 189.0 Hz [DERIVED] §4.
  const leg440 = legOf(50, 440);

  test("line currents through the reactor give the capacitor's own legs (X_C = U/(√3·I) + X_L)", async () => {
    const { orderId, unitIds, reactorInductanceMH } = await onSiteOrder({ nameplate: { voltageV: 440 }, detuningFactor: 0.07 });
    const xc = 1 / (w50 * 3 * leg440 * 1e-6); // star-equivalent per phase
    const xl = w50 * reactorInductanceMH! * 1e-3;
    expect(xl / xc).toBeCloseTo(0.07, 9); // p = X_L/X_C [DERIVED] §4
    const i = 400 / Math.sqrt(3) / (xc - xl); // [DERIVED] §2(c)
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'line-currents', currentsA: [i, i, i], measuredVoltageV: 400, measuredFrequencyHz: 50 }));
    expect(res.status).toBe(201);
    res.body.evaluation.legsUF.forEach((leg: number) => expect(leg).toBeCloseTo(leg440, 6));
    expect(res.body.evaluation.lineCurrents.reactorInductanceSource).toBe('register');
    expect(res.body.band).toBe('healthy');
    expect(res.body.evaluation.step.tuning.tuningHz).toBeCloseTo(50 / Math.sqrt(0.07), 6);
    expect(res.body.evaluation.step.tuning.tuningHz).toBeCloseTo(189.0, 1);
  });

  test('a 10 % capacitance loss moves a 7 % step to 199.2 Hz: tuning-drift flag on the reactor (shift above 5 %, common practice)', async () => {
    const { orderId, unitIds, reactorId } = await onSiteOrder({ nameplate: { voltageV: 440 }, detuningFactor: 0.07 });
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'per-element', elementsUF: [0.9, 0.9, 0.9].map((k) => k * leg440) }));
    expect(res.status).toBe(201);
    const t = res.body.evaluation.step.tuning;
    expect(t.tuningHz).toBeCloseTo(199.2, 1); // [DERIVED] §4 check value
    expect(t.shiftPct).toBeCloseTo((1 / Math.sqrt(0.9) - 1) * 100, 6);
    const drift = res.body.flags.find((f: { kind: string }) => f.kind === 'tuning-drift');
    expect(drift).toMatchObject({ severity: 'advisory' });
    const rows = await flagsOn('reactor', reactorId!);
    expect(rows.map((r) => r.kind)).toEqual(['tuning-drift']);
  });

  test('a 30 % loss brings the tuning within 10 % of the 5th harmonic: an action flag', async () => {
    const { orderId, unitIds } = await onSiteOrder({ nameplate: { voltageV: 440 }, detuningFactor: 0.07 });
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'per-element', elementsUF: [0.7, 0.7, 0.7].map((k) => k * leg440) }));
    const t = res.body.evaluation.step.tuning;
    // f_r/√k: 189.0/√0.7 = 225.9 Hz, 9.6 % from 250 Hz [DERIVED] §4; within 10 % [COMMON] §4.
    expect(t.tuningHz).toBeCloseTo(50 / Math.sqrt(0.07 * 0.7), 6);
    expect(t.nearestHarmonic).toBe(5);
    expect(t.nearHarmonic).toBe(true);
    expect(res.body.flags).toEqual(
      expect.arrayContaining([expect.objectContaining({ kind: 'replace' }), expect.objectContaining({ kind: 'tuning-drift', severity: 'action' })]),
    );
  });

  test("the step's tuning uses the inductance its reactor's latest reading measured, not the register's", async () => {
    const { orderId, unitIds, reactorId, reactorInductanceMH } = await onSiteOrder({ nameplate: { voltageV: 440 }, detuningFactor: 0.07 });
    const l = reactorInductanceMH! * 1.04;
    expect((await record(orderId, { target: 'reactor', targetId: reactorId, inductanceMH: [l, l, l], thermalSwitchClosed: true })).status).toBe(201);
    const res = await record(orderId, unitReading(unitIds[0]!, { method: 'per-element', elementsUF: [leg440, leg440, leg440] }));
    expect(res.status).toBe(201);
    const step = res.body.evaluation.step;
    expect(step.inductanceSource).toBe('reactor reading');
    expect(step.inductanceMH).toBeCloseTo(l, 9);
    // f_r = 1/(2π·√(L·C)): 4 % more inductance tunes the step √1.04 lower [DERIVED] §4.
    expect(step.tuning.tuningHz).toBeCloseTo(50 / Math.sqrt(0.07 * 1.04), 6);
  });

  test('with several units the tuning waits for all of them; line currents of one unit behind a shared reactor are refused', async () => {
    const { orderId, unitIds } = await onSiteOrder({ units: 2, nameplate: { voltageV: 440 }, detuningFactor: 0.07 });
    const first = await record(orderId, unitReading(unitIds[0]!, { method: 'per-element', elementsUF: [leg440, leg440, leg440] }));
    expect(first.body.evaluation.step.note).toMatch(/1 of 2/);
    const second = await record(orderId, unitReading(unitIds[1]!, { method: 'per-element', elementsUF: [leg440, leg440, leg440] }));
    expect(second.body.evaluation.step.tuning.tuningHz).toBeCloseTo(50 / Math.sqrt(0.07), 6);
    const currents = await record(orderId, unitReading(unitIds[0]!, { method: 'line-currents', currentsA: [60, 60, 60], measuredVoltageV: 400, measuredFrequencyHz: 50 }));
    expect(currents.status).toBe(400);
    expect(currents.body.error.fields.method).toMatch(/all 2 units/);
  });
});

describe('contactors, reactors, fuses and the bank', () => {
  test('a contactor past 80 % of its rated operations is flagged (common practice, §7); a counter that runs backwards needs confirming', async () => {
    const { orderId, contactorId } = await onSiteOrder({ contactor: { counterAtInstall: 1000 } });
    const res = await record(orderId, { target: 'contactor', targetId: contactorId, operationsCounter: 86_000, contactCondition: 'good' });
    expect(res.status).toBe(201);
    // used % = 100·(counter now − counter at install)/rated operations [COMMON] §7.
    expect(res.body.evaluation.usedPct).toBeCloseTo(85, 9);
    expect(res.body.flags).toEqual([expect.objectContaining({ kind: 'contactor-endurance', severity: 'action' })]);

    const backwards = await record(orderId, { target: 'contactor', targetId: contactorId, operationsCounter: 50_000, contactCondition: 'burnt' });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields.operationsCounter).toMatch(/fewer than the 86000 recorded before/);
    const belowInstall = await record(orderId, { target: 'contactor', targetId: contactorId, operationsCounter: 500, contactCondition: 'good', confirmImplausible: true });
    expect(belowInstall.status).toBe(400);
    expect(belowInstall.body.error.fields.operationsCounter).toMatch(/counter reset or the contactor replaced/);
    const confirmed = await record(orderId, { target: 'contactor', targetId: contactorId, operationsCounter: 50_000, contactCondition: 'burnt', confirmImplausible: true });
    expect(confirmed.status).toBe(201);
    expect(confirmed.body.flags[0]).toMatchObject({ kind: 'contactor-endurance', alreadyOpen: true });
    expect(await flagsOn('contactor', contactorId)).toHaveLength(1);
  });

  test('a reactor with its thermal switch open and its inductance 8 % off the register is flagged', async () => {
    const { orderId, reactorId, reactorInductanceMH } = await onSiteOrder({ nameplate: { voltageV: 440 }, detuningFactor: 0.07 });
    const l = reactorInductanceMH! * 1.08;
    const res = await record(orderId, { target: 'reactor', targetId: reactorId, inductanceMH: [l, l, l], thermalSwitchClosed: false });
    expect(res.status).toBe(201);
    expect(res.body.evaluation.inductance.within).toBe(false); // ± 5 % common practice
    expect(res.body.evaluation.inductance.deviationsPct[0]).toBeCloseTo(8, 9);
    expect(res.body.flags).toEqual([expect.objectContaining({ kind: 'watch', severity: 'action' })]);
    expect(res.body.flags[0].message).toMatch(/thermal switch open.*inductance 8\.0 % above/);
  });

  test("a fuse without continuity raises one blown-fuse action flag with the reference's advice (§7)", async () => {
    const { orderId, fuseSetId } = await onSiteOrder();
    const res = await record(orderId, { target: 'fuse-set', targetId: fuseSetId, continuity: [true, false, true], ratingMatchesRegister: false });
    expect(res.status).toBe(201);
    const blown = res.body.flags.find((f: { kind: string }) => f.kind === 'blown-fuse');
    expect(blown.severity).toBe('action');
    expect(blown.message).toContain("a blown fuse usually means a failed capacitor: investigate, don't just re-fuse");
    expect(res.body.flags.map((f: { kind: string }) => f.kind).sort()).toEqual(['blown-fuse', 'watch']);
    const again = await record(orderId, { target: 'fuse-set', targetId: fuseSetId, continuity: [true, false, true], ratingMatchesRegister: true });
    expect(again.body.flags).toEqual([expect.objectContaining({ kind: 'blown-fuse', alreadyOpen: true })]);
    expect((await flagsOn('fuse-set', fuseSetId)).filter((f) => f.kind === 'blown-fuse')).toHaveLength(1);
  });

  test('the bank: a leading PF is over-correction; a lagging one below target gives the kvar missing', async () => {
    const { orderId, bankId } = await onSiteOrder();
    const leading = await record(orderId, { target: 'bank', targetId: bankId, controllerPf: -0.97, voltageThdPct: 6.5 });
    expect(leading.status).toBe(201);
    expect(leading.body.evaluation).toMatchObject({ overCorrected: true, voltageThdPct: 6.5 });
    expect(leading.body.evaluation.reasons.join(' ')).toMatch(/over-corrects.*THD 6\.5 % with an undetuned bank/);
    const lagging = await record(orderId, { target: 'bank', targetId: bankId, controllerPf: 0.85, loadKw: 400 });
    // Q_c = P·(tan φ1 − tan φ2); the 0.85 → 0.95 multiplier is 0.291 [STD-summary, IEEE 141] §6.
    expect(lagging.body.evaluation.missingKvar).toBeCloseTo(400 * (Math.tan(Math.acos(0.85)) - Math.tan(Math.acos(0.95))), 9);
    expect(Math.abs(lagging.body.evaluation.missingKvar - 400 * 0.291)).toBeLessThan(0.4);
    expect(lagging.body.evaluation.belowTarget).toBe(true);
    expect(lagging.body.flags).toEqual([]);
  });

  test('a component of another bank is refused', async () => {
    const { orderId } = await onSiteOrder();
    const other = await createStepWithUnits(app.ctx);
    const res = await record(orderId, { target: 'fuse-set', targetId: other.fuseSetId, continuity: [true, true, true], ratingMatchesRegister: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.targetId).toMatch(/this order's bank/);
  });
});

describe('idempotency', () => {
  test('the same key twice stores one reading: 201, then 200 with the stored reading', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const body = { idempotencyKey: key(), ...unitReading(unitIds[0]!, { method: 'per-element', elementsUF: [330, 331, 332] }) };
    const first = await record(orderId, body);
    const second = await record(orderId, body);
    expect([first.status, second.status]).toEqual([201, 200]);
    // The answer echoes the key, so a phone can match it to the reading it queued.
    expect(first.body.idempotencyKey).toBe(body.idempotencyKey);
    expect(second.body).toEqual(first.body);
    expect(await rowsOf(orderId)).toBe(1);
  });

  test('identical requests at once store one reading', async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const body = { idempotencyKey: key(), ...unitReading(unitIds[0]!, { method: 'shorted', readingsUF: shorted([0.85, 0.85, 0.85].map((k) => k * C_DELTA_50KVAR_400V)) }) };
    const answers = await Promise.all(Array.from({ length: 5 }, () => record(orderId, body)));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 200, 200, 201]);
    expect(new Set(answers.map((a) => a.body.id)).size).toBe(1);
    expect(await rowsOf(orderId)).toBe(1);
    expect(await flagsOn('capacitor-unit', unitIds[0]!)).toHaveLength(1);
  });

  test('a key already used on another order is a conflict', async () => {
    const a = await onSiteOrder();
    const b = await onSiteOrder();
    const idempotencyKey = key();
    expect((await record(a.orderId, { idempotencyKey, target: 'bank', targetId: a.bankId, cleaningDone: true })).status).toBe(201);
    const res = await record(b.orderId, { idempotencyKey, target: 'bank', targetId: b.bankId, cleaningDone: true });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.idempotencyKey).toBeDefined();
    expect(await rowsOf(b.orderId)).toBe(0);
  });
});

describe('readings sent at once (they share transactions: db/transaction-batch.ts)', () => {
  test('on several banks, two on one bank, one refused and one sent twice: each is stored or refused as if sent alone', async () => {
    const banks = await Promise.all([0, 1, 2, 3].map(() => onSiteOrder()));
    const legs = (k: number) => [k, k, k].map((x) => x * C_DELTA_50KVAR_400V);
    const twice = { idempotencyKey: key(), ...unitReading(banks[1]!.unitIds[0]!, { method: 'per-element', elementsUF: legs(0.97) }) };
    const sent = [
      // Every unit of bank 0, each a little lower: several readings on one bank.
      ...banks[0]!.unitIds.map((unitId, i) => record(banks[0]!.orderId, unitReading(unitId, { method: 'per-element', elementsUF: legs(1 - i / 100) }))),
      record(banks[1]!.orderId, twice),
      record(banks[1]!.orderId, twice),
      // A 12 % loss: a replace flag, raised once.
      record(banks[2]!.orderId, unitReading(banks[2]!.unitIds[0]!, { method: 'per-element', elementsUF: legs(0.88) })),
      // A unit of another bank than the order's: refused, alone.
      record(banks[3]!.orderId, unitReading(banks[2]!.unitIds[1]!, { method: 'per-element', elementsUF: legs(1) })),
      record(banks[3]!.orderId, unitReading(banks[3]!.unitIds[0]!, { method: 'per-element', elementsUF: legs(0.995) })),
    ];
    const answers = await Promise.all(sent);
    const n = banks[0]!.unitIds.length;
    expect(answers.slice(0, n).map((a) => a.status)).toEqual(Array(n).fill(201));
    expect(answers.slice(n + 2).map((a) => a.status)).toEqual([201, 400, 201]);
    expect([answers[n]!.status, answers[n + 1]!.status].sort()).toEqual([200, 201]);
    expect(answers[n]!.body.id).toBe(answers[n + 1]!.body.id);
    expect(answers[n + 3]!.body.error.fields.targetId).toBeDefined();
    expect([await rowsOf(banks[0]!.orderId), await rowsOf(banks[1]!.orderId), await rowsOf(banks[2]!.orderId), await rowsOf(banks[3]!.orderId)]).toEqual([n, 1, 1, 1]);
    // Each unit's latest evaluation is its own reading.
    const latest = await app.ctx.db.select().from(unitLatestEvaluations);
    for (const [i, unitId] of banks[0]!.unitIds.entries()) expect(latest.find((l) => l.unitId === unitId)).toMatchObject({ readingId: answers[i]!.body.id });
    const others = [
      [banks[1]!.unitIds[0]!, answers[n]!],
      [banks[2]!.unitIds[0]!, answers[n + 2]!],
      [banks[3]!.unitIds[0]!, answers[n + 4]!],
    ] as const;
    for (const [unitId, answer] of others) expect(latest.find((l) => l.unitId === unitId)).toMatchObject({ readingId: answer.body.id });
    // Each answer's id is its own stored row (the rows of a shared INSERT are told apart by their ids).
    for (const answer of [...answers.slice(0, n), ...others.map(([, a]) => a)]) {
      const [row] = await app.ctx.db.select().from(readings).where(eq(readings.id, answer.body.id));
      expect(row).toMatchObject({ idempotencyKey: answer.body.idempotencyKey, targetId: answer.body.targetId, deviationPct: answer.body.deviationPct });
    }
    expect((await flagsOn('capacitor-unit', banks[2]!.unitIds[0]!)).map((f) => f.kind)).toEqual(['replace']);
  });
});

describe('who may record, and when', () => {
  const bankReading = (bankId: number) => ({ target: 'bank', targetId: bankId, cleaningDone: true });

  test('a technician the order is not assigned to gets 403', async () => {
    const { orderId, bankId } = await onSiteOrder();
    const res = await record(orderId, bankReading(bankId), otherTech.cookie);
    expect(res.status).toBe(403);
    expect(await rowsOf(orderId)).toBe(0);
  });

  test('an order not yet on site gets 409 and asks for the safety card', async () => {
    const { orderId, bankId } = await onSiteOrder({}, { state: 'dispatched' });
    const res = await record(orderId, bankReading(bankId));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/safety card/);
  });

  test('a sealed order gets 409 locked, and the database refuses a reading too', async () => {
    const { orderId, bankId } = await onSiteOrder({}, { state: 'sealed' });
    const res = await record(orderId, bankReading(bankId));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('locked');
    await expect(
      app.ctx.db.insert(readings).values({
        workOrderId: orderId,
        idempotencyKey: key(),
        target: 'bank',
        targetId: bankId,
        input: {},
        evaluation: {},
        engineeringVersion: ENGINEERING_VERSION,
        recordedById: tech.id,
        recordedAt: new Date(),
      }),
    ).rejects.toThrow();
    expect(await rowsOf(orderId)).toBe(0);
  });

  test('a planner may not record', async () => {
    const { orderId, bankId } = await onSiteOrder();
    expect((await record(orderId, bankReading(bankId), planner)).status).toBe(403);
  });

  test('a time in the future is refused', async () => {
    const { orderId, bankId } = await onSiteOrder();
    const res = await record(orderId, { ...bankReading(bankId), recordedAt: new Date(Date.now() + 3_600_000).toISOString() });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.recordedAt).toMatch(/future/);
  });
});

describe('latest evaluation and history', () => {
  test('the latest evaluation moves only to a reading taken later; the history pages and sorts', async () => {
    const { orderId, unitIds, siteId } = await onSiteOrder();
    const unitId = unitIds[0]!;
    const at = (hoursAgo: number) => new Date(Date.now() - hoursAgo * 3_600_000).toISOString();
    const legs = (k: number) => [k, k, k].map((x) => x * C_DELTA_50KVAR_400V);
    const newer = await record(orderId, unitReading(unitId, { method: 'per-element', elementsUF: legs(0.88), recordedAt: at(1) }));
    const older = await record(orderId, unitReading(unitId, { method: 'per-element', elementsUF: legs(1), recordedAt: at(48) }));
    const latestRow = async () => (await app.ctx.db.select().from(unitLatestEvaluations).where(eq(unitLatestEvaluations.unitId, unitId)))[0]!;
    expect((await latestRow()).readingId).toBe(newer.body.id);
    const newest = await record(orderId, unitReading(unitId, { method: 'per-element', elementsUF: legs(0.99), recordedAt: at(0) }));
    expect(await latestRow()).toMatchObject({ readingId: newest.body.id, band: 'healthy' });

    const page = await (await app.request(`/api/capacitor-units/${unitId}/readings?pageSize=2`, { cookie: planner })).json();
    expect(page.total).toBe(3);
    expect(page.items.map((i: { id: number }) => i.id)).toEqual([newest.body.id, newer.body.id]);
    expect(page.items[1]).toMatchObject({ workOrderId: orderId, workOrderState: 'on-site', method: 'per-element', band: 'replace' });
    expect(page.items[1].kvarAtRated).toBeCloseTo(44, 6);
    expect(page.items[1].deviationPct).toBeCloseTo(-12, 6);
    const ascending = await (await app.request(`/api/capacitor-units/${unitId}/readings?sort=recordedAt`, { cookie: planner })).json();
    expect(ascending.items.map((i: { id: number }) => i.id)).toEqual([older.body.id, newer.body.id, newest.body.id]);

    const ownViewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [siteId] });
    const otherViewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [(await createStepWithUnits(app.ctx)).siteId] });
    const ownCookie = await sessionCookieFor(app.ctx, ownViewer.user.id);
    const otherCookie = await sessionCookieFor(app.ctx, otherViewer.user.id);
    expect((await app.request(`/api/capacitor-units/${unitId}/readings`, { cookie: ownCookie })).status).toBe(200);
    expect((await app.request(`/api/capacitor-units/${unitId}/readings`, { cookie: otherCookie })).status).toBe(404);
    expect((await app.request(`/api/capacitor-units/999999999/readings`, { cookie: planner })).status).toBe(404);

    const list = await app.request(`/api/work-orders/${orderId}/readings`, { cookie: supervisor });
    expect(list.status).toBe(200);
    const body = await list.json();
    expect(body.total).toBe(3);
    expect(body.items.map((i: { id: number }) => i.id)).toEqual([older.body.id, newer.body.id, newest.body.id]);
    expect(body.items[1]).toMatchObject({ id: newer.body.id, flags: [expect.objectContaining({ kind: 'replace' })] });
    expect((await app.request(`/api/work-orders/${orderId}/readings`, { cookie: ownCookie })).status).toBe(200);
    expect((await app.request(`/api/work-orders/${orderId}/readings`, { cookie: otherCookie })).status).toBe(404);
  });
  test("the unit's drift over five years is fitted and stored beside its latest evaluation, whatever order the readings arrive in", async () => {
    const { orderId, unitIds } = await onSiteOrder();
    const unitId = unitIds[0]!;
    const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000).toISOString();
    const legs = (k: number) => [k, k, k].map((x) => x * C_DELTA_50KVAR_400V);
    const latestRow = async () => (await app.ctx.db.select().from(unitLatestEvaluations).where(eq(unitLatestEvaluations.unitId, unitId)))[0]!;
    // A reading from eight years ago lies outside the window; one reading alone fits no line.
    await record(orderId, unitReading(unitId, { method: 'per-element', elementsUF: legs(1.01), recordedAt: daysAgo(8 * 365) }));
    await record(orderId, unitReading(unitId, { method: 'per-element', elementsUF: legs(0.97), recordedAt: daysAgo(730) }));
    expect(await latestRow()).toMatchObject({ driftRatePctPerYear: null, replaceBy: null });
    await record(orderId, unitReading(unitId, { method: 'per-element', elementsUF: legs(0.92), recordedAt: daysAgo(1) }));
    // Late from a phone without signal: older than the latest, still part of the fit.
    await record(orderId, unitReading(unitId, { method: 'per-element', elementsUF: legs(0.95), recordedAt: daysAgo(365) }));
    const points = [
      { date: daysAgo(730), deviationPct: -3 },
      { date: daysAgo(365), deviationPct: -5 },
      { date: daysAgo(1), deviationPct: -8 },
    ];
    const stored = await readingsOfUnit(unitId);
    const expected = projectDrift({ points: stored.filter((r) => r.recordedAt.getTime() > Date.now() - 5 * 365.25 * 86_400_000).map((r) => ({ date: r.recordedAt.toISOString(), deviationPct: r.deviationPct! })), replaceBelowPct: -10 });
    expect(expected.ratePctPerYear).toBeCloseTo(projectDrift({ points, replaceBelowPct: -10 }).ratePctPerYear, 1);
    const latest = await latestRow();
    expect(latest.driftRatePctPerYear).toBeCloseTo(expected.ratePctPerYear, 9);
    expect(latest.replaceBy).toBe(expected.replaceBy!.slice(0, 10));
  });
});

async function readingsOfUnit(unitId: number) {
  return app.ctx.db
    .select({ recordedAt: readings.recordedAt, deviationPct: readings.deviationPct })
    .from(readings)
    .where(and(eq(readings.target, 'capacitor-unit'), eq(readings.targetId, unitId)));
}
