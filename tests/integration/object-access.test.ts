import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { photos, readings, workOrders } from '../../apps/api/src/db/schema/index';
import { createBankWithUnits, createUser, createWorkOrder, sessionCookieFor, type CreatedBank } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

// Object-level access, record by record: a viewer of one site reads nothing of another site's
// banks, orders, readings or photos; a technician records only on orders assigned to them; and a
// sealed order, with its readings and photos, is refused by the API and by the database alike.
let app: TestApp;
let own: CreatedBank;
let other: CreatedBank;
let ownOrder: number;
let otherOrder: number;
let otherPhotoId: number;
let otherReadingId: number;
let technicianId: number;
let technician: string;
let otherTechnician: string;
let planner: string;
let viewer: string;

const key = () => `k${randomUUID().replace(/-/g, '')}`;

beforeAll(async () => {
  app = await startTestApp();
  [own, other] = await Promise.all([createBankWithUnits(app.ctx), createBankWithUnits(app.ctx)]);
  const [tech, tech2, plan, view] = await Promise.all([
    createUser(app.ctx, { roles: ['technician'] }),
    createUser(app.ctx, { roles: ['technician'] }),
    createUser(app.ctx, { roles: ['planner'] }),
    createUser(app.ctx, { roles: ['viewer'], siteIds: [own.siteId] }),
  ]);
  technicianId = tech.user.id;
  [technician, otherTechnician, planner, viewer] = await Promise.all([
    sessionCookieFor(app.ctx, tech.user.id),
    sessionCookieFor(app.ctx, tech2.user.id),
    sessionCookieFor(app.ctx, plan.user.id),
    sessionCookieFor(app.ctx, view.user.id),
  ]);
  ownOrder = await createWorkOrder(app.ctx, { bank: own, state: 'on-site', assigneeId: technicianId });
  otherOrder = await createWorkOrder(app.ctx, { bank: other, state: 'on-site', assigneeId: technicianId });
  const reading = await app.request(`/api/work-orders/${otherOrder}/readings`, {
    json: { idempotencyKey: key(), target: 'bank', targetId: other.bankId, cleaningDone: true },
    cookie: technician,
  });
  expect(reading.status).toBe(201);
  otherReadingId = (await reading.json()).id;
  const form = new FormData();
  form.append('idempotencyKey', key());
  form.append('caption', 'Bank nameplate');
  const jpeg = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#806040' } }).jpeg().toBuffer();
  form.append('file', new Blob([new Uint8Array(jpeg)], { type: 'image/jpeg' }), 'IMG_0100.jpg');
  const photo = await app.request(`/api/work-orders/${otherOrder}/photos`, { method: 'POST', body: form, cookie: technician });
  expect(photo.status).toBe(201);
  otherPhotoId = (await photo.json()).id;
});
afterAll(async () => {
  await app.close();
});

describe('a viewer of one site', () => {
  test("reads their own site's records", async () => {
    for (const path of [`/api/sites/${own.siteId}`, `/api/banks/${own.bankId}`, `/api/steps/${own.stepIds[0]}`, `/api/capacitor-units/${own.unitIds[0]}`, `/api/work-orders/${ownOrder}`]) {
      const res = await app.request(path, { cookie: viewer });
      expect(res.status, path).toBe(200);
    }
  });

  test("reads nothing of another site: its site, bank, steps, units, orders, readings and photos look missing", async () => {
    const paths = [
      `/api/sites/${other.siteId}`,
      `/api/sites/${other.siteId}/health`,
      `/api/sites/${other.siteId}/health/report.pdf`,
      `/api/banks/${other.bankId}`,
      `/api/steps/${other.stepIds[0]}`,
      `/api/capacitor-units/${other.unitIds[0]}`,
      `/api/work-orders/${otherOrder}`,
      `/api/work-orders/${otherOrder}/readings`,
      `/api/work-orders/${otherOrder}/photos`,
      `/api/work-orders/${otherOrder}/record.pdf`,
      `/api/photos/${otherPhotoId}/display`,
      `/api/photos/${otherPhotoId}/thumbnail`,
    ];
    const answers: Record<string, number> = {};
    for (const path of paths) {
      const res = await app.request(path, { cookie: viewer });
      await res.body?.cancel();
      answers[path] = res.status;
    }
    expect(answers).toEqual(Object.fromEntries(paths.map((p) => [p, 404])));
  });

  test("finds none of another site's records in the lists", async () => {
    const lists = await Promise.all(
      [`/api/banks?siteId=${other.siteId}`, '/api/work-orders?pageSize=200', '/api/sites?pageSize=200', `/api/capacitor-units?bankId=${other.bankId}`].map(async (path) => {
        const res = await app.request(path, { cookie: viewer });
        return { path, status: res.status, text: await res.text() };
      }),
    );
    for (const { path, status, text } of lists) {
      expect([200, 404], path).toContain(status);
      if (status !== 200) continue;
      const items = (JSON.parse(text) as { items: Array<{ id: number; siteId?: number }> }).items;
      expect(items.every((i) => i.siteId === undefined || i.siteId === own.siteId), path).toBe(true);
    }
    const orders = JSON.parse(lists[1]!.text) as { items: Array<{ id: number }> };
    expect(orders.items.map((o) => o.id)).not.toContain(otherOrder);
    const sites = JSON.parse(lists[2]!.text) as { items: Array<{ id: number }> };
    expect(sites.items.map((s) => s.id)).toEqual([own.siteId]);
  });
});

