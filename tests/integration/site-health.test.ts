import { bankResonance, correctionKvar, detunedStepKvar, reactorInductanceMH, ratedCapacitanceUF } from '@varden/engineering';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { inflateSync } from 'node:zlib';
import { eq } from 'drizzle-orm';
import { createSite, createUser, createWorkOrder, insertUnitReading, signIn } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';
import { banks, capacitorUnits, flags, reactors, steps, unitLatestEvaluations } from '../../apps/api/src/db/schema/index';

let app: TestApp;
let supervisor: string;
let supervisorId: number;

beforeAll(async () => {
  app = await startTestApp();
  const s = await createUser(app.ctx, { roles: ['supervisor'] });
  supervisorId = s.user.id;
  supervisor = await signIn(app, s.email, s.password);
});
afterAll(async () => {
  await app.close();
});

/** The text a PDF shows: pdfkit deflates each content stream and writes its strings as hex runs. */
function pdfText(pdf: Buffer): string {
  const raw = pdf.toString('latin1');
  const lines: string[] = [];
  for (const m of raw.matchAll(/\bstream\r?\n/g)) {
    const from = m.index! + m[0].length;
    const to = raw.indexOf('endstream', from);
    if (to < 0) break;
    let content: string;
    try {
      content = inflateSync(pdf.subarray(from, to)).toString('latin1');
    } catch {
      continue; // fonts and images: not text
    }
    for (const [, runs] of content.matchAll(/\[(.*?)\] TJ/g)) {
      const hex = [...runs!.matchAll(/<([0-9a-f]*)>/g)].map((h) => h[1]).join('');
      lines.push(Buffer.from(hex, 'hex').toString('latin1'));
    }
  }
  return lines.join('\n').replace(/\u00b7/g, '·');
}

async function addBank(siteId: number, opts: { detuningFactor: number | null; steps: number; unitKvar: number; unitVoltageV: number }) {
  const { db } = app.ctx;
  const [bank] = await db
    .insert(banks)
    .values({ siteId, name: `Bank ${Math.random()}`, detuned: opts.detuningFactor !== null, detuningFactor: opts.detuningFactor })
    .$returningId();
  for (let n = 1; n <= opts.steps; n++) {
    const [step] = await db.insert(steps).values({ bankId: bank!.id, number: n, ratedKvar: 25 }).$returningId();
    const legUF = ratedCapacitanceUF({ kvar: opts.unitKvar, voltageV: opts.unitVoltageV, frequencyHz: 50, connection: 'delta' });
    await db.insert(capacitorUnits).values({
      stepId: step!.id,
      position: 1,
      nameplateKvar: opts.unitKvar,
      nameplateVoltageV: opts.unitVoltageV,
      nameplateFrequencyHz: 50,
      connection: 'delta',
      capacitanceUF: legUF,
    });
    if (opts.detuningFactor !== null) {
      await db.insert(reactors).values({
        stepId: step!.id,
        inductanceMH: reactorInductanceMH({ detuningFactor: opts.detuningFactor, legsUF: [legUF, legUF, legUF], frequencyHz: 50 }),
        ratedCurrentA: 80,
        detuningFactor: opts.detuningFactor,
      });
    }
  }
  return bank!.id;
}

