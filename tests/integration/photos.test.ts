import { randomUUID } from 'node:crypto';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { count, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { photos } from '../../apps/api/src/db/schema/index';
import { createStepWithUnits, createUser, createWorkOrder, sessionCookieFor } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

let app: TestApp;
let s3: S3Client;
let tech: { id: number; cookie: string };
let otherTech: string;
let planner: string;
/** A 2000 × 1500 JPEG stored sideways (EXIF orientation 6) with a GPS position in its EXIF. */
let phoneJpeg: Buffer;

const key = () => `p${randomUUID().replace(/-/g, '')}`;

beforeAll(async () => {
  app = await startTestApp();
  const c = app.ctx.config;
  s3 = new S3Client({
    region: c.S3_REGION,
    ...(c.S3_ENDPOINT ? { endpoint: c.S3_ENDPOINT } : {}),
    forcePathStyle: c.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: c.S3_ACCESS_KEY_ID, secretAccessKey: c.S3_SECRET_ACCESS_KEY },
  });
  const [t1, t2, p] = await Promise.all([
    createUser(app.ctx, { roles: ['technician'] }),
    createUser(app.ctx, { roles: ['technician'] }),
    createUser(app.ctx, { roles: ['planner'] }),
  ]);
  tech = { id: t1.user.id, cookie: await sessionCookieFor(app.ctx, t1.user.id) };
  otherTech = await sessionCookieFor(app.ctx, t2.user.id);
  planner = await sessionCookieFor(app.ctx, p.user.id);
  // Stored pixels: red on the left half, blue on the right. Shown upright (turned 90° clockwise
  // for orientation 6), the red half is on top.
  const red = await sharp({ create: { width: 1000, height: 1500, channels: 3, background: '#ff0000' } }).png().toBuffer();
  phoneJpeg = await sharp({ create: { width: 2000, height: 1500, channels: 3, background: '#0000ff' } })
    .composite([{ input: red, left: 0, top: 0 }])
    .jpeg({ quality: 90 })
    .withMetadata({ orientation: 6 })
    .withExif({ IFD0: { Make: 'VardenTestCam' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' } })
    .toBuffer();
});
afterAll(async () => {
  s3.destroy();
  await app.close();
});

async function onSiteOrder(state: 'on-site' | 'sealed' = 'on-site') {
  const step = await createStepWithUnits(app.ctx);
  const orderId = await createWorkOrder(app.ctx, { bank: step, state, assigneeId: tech.id });
  return { ...step, orderId };
}

async function upload(
  target: TestApp,
  orderId: number,
  options: { file?: Buffer; name?: string; type?: string; fields?: Record<string, string>; cookie?: string } = {},
) {
  const form = new FormData();
  const fields = { idempotencyKey: key(), caption: 'Unit 1 nameplate', ...options.fields };
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  if (options.file) form.append('file', new Blob([new Uint8Array(options.file)], { type: options.type ?? 'image/jpeg' }), options.name ?? 'IMG_0001.jpg');
  const res = await target.request(`/api/work-orders/${orderId}/photos`, { method: 'POST', body: form, cookie: options.cookie ?? tech.cookie });
  return { status: res.status, body: await res.json(), fields };
}

async function storedFor(orderId: number) {
  const [rows] = await app.ctx.db.select({ n: count() }).from(photos).where(eq(photos.workOrderId, orderId));
  const listed = await s3.send(new ListObjectsV2Command({ Bucket: app.ctx.config.S3_BUCKET, Prefix: `photos/${orderId}/` }));
  return { rows: rows!.n, objects: listed.KeyCount ?? 0 };
}

async function download(path: string, cookie: string) {
  const res = await app.request(path, { cookie });
  return { res, data: Buffer.from(await res.arrayBuffer()) };
}

describe('a photo from the phone', () => {
  test('is stored upright at display and thumbnail size, without EXIF or GPS, and served privately', async () => {
    const source = await sharp(phoneJpeg).metadata();
    expect(source).toMatchObject({ format: 'jpeg', width: 2000, height: 1500, orientation: 6 });
    expect(source.exif?.toString('latin1')).toContain('VardenTestCam');

    const { orderId } = await onSiteOrder();
    const res = await upload(app, orderId, { file: phoneJpeg });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      workOrderId: orderId,
      readingId: null,
      target: null,
      caption: 'Unit 1 nameplate',
      widthPx: 1200,
      heightPx: 1600,
      displayUrl: `/api/photos/${res.body.id}/display`,
      thumbnailUrl: `/api/photos/${res.body.id}/thumbnail`,
    });

    const display = await download(res.body.displayUrl, tech.cookie);
    expect(display.res.status).toBe(200);
    expect(display.res.headers.get('content-type')).toBe('image/webp');
    expect(display.res.headers.get('cache-control')).toMatch(/^private/);
    const meta = await sharp(display.data).metadata();
    expect(meta).toMatchObject({ format: 'webp', width: 1200, height: 1600 });
    expect(meta.exif).toBeUndefined();
    expect(meta.orientation).toBeUndefined();
    expect(display.data.toString('latin1')).not.toContain('VardenTestCam');
    const pixel = async (x: number, y: number) => {
      const { data } = await sharp(display.data).extract({ left: x, top: y, width: 1, height: 1 }).raw().toBuffer({ resolveWithObject: true });
      return [...data.subarray(0, 3)];
    };
    const [topR, , topB] = await pixel(600, 200);
    const [bottomR, , bottomB] = await pixel(600, 1400);
    expect(topR).toBeGreaterThan(200);
    expect(topB).toBeLessThan(60);
    expect(bottomB).toBeGreaterThan(200);
    expect(bottomR).toBeLessThan(60);

    const thumb = await download(res.body.thumbnailUrl, planner);
    expect(thumb.res.status).toBe(200);
    expect(await sharp(thumb.data).metadata()).toMatchObject({ format: 'webp', width: 240, height: 320 });
    expect(await storedFor(orderId)).toEqual({ rows: 1, objects: 2 });

    const list = await (await app.request(`/api/work-orders/${orderId}/photos`, { cookie: planner })).json();
    expect(list).toEqual({ items: [res.body], total: 1 });
  });

  test('a retry with the same key returns the stored photo and stores nothing more', async () => {
    const { orderId } = await onSiteOrder();
    const idempotencyKey = key();
    const first = await upload(app, orderId, { file: phoneJpeg, fields: { idempotencyKey } });
    const second = await upload(app, orderId, { file: phoneJpeg, fields: { idempotencyKey } });
    expect([first.status, second.status]).toEqual([201, 200]);
    expect(second.body).toEqual(first.body);
    expect(await storedFor(orderId)).toEqual({ rows: 1, objects: 2 });
  });

  test('a path-traversal file name is ignored: the object key is the order and a random id', async () => {
    const { orderId } = await onSiteOrder();
    const res = await upload(app, orderId, { file: phoneJpeg, name: '../../../etc/passwd.jpg' });
    expect(res.status).toBe(201);
    const [row] = await app.ctx.db.select().from(photos).where(eq(photos.id, res.body.id));
    expect(row!.displayKey).toMatch(new RegExp(`^photos/${orderId}/[0-9a-f-]{36}-display\\.webp$`));
    expect(row!.thumbnailKey).toMatch(new RegExp(`^photos/${orderId}/[0-9a-f-]{36}-thumbnail\\.webp$`));
  });

  test.each([
    '..\\..\\windows\\system32\\config.jpg',
    '/etc/shadow.jpg',
    '%2e%2e%2f%2e%2e%2fphotos%2f1%2fx-display.webp',
    `photos/${'../'.repeat(40)}x.jpg`,
  ])('a traversal name %j never reaches the store: only keys of this order, made by the server', async (name) => {
    const { orderId } = await onSiteOrder();
    const res = await upload(app, orderId, { file: phoneJpeg, name });
    expect(res.status).toBe(201);
    expect(JSON.stringify(res.body)).not.toContain(name);
    const listed = await s3.send(new ListObjectsV2Command({ Bucket: app.ctx.config.S3_BUCKET, Prefix: `photos/${orderId}/` }));
    const keys = (listed.Contents ?? []).map((o) => o.Key!);
    expect(keys).toHaveLength(2);
    for (const stored of keys) expect(stored).toMatch(new RegExp(`^photos/${orderId}/[0-9a-f-]{36}-(display|thumbnail)\\.webp$`));
  });

  test('a file name with a NUL byte is refused with 400 and nothing stored', async () => {
    const { orderId } = await onSiteOrder();
    const res = await upload(app, orderId, { file: phoneJpeg, name: 'photo.jpg\u0000.svg' });
    expect({ status: res.status, code: res.body.error?.code }).toEqual({ status: 400, code: 'invalid' });
    expect(typeof res.body.error.message).toBe('string');
    expect(await storedFor(orderId)).toEqual({ rows: 0, objects: 0 });
  });

  test('an AVIF (HEIF container) photo is accepted', async () => {
    const { orderId } = await onSiteOrder();
    const avif = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#208040' } }).avif().toBuffer();
    const res = await upload(app, orderId, { file: avif, name: 'IMG_0002.heic', type: 'image/heif' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ widthPx: 640, heightPx: 480 });
  });

  test('may name a reading of the order (its component is taken from it), not one of another order', async () => {
    const { orderId, bankId } = await onSiteOrder();
    const reading = await app.request(`/api/work-orders/${orderId}/readings`, {
      json: { idempotencyKey: key(), target: 'bank', targetId: bankId, cleaningDone: true },
      cookie: tech.cookie,
    });
    const readingId = (await reading.json()).id as number;
    const res = await upload(app, orderId, { file: phoneJpeg, fields: { readingId: String(readingId) } });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ readingId, target: 'bank', targetId: bankId });

    const other = await onSiteOrder();
    const wrong = await upload(app, other.orderId, { file: phoneJpeg, fields: { readingId: String(readingId) } });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.readingId).toBeDefined();
    expect(await storedFor(other.orderId)).toEqual({ rows: 0, objects: 0 });
  });
});

