// The points a unit's drift is fitted over, kept beside its latest evaluation
// (unit_latest_evaluations.drift_points): a reading fits its drift from them and itself, never
// reading the history; a row without them (stored by an older version) falls back to the
// history; and migration 0008's backfill gives the points the service keeps. On a database of
// its own, since the backfill rewrites every unit's row.
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { projectDrift } from '@varden/engineering';
import { and, eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { readings, unitLatestEvaluations } from '../../apps/api/src/db/schema/index';
import { createStepWithUnits, createUser, createWorkOrder, sessionCookieFor, startIsolatedTestApp } from '../support/factories';
import type { TestApp } from '../support/test-app';

let app: TestApp;
let tech: { id: number; cookie: string };

beforeAll(async () => {
  app = await startIsolatedTestApp('drift_points');
  const t = await createUser(app.ctx, { roles: ['technician'] });
  tech = { id: t.user.id, cookie: await sessionCookieFor(app.ctx, t.user.id) };
});
afterAll(async () => {
  await app.close();
});

/** The window the service fits over: 5 × 365.25 days before the unit's latest reading. */
const windowMs = 5 * 365.25 * 86_400_000;
const w50 = 2 * Math.PI * 50;
// C per delta leg for 50 kvar at 400 V, 50 Hz: Q = 3·ω·C·U² (engineering-reference.md §1, 331.57 µF).
const legUF = (50e3 / (3 * w50 * 400 * 400)) * 1e6;
const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000);

async function unitOnSite() {
  const step = await createStepWithUnits(app.ctx);
  const orderId = await createWorkOrder(app.ctx, { bank: step, state: 'on-site', assigneeId: tech.id, kind: 'inspection' });
  return { orderId, unitId: step.unitIds[0]! };
}

async function record(orderId: number, unitId: number, share: number, at: Date) {
  const res = await app.request(`/api/work-orders/${orderId}/readings`, {
    method: 'POST',
    json: { idempotencyKey: `d${randomUUID().replace(/-/g, '')}`, target: 'capacitor-unit', targetId: unitId, method: 'per-element', elementsUF: [1, 1, 1].map(() => share * legUF), recordedAt: at.toISOString() },
    cookie: tech.cookie,
  });
  expect(res.status).toBe(201);
}

const latestOf = async (unitId: number) => (await app.ctx.db.select().from(unitLatestEvaluations).where(eq(unitLatestEvaluations.unitId, unitId)))[0]!;

/** The unit's readings in the window before its latest, from the history itself, as the column keeps them. */
async function windowFromHistory(unitId: number) {
  const latest = await latestOf(unitId);
  const rows = await app.ctx.db
    .select({ recordedAt: readings.recordedAt, deviationPct: readings.deviationPct })
    .from(readings)
    .where(and(eq(readings.target, 'capacitor-unit'), eq(readings.targetId, unitId)));
  return rows
    .filter((r) => r.deviationPct !== null && r.recordedAt.getTime() <= latest.recordedAt.getTime() && r.recordedAt.getTime() >= latest.recordedAt.getTime() - windowMs)
    .sort((a, b) => a.recordedAt.getTime() - b.recordedAt.getTime())
    .map((r) => [r.recordedAt.getTime(), r.deviationPct!] as [number, number]);
}

const fitOf = (points: Array<[number, number]>) =>
  projectDrift({ points: points.map(([ms, deviationPct]) => ({ date: new Date(ms).toISOString(), deviationPct })), replaceBelowPct: -10 });

describe("a unit's drift points", () => {
  test('are kept beside its latest evaluation: the window up to its latest reading, oldest first, whatever order readings arrive in', async () => {
    const { orderId, unitId } = await unitOnSite();
    await record(orderId, unitId, 1.01, daysAgo(8 * 365)); // outside the window once later ones are stored
    expect((await latestOf(unitId)).driftPoints).toEqual(await windowFromHistory(unitId));
    await record(orderId, unitId, 0.97, daysAgo(900));
    await record(orderId, unitId, 0.92, daysAgo(2));
    await record(orderId, unitId, 0.95, daysAgo(400)); // late from a phone without signal
    const latest = await latestOf(unitId);
    const expected = await windowFromHistory(unitId);
    expect(expected).toHaveLength(3);
    expect(latest.driftPoints).toEqual(expected);
    // projectDrift (packages/engineering, its own tests cite the least-squares fit) over the history's window.
    expect(latest.driftRatePctPerYear).toBeCloseTo(fitOf(expected).ratePctPerYear, 9);
  });

  test('missing on a row stored by an older version are read from the history by the next reading, and kept again', async () => {
    const { orderId, unitId } = await unitOnSite();
    await record(orderId, unitId, 0.99, daysAgo(1000));
    await record(orderId, unitId, 0.96, daysAgo(500));
    await app.ctx.db.update(unitLatestEvaluations).set({ driftPoints: null }).where(eq(unitLatestEvaluations.unitId, unitId));
    await record(orderId, unitId, 0.93, daysAgo(3));
    const latest = await latestOf(unitId);
    const expected = await windowFromHistory(unitId);
    expect(expected).toHaveLength(3);
    expect(latest.driftPoints).toEqual(expected);
    expect(latest.driftRatePctPerYear).toBeCloseTo(fitOf(expected).ratePctPerYear, 9);
  });

  test("migration 0008's backfill gives every unit the points the service keeps", async () => {
    const { orderId, unitId } = await unitOnSite();
    for (const [share, days] of [[1.0, 7 * 365], [0.98, 1500], [0.95, 700], [0.9, 5]] as const) await record(orderId, unitId, share, daysAgo(days));
    const before = await app.ctx.db.select({ unitId: unitLatestEvaluations.unitId, points: unitLatestEvaluations.driftPoints }).from(unitLatestEvaluations);
    expect(before.length).toBeGreaterThanOrEqual(3);
    await app.ctx.db.update(unitLatestEvaluations).set({ driftPoints: null });
    const migration = readFileSync(path.join(__dirname, '../../drizzle/0008_drift-points.sql'), 'utf8');
    const [alter, ...backfill] = migration.split('--> statement-breakpoint');
    expect(alter).toMatch(/ADD `drift_points` json/);
    expect(backfill).toHaveLength(2);
    for (const statement of backfill) await app.ctx.db.execute(sql.raw(statement));
    const after = new Map((await app.ctx.db.select({ unitId: unitLatestEvaluations.unitId, points: unitLatestEvaluations.driftPoints }).from(unitLatestEvaluations)).map((r) => [r.unitId, r.points]));
    for (const { unitId: id, points } of before) {
      const filled = after.get(id)!;
      expect(filled.map(([ms]) => ms)).toEqual(points!.map(([ms]) => ms));
      // MariaDB writes a double into JSON with fewer digits than JavaScript does.
      filled.forEach(([, deviation], i) => expect(deviation).toBeCloseTo(points![i]![1], 9));
    }
    expect(after.get(unitId)).toHaveLength(3);
  });
});
