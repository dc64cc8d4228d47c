// Stored answers of heavy reads (apps/api/src/db/read-cache.ts): served only while no write
// has landed since they were computed, never across a quarter hour, never past a scope check.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { bumpReadRevision, quarterHourOf, readThrough } from '../../apps/api/src/db/read-cache';
import { readCache, readRevision } from '../../apps/api/src/db/schema/index';
import { createBankWithUnits, createUser, createWorkOrder, signIn } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;
let planner: string;

beforeAll(async () => {
  app = await startTestApp();
  const p = await createUser(app.ctx, { roles: ['planner'] });
  planner = await signIn(app, p.email, p.password);
});
afterAll(async () => {
  await app.close();
});

const revision = async () => (await app.ctx.db.select().from(readRevision).where(eq(readRevision.id, 1)))[0]!.revision;

async function getJson(path: string, cookie: string) {
  const res = await app.request(path, { cookie });
  return { status: res.status, body: res.status === 200 ? await res.json() : undefined, type: res.headers.get('content-type') };
}

describe('bumpReadRevision', () => {
  test('writers that call together share one UPDATE; one that calls while it is on its way waits for the next', async () => {
    const before = await revision();
    const together = Array.from({ length: 10 }, () => bumpReadRevision(app.ctx.db));
    expect(new Set(together).size).toBe(1);
    await Promise.all(together);
    const after = await revision();
    expect(after).toBeGreaterThan(before);

    const first = bumpReadRevision(app.ctx.db);
    await new Promise((resolve) => setImmediate(resolve)); // its UPDATE is on its way now
    const second = bumpReadRevision(app.ctx.db);
    expect(second).not.toBe(first);
    await second;
    // The second caller's write is behind a revision moved on after the first UPDATE's.
    expect(await revision()).toBeGreaterThanOrEqual(after + 2);
  });
});

describe('readThrough', () => {
  test('computes once per revision and quarter hour, then again after a write or when the quarter hour ends', async () => {
    const key = unique('test-key');
    let computed = 0;
    const compute = async () => ({ value: { n: ++computed }, siteId: 7 });
    const at = new Date('2026-12-02T10:05:00Z');

    expect(JSON.parse((await readThrough(app.ctx.db, key, compute, at)).body.toString())).toEqual({ n: 1 });
    const again = await readThrough(app.ctx.db, key, compute, new Date('2026-12-02T10:14:59Z'));
    expect({ ...again, body: again.body.toString() }).toEqual({ body: '{"n":1}', siteId: 7 });
    expect(computed).toBe(1);

    // The next quarter hour: an answer saying "overdue" may have changed with the date somewhere.
    expect(quarterHourOf(new Date('2026-12-02T10:15:00Z'))).toBe('2026-12-02T10:15');
    expect(JSON.parse((await readThrough(app.ctx.db, key, compute, new Date('2026-12-02T10:15:00Z'))).body.toString())).toEqual({ n: 2 });

    await bumpReadRevision(app.ctx.db);
    expect(JSON.parse((await readThrough(app.ctx.db, key, compute, new Date('2026-12-02T10:16:00Z'))).body.toString())).toEqual({ n: 3 });
    expect(computed).toBe(3);
  });

  test('an answer computed while a write lands is stored with the revision before it, so it is never served', async () => {
    const key = unique('test-key');
    let computed = 0;
    const slowCompute = async () => {
      computed += 1;
      // A write commits while this answer is being computed.
      if (computed === 1) await bumpReadRevision(app.ctx.db);
      return { value: { n: computed }, siteId: null };
    };
    await readThrough(app.ctx.db, key, slowCompute);
    const [stored] = await app.ctx.db.select().from(readCache).where(eq(readCache.cacheKey, key));
    expect(stored!.revision).toBe((await revision()) - 1);
    expect(JSON.parse((await readThrough(app.ctx.db, key, slowCompute)).body.toString())).toEqual({ n: 2 });
  });

  test('reads that arrive together share one check of the revision, and a write before them is seen by all', async () => {
    const key = unique('test-key');
    let computed = 0;
    const compute = async () => ({ value: { n: ++computed }, siteId: null });
    await readThrough(app.ctx.db, key, compute);
    const together = await Promise.all(Array.from({ length: 8 }, () => readThrough(app.ctx.db, key, compute)));
    expect(together.map((a) => a.body.toString())).toEqual(Array(8).fill('{"n":1}'));
    await bumpReadRevision(app.ctx.db);
    const after = await Promise.all(Array.from({ length: 8 }, () => readThrough(app.ctx.db, key, compute)));
    expect(new Set(after.map((a) => JSON.parse(a.body.toString()).n)).has(1)).toBe(false);
  });

  test('readers of one key that all miss wait for one computation of it', async () => {
    const key = unique('test-key');
    let computed = 0;
    const compute = async () => {
      computed += 1;
      await new Promise((resolve) => setTimeout(resolve, 100));
      return { value: { n: computed }, siteId: null };
    };
    const answers = await Promise.all(Array.from({ length: 6 }, () => readThrough(app.ctx.db, key, compute)));
    expect(computed).toBe(1);
    expect(answers.map((a) => a.body.toString())).toEqual(Array(6).fill('{"n":1}'));
  });
});