describe('bad uploads: a clear 4xx and nothing stored', () => {
  test('a text file named .jpg → 415 not a photo', async () => {
    const { orderId } = await onSiteOrder();
    const res = await upload(app, orderId, { file: Buffer.from('switch-room notes, not a photo\n'.repeat(20)), name: 'photo.jpg' });
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: 'unsupported_media', message: expect.stringMatching(/not a photo/) });
    expect(await storedFor(orderId)).toEqual({ rows: 0, objects: 0 });
  });

  test('an SVG with a script, named .jpg → 415', async () => {
    const { orderId } = await onSiteOrder();
    const svg = Buffer.from(
      '<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" width="800" height="600"><script>fetch("/api/users")</script><rect width="800" height="600" fill="red"/></svg>',
    );
    const res = await upload(app, orderId, { file: svg, name: 'nameplate.jpg', type: 'image/jpeg' });
    expect(res.status).toBe(415);
    expect(await storedFor(orderId)).toEqual({ rows: 0, objects: 0 });
  });

  test('a truncated JPEG → 400 damaged or incomplete', async () => {
    const { orderId } = await onSiteOrder();
    const res = await upload(app, orderId, { file: phoneJpeg.subarray(0, Math.floor(phoneJpeg.length * 0.6)) });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/damaged or incomplete/);
    expect(await storedFor(orderId)).toEqual({ rows: 0, objects: 0 });
  });

  test('a file over the 15 MB limit → 413 with the JSON error shape', async () => {
    const { orderId } = await onSiteOrder();
    const big = Buffer.alloc(16 * 1024 * 1024, 7);
    phoneJpeg.copy(big, 0, 0, 1024);
    const res = await upload(app, orderId, { file: big });
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: 'too_large', message: expect.stringMatching(/15 MB/) });
    expect(await storedFor(orderId)).toEqual({ rows: 0, objects: 0 });
  });

  test('a decompression bomb (a small PNG declaring 100 megapixels) → 413 before it is decoded', async () => {
    const { orderId } = await onSiteOrder();
    const bomb = await sharp({ create: { width: 10_000, height: 10_000, channels: 3, background: '#ffffff' } }).png({ compressionLevel: 1 }).toBuffer();
    expect(bomb.length).toBeLessThan(app.ctx.config.PHOTO_MAX_BYTES);
    const res = await upload(app, orderId, { file: bomb, name: 'IMG_0003.png', type: 'image/png' });
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/10000 × 10000 px \(100 MP\); the limit is 50 MP/);
    expect(await storedFor(orderId)).toEqual({ rows: 0, objects: 0 });
  });

  test('no file, or the file under another field name → 400', async () => {
    const { orderId } = await onSiteOrder();
    const none = await upload(app, orderId, {});
    expect(none.status).toBe(400);
    expect(none.body.error.fields.file).toBeDefined();
    const form = new FormData();
    form.append('idempotencyKey', key());
    form.append('picture', new Blob([new Uint8Array(phoneJpeg)], { type: 'image/jpeg' }), 'a.jpg');
    const wrongField = await app.request(`/api/work-orders/${orderId}/photos`, { method: 'POST', body: form, cookie: tech.cookie });
    expect(wrongField.status).toBe(400);
    expect(await storedFor(orderId)).toEqual({ rows: 0, objects: 0 });
  });
});

