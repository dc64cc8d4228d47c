// Photos: a 12-megapixel phone JPEG through the whole upload pipeline of the production API
// process over HTTP (multipart, content sniffing, pixel limit, decode, orientation, display and
// thumbnail WebP, both to the S3 fake, the row in MariaDB). Budgets: ≤ 500 ms per photo (median
// and slowest of sequential uploads) and ≤ 400 MB peak RSS (VmHWM) of the API with four at once.
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { createStepWithUnits, createUser, createWorkOrder } from '../../tests/support/factories';
import { openBenchContext } from './lib/bench-context';
import { processCpuMs } from './lib/process-cpu';
import { signIn, startApiProcess, type ApiProcess } from './lib/api-process';
import { atMost, writeResults, type BenchResult } from './lib/result';

const sequentialUploads = 10;
const parallelUploads = 4;
const parallelRounds = 4;

/**
 * A 4000 × 3000 JPEG like a phone's: smooth shading with fine detail and sensor noise (so it
 * compresses like a real photo, about 4–5 MB at quality 90), stored sideways (EXIF orientation
 * 6) with a camera make and a GPS position in its EXIF. Deterministic, invented content.
 */
async function phonePhoto(): Promise<Buffer> {
  const width = 4000;
  const height = 3000;
  const pixels = Buffer.alloc(width * height * 3);
  let seed = 20261202;
  const noise = () => {
    seed = (seed * 1103515245 + 12345) & 0x7fffffff;
    return (seed / 0x7fffffff - 0.5) * 40;
  };
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 3;
      const shade = 110 + 60 * Math.sin(x / 97) * Math.cos(y / 131) + 30 * Math.sin((x + y) / 23);
      const n = noise();
      pixels[i] = Math.max(0, Math.min(255, shade + 20 + n));
      pixels[i + 1] = Math.max(0, Math.min(255, shade * 0.9 + n));
      pixels[i + 2] = Math.max(0, Math.min(255, 255 - shade + n));
    }
  }
  return sharp(pixels, { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 90 })
    .withMetadata({ orientation: 6 })
    .withExif({ IFD0: { Make: 'VardenBenchCam', Model: 'Field 12' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' } })
    .toBuffer();
}

async function uploadOnce(api: ApiProcess, cookie: string, orderId: number, photo: Buffer): Promise<number> {
  const form = new FormData();
  form.append('idempotencyKey', `bench${randomUUID().replace(/-/g, '')}`);
  form.append('caption', 'Bench photo of the step 1 nameplate');
  form.append('file', new Blob([new Uint8Array(photo)], { type: 'image/jpeg' }), 'IMG_4000.jpg');
  const started = performance.now();
  const res = await fetch(`${api.url}/api/work-orders/${orderId}/photos`, { method: 'POST', body: form, headers: { cookie, origin: api.url } });
  const body = (await res.json()) as { widthPx?: number; heightPx?: number };
  const ms = performance.now() - started;
  // Stored upright: the sideways 4000 × 3000 becomes 1200 × 1600 at display size.
  if (res.status !== 201 || body.widthPx !== 1200 || body.heightPx !== 1600) {
    throw new Error(`photo upload answered ${res.status} ${JSON.stringify(body)}`);
  }
  return ms;
}

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
};

async function main() {
  const photo = await phonePhoto();
  console.log(`photos: test JPEG 4000 × 3000, ${(photo.length / 2 ** 20).toFixed(2)} MB`);

  const { ctx, close } = openBenchContext();
  const tech = await createUser(ctx, { roles: ['technician'], name: 'Bench technician' });
  const step = await createStepWithUnits(ctx);
  const orderId = await createWorkOrder(ctx, { bank: step, state: 'on-site', assigneeId: tech.user.id, title: 'Bench inspection with photos' });
  await close();

  // Started as `npm start` starts it (scripts/start.mjs): two glibc malloc arenas.
  const api = await startApiProcess({ MALLOC_ARENA_MAX: process.env.MALLOC_ARENA_MAX ?? '2' });
  const results: BenchResult[] = [];
  try {
    const cookie = await signIn(api.url, tech.email, tech.password);
    console.log(`photos: API RSS before any upload ${api.rssMB().toFixed(0)} MB`);
    await uploadOnce(api, cookie, orderId, photo); // warm-up: first use of sharp, S3 client and pool
    const times: number[] = [];
    const cpuBefore = processCpuMs(api.pid);
    for (let i = 0; i < sequentialUploads; i++) times.push(await uploadOnce(api, cookie, orderId, photo));
    const cpuPerPhoto = (processCpuMs(api.pid) - cpuBefore) / sequentialUploads;
    console.log(`photos: sequential ms ${times.map((t) => t.toFixed(0)).join(' ')}; RSS now ${api.rssMB().toFixed(0)} MB, peak so far ${api.peakRssMB().toFixed(0)} MB`);
    results.push(atMost(`photo upload 12 MP, median of ${sequentialUploads} sequential`, median(times), 'ms', 500));
    results.push(atMost(`photo upload 12 MP, slowest of ${sequentialUploads} sequential`, Math.max(...times), 'ms', 500));
    // The same budget on the API's CPU time per photo, which the machine's other load hardly changes.
    results.push(atMost(`photo upload 12 MP, API CPU time per photo (mean of ${sequentialUploads})`, cpuPerPhoto, 'ms', 500));

    const parallelTimes: number[] = [];
    for (let round = 0; round < parallelRounds; round++) {
      parallelTimes.push(...(await Promise.all(Array.from({ length: parallelUploads }, () => uploadOnce(api, cookie, orderId, photo)))));
    }
    console.log(`photos: ${parallelUploads} at once × ${parallelRounds}, ms ${parallelTimes.map((t) => t.toFixed(0)).join(' ')}`);
    results.push(atMost(`API peak RSS (VmHWM), ${parallelUploads} uploads at once × ${parallelRounds} rounds`, api.peakRssMB(), 'MB', 400));
  } finally {
    await api.stop();
  }
  writeResults(results);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
