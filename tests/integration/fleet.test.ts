import { projectDrift } from '@varden/engineering';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { banks, capacitorUnits, flags, readings, steps, unitLatestEvaluations, workOrders } from '../../apps/api/src/db/schema/index';
import type { FleetOverview } from '@varden/schemas';
import { fleetListLimit } from '../../apps/api/src/modules/fleet/service';
import { createBankWithUnits, createSite, createUser, createWorkOrder, signIn, startIsolatedTestApp } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;
let planner: string;
let technicianId: number;

beforeAll(async () => {
  app = await startTestApp();
  const p = await createUser(app.ctx, { roles: ['planner'] });
  planner = await signIn(app, p.email, p.password);
  technicianId = (await createUser(app.ctx, { roles: ['technician'] })).user.id;
});
afterAll(async () => {
  await app.close();
});

/** A site with one bank, one step and `units` units, and an order to hang readings on. */
async function siteWithUnits(units: number, dueOn = '2026-06-01') {
  const { db } = app.ctx;
  const siteId = await createSite(app.ctx, { name: unique('Fleet site') });
  const [bank] = await db.insert(banks).values({ siteId, name: 'Bank A' }).$returningId();
  const [step] = await db.insert(steps).values({ bankId: bank!.id, number: 1, ratedKvar: 50 }).$returningId();
  const unitIds: number[] = [];
  for (let position = 1; position <= units; position++) {
    const [u] = await db
      .insert(capacitorUnits)
      .values({ stepId: step!.id, position, nameplateKvar: 25, nameplateVoltageV: 400, nameplateFrequencyHz: 50, connection: 'delta', capacitanceUF: 165.79 })
      .$returningId();
    unitIds.push(u!.id);
  }
  const [order] = await db
    .insert(workOrders)
    .values({ kind: 'inspection', siteId, bankId: bank!.id, title: 'Half-yearly inspection', instructions: '', checklist: ['capacitance'], dueOn, state: 'on-site', assigneeId: technicianId })
    .$returningId();
  return { siteId, bankId: bank!.id, stepId: step!.id, unitIds, orderId: order!.id };
}

async function addReading(orderId: number, unitId: number, recordedAt: string, deviationPct: number, band: 'healthy' | 'watch' | 'replace') {
  const { db } = app.ctx;
  const [r] = await db
    .insert(readings)
    .values({
      workOrderId: orderId,
      idempotencyKey: unique('key').replace(/[^A-Za-z0-9_-]/g, ''),
      target: 'capacitor-unit',
      targetId: unitId,
      input: {},
      evaluation: {},
      engineeringVersion: 'test',
      band,
      deviationPct,
      recordedById: technicianId,
      recordedAt: new Date(recordedAt),
    })
    .$returningId();
  return r!.id;
}