describe('through the API', () => {
  test("a site's health is served as stored until a write through the API changes it", async () => {
    const bank = await createBankWithUnits(app.ctx, { steps: 1 });
    const orderId = await createWorkOrder(app.ctx, { bank, dueOn: '2099-01-01' });
    const path = `/api/sites/${bank.siteId}/health`;

    const first = await getJson(path, planner);
    expect(first.status).toBe(200);
    expect(first.type).toMatch(/^application\/json/);
    expect(first.body.overdueOrders).toEqual([]);
    const before = await revision();
    expect((await getJson(path, planner)).body).toEqual(first.body);
    expect(await revision()).toBe(before);

    // A refused write (400: no version) changes nothing and moves nothing.
    const refused = await app.request(`/api/work-orders/${orderId}`, { method: 'PATCH', cookie: planner, json: { dueOn: '2020-01-01' } });
    expect(refused.status).toBe(400);
    expect(await revision()).toBe(before);

    const moved = await app.request(`/api/work-orders/${orderId}`, { method: 'PATCH', cookie: planner, json: { version: 1, dueOn: '2020-01-01' } });
    expect(moved.status).toBe(200);
    expect(await revision()).toBeGreaterThan(before);
    const after = await getJson(path, planner);
    expect(after.body.overdueOrders.map((o: { id: number }) => o.id)).toEqual([orderId]);
  });

  test('a stored page of work orders changes with the order it lists', async () => {
    const bank = await createBankWithUnits(app.ctx, { steps: 1 });
    const orderId = await createWorkOrder(app.ctx, { bank, title: 'Before' });
    const path = `/api/work-orders?siteId=${bank.siteId}`;
    expect((await getJson(path, planner)).body.items.map((o: { title: string }) => o.title)).toEqual(['Before']);
    const renamed = await app.request(`/api/work-orders/${orderId}`, { method: 'PATCH', cookie: planner, json: { version: 1, title: 'After' } });
    expect(renamed.status).toBe(200);
    expect((await getJson(path, planner)).body.items.map((o: { title: string }) => o.title)).toEqual(['After']);
  });

  test("a unit's stored history is refused to a viewer of another site, as if the unit did not exist", async () => {
    const bank = await createBankWithUnits(app.ctx, { steps: 1 });
    const other = await createBankWithUnits(app.ctx, { steps: 1 });
    const path = `/api/capacitor-units/${bank.unitIds[0]}/readings`;
    expect((await getJson(path, planner)).status).toBe(200); // now stored
    const viewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [other.siteId] });
    const cookie = await signIn(app, viewer.email, viewer.password);
    const refused = await app.request(path, { cookie });
    expect(refused.status).toBe(404);
    expect((await refused.json()).error.message).toBe(`Capacitor unit ${bank.unitIds[0]} does not exist.`);
    const granted = await createUser(app.ctx, { roles: ['viewer'], siteIds: [bank.siteId] });
    expect((await getJson(path, await signIn(app, granted.email, granted.password))).status).toBe(200);
  });
});