describe('who may upload and see photos', () => {
  test('a technician not assigned → 403; a sealed order → 409; a planner → 403', async () => {
    const { orderId } = await onSiteOrder();
    expect((await upload(app, orderId, { file: phoneJpeg, cookie: otherTech })).status).toBe(403);
    expect((await upload(app, orderId, { file: phoneJpeg, cookie: planner })).status).toBe(403);
    const sealed = await onSiteOrder('sealed');
    const res = await upload(app, sealed.orderId, { file: phoneJpeg });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('locked');
    expect(await storedFor(orderId)).toEqual({ rows: 0, objects: 0 });
    expect(await storedFor(sealed.orderId)).toEqual({ rows: 0, objects: 0 });
  });

  test('a viewer sees photos of their own sites only; others get 404', async () => {
    const { orderId, siteId } = await onSiteOrder();
    const res = await upload(app, orderId, { file: phoneJpeg });
    const own = await createUser(app.ctx, { roles: ['viewer'], siteIds: [siteId] });
    const other = await createUser(app.ctx, { roles: ['viewer'], siteIds: [(await createStepWithUnits(app.ctx)).siteId] });
    const ownCookie = await sessionCookieFor(app.ctx, own.user.id);
    const otherCookie = await sessionCookieFor(app.ctx, other.user.id);
    expect((await download(res.body.thumbnailUrl, ownCookie)).res.status).toBe(200);
    for (const path of [res.body.displayUrl, res.body.thumbnailUrl, `/api/work-orders/${orderId}/photos`]) {
      const { res: answer } = await download(path, otherCookie);
      expect(answer.status, path).toBe(404);
    }
    expect((await app.request(res.body.displayUrl)).status).toBe(401);
    expect((await download('/api/photos/999999999/display', planner)).res.status).toBe(404);
  });
});

describe('object storage down', () => {
  test('the upload gets 503 and no row points at a missing object', async () => {
    const broken = await startTestApp({ S3_ENDPOINT: 'http://127.0.0.1:9' });
    try {
      const { orderId } = await onSiteOrder();
      const cookie = await sessionCookieFor(broken.ctx, tech.id);
      const started = Date.now();
      const res = await upload(broken, orderId, { file: phoneJpeg, cookie });
      expect(res.status).toBe(503);
      expect(res.body.error).toMatchObject({ code: 'unavailable', message: expect.stringMatching(/Photo storage/) });
      expect(Date.now() - started).toBeLessThan(10_000);
      expect(await storedFor(orderId)).toEqual({ rows: 0, objects: 0 });
      // Storage back: the same upload goes through.
      const again = await upload(app, orderId, { file: phoneJpeg, cookie: tech.cookie });
      expect(again.status).toBe(201);
    } finally {
      await broken.close();
    }
  });
});