describe('GET /api/fleet', () => {
  test('its lists carry the most urgent entries only; each site row still counts all of its own', async () => {
    // A database of its own: the orders made here would crowd other files' orders out of the list.
    const own = await startIsolatedTestApp('fleet_lists');
    try {
      const p = await createUser(own.ctx, { roles: ['planner'] });
      const cookie = await signIn(own, p.email, p.password);
      const bank = await createBankWithUnits(own.ctx, { steps: 1 });
      const dueDates: string[] = [];
      for (let i = 0; i <= fleetListLimit; i++) {
        const dueOn = new Date(Date.UTC(2021, 0, 1 + i)).toISOString().slice(0, 10);
        dueDates.push(dueOn);
        await createWorkOrder(own.ctx, { bank, dueOn, title: unique('Overdue') });
      }
      const res = await own.request('/api/fleet', { cookie });
      expect(res.status).toBe(200);
      const fleet = (await res.json()) as FleetOverview;
      const row = fleet.sites.find((s) => s.siteId === bank.siteId)!;
      expect(row.overdueOrders).toBe(fleetListLimit + 1);
      // The longest overdue first; the last one made (the most recent due date) is left out.
      expect(fleet.overdueOrders.map((o) => o.dueOn)).toEqual(dueDates.slice(0, fleetListLimit));
    } finally {
      await own.close();
    }
  }, 60_000);

  test('ranks sites by risk, counts bands, projects replacements from drift and lists overdue orders', async () => {
    const { db } = app.ctx;
    const risky = await siteWithUnits(2, '2026-01-10');
    const calm = await siteWithUnits(1, '2099-01-01');

    // A unit losing 3 %/year: −3 % two years ago, −6 % a year ago, −8.9 % now → below −10 % within months.
    const history = [
      ['2024-12-01T00:00:00Z', -3],
      ['2025-12-01T00:00:00Z', -6],
      ['2026-11-20T00:00:00Z', -8.9],
    ] as const;
    let last = 0;
    for (const [at, dev] of history) last = await addReading(risky.orderId, risky.unitIds[0]!, at, dev, dev < -5 ? 'watch' : 'healthy');
    // The drift the readings service fits and stores beside the latest evaluation (refreshUnitDrift).
    const expected = projectDrift({ points: history.map(([date, deviationPct]) => ({ date, deviationPct })), replaceBelowPct: -10 });
    await db.insert(unitLatestEvaluations).values({
      unitId: risky.unitIds[0]!,
      readingId: last,
      band: 'watch',
      deviationPct: -8.9,
      kvarAtRated: 22.8,
      legsUF: [151, 151, 151],
      recordedAt: new Date(history[2][0]),
      driftRatePctPerYear: expected.ratePctPerYear,
      replaceBy: expected.replaceBy,
    });
    const failed = await addReading(risky.orderId, risky.unitIds[1]!, '2026-11-20T00:00:00Z', -33, 'replace');
    await db.insert(unitLatestEvaluations).values({ unitId: risky.unitIds[1]!, readingId: failed, band: 'replace', deviationPct: -33, kvarAtRated: 16.7, legsUF: [165, 165, 2] , recordedAt: new Date('2026-11-20T00:00:00Z') });
    await db.insert(flags).values({ kind: 'replace', severity: 'action', siteId: risky.siteId, bankId: risky.bankId, target: 'capacitor-unit', targetId: risky.unitIds[1]!, message: 'Leg 3-1 reads near zero', raisedAt: new Date() });

    const res = await app.request('/api/fleet', { cookie: planner });
    expect(res.status).toBe(200);
    const fleet = await res.json();
    const ours = fleet.sites.filter((s: { siteId: number }) => s.siteId === risky.siteId || s.siteId === calm.siteId);
    expect(ours.map((s: { siteId: number }) => s.siteId)).toEqual([risky.siteId, calm.siteId]);
    const top = ours[0];
    expect(top.bands).toEqual({ healthy: 0, watch: 1, replace: 1, remeasure: 0, noReading: 0 });
    expect(top).toMatchObject({ openActionFlags: 1, overdueOrders: 1, projectedReplacements: 1 });
    // Risk points (common practice weights): replace 10 + action flag 5 + overdue 3 + watch 1.
    expect(top.risk).toBe(19);
    expect(ours[1]).toMatchObject({ risk: 0, bands: { noReading: 1 } });

    const projection = fleet.projectedReplacements.find((p: { unitId: number }) => p.unitId === risky.unitIds[0]);
    expect(projection).toMatchObject({ unitId: risky.unitIds[0], siteId: risky.siteId, bankId: risky.bankId, stepId: risky.stepId, stepNumber: 1, position: 1 });
    expect(projection.ratePctPerYear).toBeCloseTo(expected.ratePctPerYear, 9);
    expect(projection.replaceBy).toBe(expected.replaceBy!.slice(0, 10));
    expect(fleet.overdueOrders.map((o: { id: number }) => o.id)).toContain(risky.orderId);
    expect(fleet.overdueOrders.map((o: { id: number }) => o.id)).not.toContain(calm.orderId);

    const csv = await app.request('/api/fleet/export.csv', { cookie: planner });
    expect(csv.headers.get('content-type')).toContain('text/csv');
    const text = await csv.text();
    expect(text.split('\r\n')[0]).toBe(
      'site,risk,replace,watch,remeasure,healthy,no_reading,open_action_flags,steps_near_harmonic,overdue_orders,projected_replacements_12_months',
    );
  });

  test('a viewer sees only their granted sites', async () => {
    const mine = await siteWithUnits(1);
    await siteWithUnits(1);
    const viewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [mine.siteId] });
    const cookie = await signIn(app, viewer.email, viewer.password);
    const fleet = await (await app.request('/api/fleet', { cookie })).json();
    expect(fleet.sites.map((s: { siteId: number }) => s.siteId)).toEqual([mine.siteId]);
  });
});