describe('a technician', () => {
  test('cannot record a reading on an order not assigned to them: 403, nothing stored (photos: photos.test.ts)', async () => {
    const res = await app.request(`/api/work-orders/${ownOrder}/readings`, {
      json: { idempotencyKey: key(), target: 'bank', targetId: own.bankId, cleaningDone: true },
      cookie: otherTechnician,
    });
    expect(res.status).toBe(403);
    expect((await res.json()).error.code).toBeTypeOf('string');
    expect(await app.ctx.db.select().from(readings).where(eq(readings.workOrderId, ownOrder))).toEqual([]);
  });
});

describe('a sealed order', () => {
  test('is refused by the API and the database: no new reading or photo, no change or deletion of the order, its readings or photos', async () => {
    // Sealing as the supervisor's signature does it: the last change the order accepts.
    await app.ctx.db
      .update(workOrders)
      .set({ state: 'sealed', locked: true, signedAt: new Date(), signedByName: 'Test signer', signatureMeaning: 'Reviewed and approved' })
      .where(eq(workOrders.id, otherOrder));
    const [readingBefore] = await app.ctx.db.select().from(readings).where(eq(readings.id, otherReadingId));

    const reading = await app.request(`/api/work-orders/${otherOrder}/readings`, {
      json: { idempotencyKey: key(), target: 'bank', targetId: other.bankId, cleaningDone: false },
      cookie: technician,
    });
    expect(reading.status).toBe(409);
    expect((await reading.json()).error.code).toBe('locked');
    const [order] = await app.ctx.db.select().from(workOrders).where(eq(workOrders.id, otherOrder));
    const edit = await app.request(`/api/work-orders/${otherOrder}`, { method: 'PATCH', json: { dueOn: '2027-03-01', version: order!.version }, cookie: planner });
    expect(edit.status).toBe(409);
    expect((await edit.json()).error.code).toBe('locked');

    // Straight through the database, as a script or a console would: the triggers refuse.
    await expect(app.ctx.db.update(readings).set({ band: 'replace', deviationPct: -20 }).where(eq(readings.id, otherReadingId))).rejects.toThrow();
    await expect(app.ctx.db.delete(readings).where(eq(readings.id, otherReadingId))).rejects.toThrow();
    await expect(app.ctx.db.delete(photos).where(eq(photos.id, otherPhotoId))).rejects.toThrow();
    await expect(app.ctx.db.update(workOrders).set({ title: 'Rewritten' }).where(eq(workOrders.id, otherOrder))).rejects.toThrow();
    await expect(app.ctx.db.delete(workOrders).where(eq(workOrders.id, otherOrder))).rejects.toThrow();

    const [readingAfter] = await app.ctx.db.select().from(readings).where(eq(readings.id, otherReadingId));
    expect(readingAfter).toEqual(readingBefore);
    expect(await app.ctx.db.select({ id: photos.id }).from(photos).where(eq(photos.workOrderId, otherOrder))).toEqual([{ id: otherPhotoId }]);
    const [orderAfter] = await app.ctx.db.select().from(workOrders).where(eq(workOrders.id, otherOrder));
    expect(orderAfter).toEqual(order);
  });
});
