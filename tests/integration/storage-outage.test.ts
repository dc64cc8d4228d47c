import { randomUUID } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { HeadObjectCommand, ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { photos } from '../../apps/api/src/db/schema/index';
import { freePort, startStandaloneS3 } from '../../scripts/lib/services.mjs';
import { createStepWithUnits, createUser, createWorkOrder, sessionCookieFor } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

// The S3 fake really stops while the API runs, and comes back on the same port and files: an
// upload during the outage gets 503 quickly and leaves no row pointing at a missing object; the
// same API process, not restarted, stores photos again once the store is back. An S3 fake of its
// own, so the other test files keep theirs.
let dir: string;
let store: Awaited<ReturnType<typeof startStandaloneS3>>;
let app: TestApp;
let s3: S3Client;
let jpeg: Buffer;

beforeAll(async () => {
  dir = await mkdtemp(path.join(os.tmpdir(), 'varden-s3-outage-'));
  store = await startStandaloneS3({ dataDir: dir, port: await freePort() });
  app = await startTestApp({ S3_ENDPOINT: store.endpoint, S3_BUCKET: store.bucket });
  const c = app.ctx.config;
  s3 = new S3Client({
    region: c.S3_REGION,
    endpoint: store.endpoint,
    forcePathStyle: true,
    credentials: { accessKeyId: c.S3_ACCESS_KEY_ID, secretAccessKey: c.S3_SECRET_ACCESS_KEY },
  });
  jpeg = await sharp({ create: { width: 1200, height: 900, channels: 3, background: '#3060a0' } }).jpeg({ quality: 85 }).toBuffer();
}, 60_000);

afterAll(async () => {
  s3?.destroy();
  await app?.close();
  await store?.stop();
  if (dir) await rm(dir, { recursive: true, force: true });
});

async function upload(orderId: number, cookie: string) {
  const form = new FormData();
  form.append('idempotencyKey', `p${randomUUID().replace(/-/g, '')}`);
  form.append('caption', 'Step 1 terminals');
  form.append('file', new Blob([new Uint8Array(jpeg)], { type: 'image/jpeg' }), 'IMG_2041.jpg');
  const started = Date.now();
  const res = await app.request(`/api/work-orders/${orderId}/photos`, { method: 'POST', body: form, cookie });
  return { status: res.status, body: await res.json(), ms: Date.now() - started };
}

/** Every photo row of the order, and whether both of its objects exist in the store. */
async function rowsAndObjects(orderId: number) {
  const rows = await app.ctx.db.select().from(photos).where(eq(photos.workOrderId, orderId));
  const missing: string[] = [];
  for (const row of rows) {
    for (const key of [row.displayKey, row.thumbnailKey]) {
      await s3.send(new HeadObjectCommand({ Bucket: store.bucket, Key: key })).catch(() => missing.push(key));
    }
  }
  const listed = await s3.send(new ListObjectsV2Command({ Bucket: store.bucket, Prefix: `photos/${orderId}/` }));
  return { rows: rows.length, objects: listed.KeyCount ?? 0, missing };
}

test('S3 stopped: upload 503 quickly, no row without its objects; back on the same port: the same API stores again', async () => {
  const technician = await createUser(app.ctx, { roles: ['technician'] });
  const step = await createStepWithUnits(app.ctx);
  const orderId = await createWorkOrder(app.ctx, { bank: step, state: 'on-site', assigneeId: technician.user.id });
  const cookie = await sessionCookieFor(app.ctx, technician.user.id);

  const before = await upload(orderId, cookie);
  expect(before.status).toBe(201);
  expect(await rowsAndObjects(orderId)).toEqual({ rows: 1, objects: 2, missing: [] });

  await store.stop();
  const during = await upload(orderId, cookie);
  expect(during.status).toBe(503);
  expect(during.body.error).toMatchObject({ code: 'unavailable', message: expect.stringMatching(/Photo storage/) });
  expect(during.ms, 'answered quickly, not hanging').toBeLessThan(10_000);
  const health = await app.request('/api/health');
  expect(health.status).toBe(503);
  expect((await health.json()).services.storage.status).toBe('down');
  const rowsDuring = await app.ctx.db.select({ id: photos.id }).from(photos).where(eq(photos.workOrderId, orderId));
  expect(rowsDuring, 'no row for the refused upload').toEqual([{ id: before.body.id }]);

  const downAt = Date.now();
  await store.restart();
  // The same process, not restarted: the next upload goes through.
  let after = await upload(orderId, cookie);
  while (after.status === 503 && Date.now() - downAt < 20_000) {
    await new Promise((r) => setTimeout(r, 250));
    after = await upload(orderId, cookie);
  }
  console.log(`storage outage figures ${JSON.stringify({ uploadDuringOutageMs: during.ms, recoveredAfterRestartMs: Date.now() - downAt })}`);
  expect(after.status).toBe(201);
  expect(await rowsAndObjects(orderId)).toEqual({ rows: 2, objects: 4, missing: [] });
  // The photo stored before the outage is still served.
  const shown = await app.request(before.body.thumbnailUrl, { cookie });
  expect(shown.status).toBe(200);
  expect(shown.headers.get('content-type')).toBe('image/webp');
}, 90_000);