describe('GET /api/sites/:id/health', () => {
  test('an undetuned bank with no readings yet: hand-worked PF, missing kvar and resonance', async () => {
    const siteId = await createSite(app.ctx, {
      transformerKva: 1000,
      transformerImpedancePct: 6,
      targetPf: 0.95,
      tariffBasis: 'pf-threshold',
      tariffLimit: 0.9,
      pricePerKvarh: 0.02,
      plannedLoadKw: 500,
      plannedLoadPf: 0.8,
    });
    await addBank(siteId, { detuningFactor: null, steps: 4, unitKvar: 25, unitVoltageV: 400 });
    const res = await app.request(`/api/sites/${siteId}/health`, { cookie: supervisor });
    expect(res.status).toBe(200);
    const health = await res.json();

    expect(health.installedKvar).toBeCloseTo(100, 9);
    expect(health.effectiveKvar).toBeCloseTo(100, 9);
    expect(health.lostKvar).toBeCloseTo(0, 9);
    expect(health.bands).toEqual({ healthy: 0, watch: 0, replace: 0, remeasure: 0, noReading: 4 });
    expect(health.load).toMatchObject({ source: 'planned-load', kw: 500, loadPf: 0.8 });
    // Hand-worked [DERIVED] engineering-reference.md §6: Q_load = 500·tan(acos 0.8) = 375 kvar;
    // with 100 kvar in, Q = 275 kvar and PF = 500/√(500² + 275²) = 0.8762.
    expect(health.load.loadKvar).toBeCloseTo(375, 6);
    expect(health.reachedPf).toBeCloseTo(0.8762, 4);
    // [STD-summary] IEEE 141 ch. 8 kW multiplier 0.80→0.95 = 0.421: 500 kW needs ≈ 210.7 kvar, 110.7 missing.
    expect(health.requiredKvar).toBeCloseTo(500 * 0.421, 0);
    expect(health.requiredKvar).toBeCloseTo(correctionKvar({ kw: 500, pfFrom: 0.8, pfTo: 0.95 }), 9);
    expect(health.missingKvar).toBeCloseTo(health.requiredKvar - 100, 9);
    expect(health.triangle.now).toMatchObject({ kw: 500 });
    expect(health.triangle.now.kvar).toBeCloseTo(275, 6);
    // Nothing is lost yet, so the estimate of what lost correction costs is zero.
    expect(health.cost).toMatchObject({ estimate: true, currency: 'EUR', hoursPerMonth: 500, lostMonthlyCost: 0 });

    // [DERIVED] §5 h = √(S_sc/Q): S_sc = 1000/0.06 = 16,667 kVA; 100 kvar → h = 12.9, within 10 % of the 13th.
    const [bank] = health.banks;
    const expected = bankResonance({ transformerKva: 1000, impedancePct: 6, stepsKvar: [25, 25, 25, 25] });
    expect(bank.resonance).toHaveLength(4);
    bank.resonance.forEach((r: { stepNumbers: number[]; kvar: number; order: number; warning: boolean }, i: number) => {
      // Steps 1, 1+2, 1+2+3, 1–4 switched in, named by their step numbers.
      expect(r.stepNumbers).toEqual([1, 2, 3, 4].slice(0, i + 1));
      expect(r.kvar).toBeCloseTo(25 * (i + 1), 9);
      expect(r.order).toBeCloseTo(expected[i]!.order, 9);
      expect(r.warning).toBe(expected[i]!.warning);
    });
    expect(bank.resonance[3].order).toBeCloseTo(Math.sqrt(1000 / 0.06 / 100), 6);
    expect(bank.resonance[3]).toMatchObject({ nearestHarmonic: 13, warning: true });
  });

  test('a detuned step counts at network voltage through its reactor, tuned at its design frequency', async () => {
    const siteId = await createSite(app.ctx, { plannedLoadKw: 400, plannedLoadPf: 0.75 });
    await addBank(siteId, { detuningFactor: 0.07, steps: 2, unitKvar: 56, unitVoltageV: 440 });
    const health = await (await app.request(`/api/sites/${siteId}/health`, { cookie: supervisor })).json();
    // [DERIVED] §4: Q_eff = Q_CR·(U_N/U_CR)²/(1 − p) = 56·(400/440)²/0.93 ≈ 49.8 kvar per step.
    const perStep = detunedStepKvar({ capacitorKvar: 56, capacitorVoltageV: 440, networkVoltageV: 400, detuningFactor: 0.07 });
    expect(perStep).toBeCloseTo(49.8, 1);
    expect(health.installedKvar).toBeCloseTo(2 * perStep, 6);
    const step = health.banks[0].steps[0];
    // [COMMON] §4: a 7 % step at 50 Hz is tuned to 189 Hz.
    expect(step.tuning.designTuningHz).toBeCloseTo(189.0, 1);
    expect(step.tuning.tuningHz).toBeCloseTo(189.0, 1);
    expect(step.tuning).toMatchObject({ fifthHarmonicHz: 250, tuningShifted: false });
    expect(health.banks[0].resonance).toEqual([]);

    const pdf = await app.request(`/api/sites/${siteId}/health/report.pdf`, { cookie: supervisor });
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await pdf.arrayBuffer()).subarray(0, 5).toString()).toBe('%PDF-');
  });

  test('resonance cases name step numbers, skipping a step with no unit in service', async () => {
    const siteId = await createSite(app.ctx, { transformerKva: 1000, transformerImpedancePct: 6 });
    const bankId = await addBank(siteId, { detuningFactor: null, steps: 3, unitKvar: 25, unitVoltageV: 400 });
    const [first] = await app.ctx.db.select().from(steps).where(eq(steps.bankId, bankId)).orderBy(steps.number).limit(1);
    await app.ctx.db.update(capacitorUnits).set({ removedOn: '2026-01-05' }).where(eq(capacitorUnits.stepId, first!.id));
    const health = await (await app.request(`/api/sites/${siteId}/health`, { cookie: supervisor })).json();
    const expected = bankResonance({ transformerKva: 1000, impedancePct: 6, stepsKvar: [25, 25] });
    expect(health.banks[0].resonance.map((r: { stepNumbers: number[] }) => r.stepNumbers)).toEqual([[2], [2, 3]]);
    expect(health.banks[0].resonance[1].order).toBeCloseTo(expected[1]!.order, 9);
    expect(health.banks[0].resonance[0]).not.toHaveProperty('stepsOn');
  });

  test('carries the site’s open flags, its overdue orders and the date of the newest reading', async () => {
    const { db } = app.ctx;
    const siteId = await createSite(app.ctx);
    const bankId = await addBank(siteId, { detuningFactor: null, steps: 2, unitKvar: 25, unitVoltageV: 400 });
    const units = await db
      .select({ id: capacitorUnits.id })
      .from(capacitorUnits)
      .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
      .where(eq(steps.bankId, bankId))
      .orderBy(steps.number);
    const bank = { siteId, bankId };
    const before = await (await app.request(`/api/sites/${siteId}/health`, { cookie: supervisor })).json();
    expect(before).toMatchObject({ newestReadingAt: null, openFlags: [], overdueOrders: [] });

    const overdue = await createWorkOrder(app.ctx, { bank, state: 'dispatched', dueOn: '2026-01-10', title: 'Half-yearly inspection' });
    await createWorkOrder(app.ctx, { bank, state: 'sealed', dueOn: '2026-01-05' });
    await createWorkOrder(app.ctx, { bank, state: 'withdrawn', dueOn: '2026-01-05' });
    await createWorkOrder(app.ctx, { bank, state: 'queued', dueOn: '2099-01-01' });
    const older = new Date('2026-05-02T09:15:00.000Z');
    const newer = new Date('2026-11-20T10:30:00.000Z');
    for (const [unit, at] of [
      [units[0]!, older],
      [units[1]!, newer],
    ] as const) {
      const readingId = await insertUnitReading(app.ctx, { workOrderId: overdue, unitId: unit.id, recordedById: supervisorId, deviationPct: -2, band: 'healthy', recordedAt: at });
      const legUF = ratedCapacitanceUF({ kvar: 25, voltageV: 400, frequencyHz: 50, connection: 'delta' }) * 0.98;
      await db.insert(unitLatestEvaluations).values({ unitId: unit.id, readingId, band: 'healthy', deviationPct: -2, kvarAtRated: 24.5, legsUF: [legUF, legUF, legUF], recordedAt: at });
    }
    const flag = (values: Partial<typeof flags.$inferInsert>) =>
      db
        .insert(flags)
        .values({ kind: 'replace', severity: 'action', siteId, bankId, target: 'capacitor-unit', targetId: units[0]!.id, message: 'Leg 1-2 reads near zero', raisedAt: new Date('2026-11-01T08:00:00Z'), ...values })
        .$returningId()
        .then(([row]) => row!.id);
    const open = await flag({});
    const inHand = await flag({ kind: 'blown-fuse', severity: 'action', target: 'bank', targetId: bankId, message: 'Fuse open', state: 'in-hand', raisedAt: new Date('2026-11-15T08:00:00Z') });
    await flag({ kind: 'watch', severity: 'advisory', state: 'cleared', clearedAt: new Date() });

    const health = await (await app.request(`/api/sites/${siteId}/health`, { cookie: supervisor })).json();
    expect(health.newestReadingAt).toBe(newer.toISOString());
    expect(health.overdueOrders).toEqual([{ id: overdue, title: 'Half-yearly inspection', dueOn: '2026-01-10', state: 'dispatched' }]);
    expect(health.openFlags.map((f: { id: number }) => f.id)).toEqual([inHand, open]);
    expect(health.openFlags[1]).toEqual({
      id: open,
      kind: 'replace',
      severity: 'action',
      bankId,
      bankName: expect.stringMatching(/^Bank /),
      target: 'capacitor-unit',
      targetId: units[0]!.id,
      message: 'Leg 1-2 reads near zero',
      state: 'open',
      correctiveOrderId: null,
      raisedAt: '2026-11-01T08:00:00.000Z',
    });
    expect(health.openFlags[0]).toMatchObject({ kind: 'blown-fuse', state: 'in-hand', target: 'bank' });

    // The PDF report lists them too.
    const pdf = await app.request(`/api/sites/${siteId}/health/report.pdf`, { cookie: supervisor });
    const text = pdfText(Buffer.from(await pdf.arrayBuffer()));
    expect(text).toContain('Open flags (2)');
    expect(text).toContain('Leg 1-2 reads near zero');
    expect(text).toContain('in hand');
    expect(text).toContain('Overdue orders (1)');
    expect(text).toContain(`#${overdue} Half-yearly inspection · due 2026-01-10 · dispatched`);
    expect(text).toContain('the newest taken 2026-11-20');
  });

  test('a site with no load known says so instead of guessing', async () => {
    const siteId = await createSite(app.ctx);
    await addBank(siteId, { detuningFactor: null, steps: 1, unitKvar: 25, unitVoltageV: 400 });
    const health = await (await app.request(`/api/sites/${siteId}/health`, { cookie: supervisor })).json();
    expect(health).toMatchObject({ load: null, reachedPf: null, missingKvar: null, triangle: null, cost: null });
  });

  test('a viewer of another site gets 404, an unknown site 404, a bad hours value 400', async () => {
    const granted = await createSite(app.ctx);
    const other = await createSite(app.ctx);
    const viewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [granted] });
    const cookie = await signIn(app, viewer.email, viewer.password);
    expect((await app.request(`/api/sites/${granted}/health`, { cookie })).status).toBe(200);
    expect((await app.request(`/api/sites/${other}/health`, { cookie })).status).toBe(404);
    expect((await app.request(`/api/sites/999999999/health`, { cookie: supervisor })).status).toBe(404);
    expect((await app.request(`/api/sites/${granted}/health?hoursPerMonth=-3`, { cookie: supervisor })).status).toBe(400);
  });
});

describe('the monthly site summary mail', () => {
  test('goes once a month to the supervisors and to the viewers granted the site, with a link', async () => {
    const { queueMonthlySummaries } = await import('../../apps/api/src/modules/site-health/monthly-summary');
    const { outbox } = await import('../../apps/api/src/db/schema/index');
    const { like } = await import('drizzle-orm');
    const siteId = await createSite(app.ctx, { plannedLoadKw: 500, plannedLoadPf: 0.8 });
    await addBank(siteId, { detuningFactor: null, steps: 2, unitKvar: 25, unitVoltageV: 400 });
    const viewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [siteId] });
    const when = new Date('2031-03-01T06:45:00Z'); // a month no other test uses
    const ofThisSite = () => app.ctx.db.select().from(outbox).where(like(outbox.kind, `site-summary:2031-03:${siteId}:%`));
    await queueMonthlySummaries(app.ctx, when);
    const rows = await ofThisSite();
    // A second run in the same month queues nothing more for this site (other files' sites in
    // the shared database may get their own first summary meanwhile).
    await queueMonthlySummaries(app.ctx, when);
    expect((await ofThisSite()).map((r) => r.id)).toEqual(rows.map((r) => r.id));
    expect(rows.length).toBeGreaterThan(0);
    const recipients = rows.map((r) => r.toAddress);
    expect(recipients).toContain(viewer.email);
    expect(new Set(recipients).size).toBe(recipients.length);
    const mail = rows.find((r) => r.toAddress === viewer.email)!;
    expect(mail.textBody).toContain(`${app.url}/sites/${siteId}/health`);
    expect(mail.textBody).toMatch(/Installed 50\.0 kvar, effective 50\.0 kvar, lost 0\.0 kvar/);
  });
});
