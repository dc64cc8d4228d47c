// Web: the JavaScript each route loads first (gzip, from the build manifest), and Lighthouse
// 12.2.3 in mobile mode (its default emulation and simulated throttling) on the production
// build served by the production API process, driving Debian's chromium.
// Budgets (issue #8): technician's order route ≤ 150 KB; Lighthouse performance ≥ 90,
// LCP ≤ 2.0 s, TBT ≤ 150 ms, CLS ≤ 0.05 on sign-in, the technician's order and the fleet dashboard.
import { cpSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import { chromium } from 'playwright-core';
import { createBankWithUnits, createStepWithUnits, createUser, createWorkOrder, insertUnitReading } from '../../tests/support/factories';
import { openBenchContext } from './lib/bench-context';
import { repoRoot, signIn, startApiProcess } from './lib/api-process';
import { atLeast, atMost, writeResults, type BenchResult } from './lib/result';

type ManifestChunk = { file: string; imports?: string[]; dynamicImports?: string[]; isEntry?: boolean };
type Manifest = Record<string, ManifestChunk>;

/**
 * The routes measured, by the module the router lazily loads for them, with each one's budget
 * for the JavaScript it loads first (gzip): the technician's order is the issue's 150 KB; the
 * sign-in page is what every phone loads first, so it may carry no more than the form library
 * on top of the app's frame (175 KB); the fleet dashboard is a desk page with charts (300 KB).
 */
const routes = [
  { name: 'sign-in', module: 'src/app/routes/sign-in.tsx', budgetKB: 175 },
  { name: "technician's order (/field/orders/:id)", module: 'src/app/routes/field/order-page.tsx', budgetKB: 150 },
  { name: 'fleet dashboard (/fleet)', module: 'src/app/routes/fleet/fleet-page.tsx', budgetKB: 300 },
];

/**
 * The entry chunk, the app module it imports at once (page-modules.json's `start`, which
 * index.html preloads for every page) and the route's lazy chunk, with everything they import
 * statically, gzip level 9.
 */
function firstLoadKB(distDir: string, manifest: Manifest, routeModule: string, startModule: string | undefined): { kb: number; files: string[] } {
  const entry = Object.entries(manifest).find(([, chunk]) => chunk.isEntry)?.[0];
  if (!entry) throw new Error('the build manifest has no entry chunk');
  if (!manifest[routeModule]) throw new Error(`the build manifest has no chunk for ${routeModule}`);
  const seen = new Set<string>();
  const visit = (key: string) => {
    if (seen.has(key)) return;
    seen.add(key);
    for (const imported of manifest[key]?.imports ?? []) visit(imported);
  };
  visit(entry);
  if (startModule) {
    if (!manifest[startModule]) throw new Error(`the build manifest has no chunk for ${startModule}`);
    visit(startModule);
  }
  visit(routeModule);
  const files = [...seen].map((key) => manifest[key]!.file).filter((file) => file.endsWith('.js'));
  const bytes = files.reduce((sum, file) => sum + gzipSync(readFileSync(path.join(distDir, file)), { level: 9 }).length, 0);
  return { kb: bytes / 1024, files };
}

/**
 * A copy of the build the orchestrator made, in the bench's own folder: apps/web/dist is shared
 * with test runs in the same work tree, which rebuild it (and so empty it) while they start.
 */
function copyOfBuild(): string {
  const built = process.env.WEB_DIST_DIR;
  const benchDir = process.env.VARDEN_BENCH_DATA_DIR;
  if (!built || !benchDir) throw new Error('WEB_DIST_DIR or VARDEN_BENCH_DATA_DIR is not set: run through `npm run bench -- web`');
  const copy = path.join(benchDir, 'web-dist');
  cpSync(built, copy, { recursive: true });
  return copy;
}

function bundleResults(distDir: string): BenchResult[] {
  const manifest = JSON.parse(readFileSync(path.join(distDir, '.vite', 'manifest.json'), 'utf8')) as Manifest;
  const { start } = JSON.parse(readFileSync(path.join(distDir, 'page-modules.json'), 'utf8')) as { start?: string };
  return routes.map((route) => {
    const { kb, files } = firstLoadKB(distDir, manifest, route.module, start);
    console.log(`web: ${route.name} loads first ${files.length} JS files, ${kb.toFixed(1)} KB gzip`);
    return atMost(`JS loaded first (gzip), ${route.name}`, kb, 'KB', route.budgetKB);
  });
}

const chromeFlags = ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];
const runsPerPage = 3;

type Audit = { numericValue?: number };
type LighthouseFigures = { score: number; lcpS: number; tbtMs: number; cls: number; report: string };

/** One Lighthouse run; a run whose trace came out broken (it happens on a loaded machine) is run again, twice at most. */
async function audit(port: number, url: string, attempt = 1): Promise<LighthouseFigures> {
  try {
    return await auditOnce(port, url);
  } catch (error) {
    if (attempt >= 3) throw error;
    console.log(`web: ${String(error)}; running it again`);
    return audit(port, url, attempt + 1);
  }
}

/** The name=value pairs of a Cookie header, as cookies of `url` for a browser's cookie jar. */
const cookiesOf = (header: string, url: string) =>
  header.split(';').map((pair) => {
    const [name, ...value] = pair.trim().split('=');
    return { name: name!, value: value.join('='), url };
  });

async function auditOnce(port: number, url: string): Promise<LighthouseFigures> {
  const result = await lighthouse(url, {
    port,
    output: 'json',
    logLevel: 'error',
    onlyCategories: ['performance'],
  });
  const lhr = result?.lhr;
  if (!lhr) throw new Error(`Lighthouse returned nothing for ${url}`);
  if (lhr.runtimeError) throw new Error(`Lighthouse failed on ${url}: ${lhr.runtimeError.code} ${lhr.runtimeError.message}`);
  const audits = lhr.audits as Record<string, Audit>;
  const finalUrl = lhr.finalDisplayedUrl;
  if (new URL(finalUrl).pathname !== new URL(url).pathname) throw new Error(`Lighthouse on ${url} ended on ${finalUrl} (not signed in?)`);
  return {
    score: (lhr.categories.performance?.score ?? 0) * 100,
    lcpS: (audits['largest-contentful-paint']?.numericValue ?? Number.NaN) / 1000,
    tbtMs: audits['total-blocking-time']?.numericValue ?? Number.NaN,
    cls: audits['cumulative-layout-shift']?.numericValue ?? Number.NaN,
    report: typeof result.report === 'string' ? result.report : JSON.stringify(lhr),
  };
}

/** The data the pages need: a technician with an order assigned, a supervisor with a few sites of readings. */
async function createPageData() {
  const { ctx, close } = openBenchContext();
  try {
    const tech = await createUser(ctx, { roles: ['technician'], name: 'Bench technician' });
    const step = await createStepWithUnits(ctx, { units: 3, site: { name: `Bench works ${Date.now()}` } });
    const orderId = await createWorkOrder(ctx, { bank: step, state: 'on-site', assigneeId: tech.user.id, title: 'Annual inspection, bank 1', kind: 'inspection' });
    const supervisor = await createUser(ctx, { roles: ['supervisor'], name: 'Bench supervisor' });
    const bands = [
      { deviationPct: -1.2, band: 'healthy' },
      { deviationPct: -4.5, band: 'watch' },
      { deviationPct: -9.8, band: 'replace' },
    ] as const;
    for (let s = 0; s < 4; s++) {
      const bank = await createBankWithUnits(ctx, { steps: 3, siteValues: { name: `Bench plant ${s + 1} ${Date.now()}` } });
      const inspected = await createWorkOrder(ctx, { bank, state: 'awaiting-review', assigneeId: tech.user.id, title: `Inspection of plant ${s + 1}` });
      for (const [n, unitId] of bank.unitIds.entries()) {
        for (let year = 3; year >= 0; year--) {
          const { deviationPct, band } = bands[(n + s) % bands.length]!;
          await insertUnitReading(ctx, {
            workOrderId: inspected,
            unitId,
            recordedById: tech.user.id,
            deviationPct: deviationPct * (1 - year * 0.2),
            band,
            recordedAt: new Date(Date.now() - year * 365 * 86_400_000),
          });
        }
      }
    }
    return { tech, orderId, supervisor };
  } finally {
    await close();
  }
}

/**
 * What moved, when a page misses the CLS budget: Lighthouse's own layout-shift audit fails with
 * Debian's chromium, so the page is opened once more in a phone-sized window and the shifts'
 * sources are printed (the element, and how far it moved).
 */
async function printLayoutShifts(url: string, cookie: string | undefined): Promise<void> {
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH!, headless: true, args: chromeFlags.filter((flag) => flag !== '--headless=new') });
  try {
    // As Lighthouse's runs: its phone's screen, and the session in the cookie jar.
    const context = await browser.newContext({ viewport: { width: 412, height: 823 }, deviceScaleFactor: 1.75, isMobile: true, hasTouch: true });
    if (cookie) await context.addCookies(cookiesOf(cookie, url));
    const page = await context.newPage();
    await page.addInitScript(() => {
      const shifts: string[] = [];
      (window as unknown as { shifts: string[] }).shifts = shifts;
      new PerformanceObserver((list) => {
        for (const entry of list.getEntries() as unknown as Array<{ value: number; hadRecentInput: boolean; sources: Array<{ node?: Node; previousRect: DOMRectReadOnly; currentRect: DOMRectReadOnly }> }>) {
          if (entry.hadRecentInput) continue;
          for (const source of entry.sources) {
            const node = source.node as Element | undefined;
            const what = node ? `${node.nodeName.toLowerCase()}${node.id ? `#${node.id}` : ''}${node.className && typeof node.className === 'string' ? `.${node.className.split(' ').slice(0, 3).join('.')}` : ''} "${(node.textContent ?? '').slice(0, 40)}"` : '(gone)';
            shifts.push(`${entry.value.toFixed(3)} ${what} y ${source.previousRect.y.toFixed(0)}→${source.currentRect.y.toFixed(0)} h ${source.previousRect.height.toFixed(0)}→${source.currentRect.height.toFixed(0)}`);
          }
        }
      }).observe({ type: 'layout-shift', buffered: true });
    });
    await page.goto(url, { waitUntil: 'networkidle' });
    await page.waitForTimeout(1500);
    const shifts = await page.evaluate(() => (window as unknown as { shifts: string[] }).shifts);
    console.log(`web: layout shifts on ${new URL(url).pathname}:\n  ${shifts.join('\n  ') || '(none in a phone-sized window without throttling)'}`);
  } finally {
    await browser.close();
  }
}

const median = (values: LighthouseFigures[]) => [...values].sort((a, b) => a.score - b.score)[Math.floor(values.length / 2)]!;

async function lighthouseResults(distDir: string): Promise<BenchResult[]> {
  const chromePath = process.env.CHROMIUM_PATH;
  if (!chromePath) throw new Error('CHROMIUM_PATH is not set: run through `npm run bench -- web`');
  const { tech, orderId, supervisor } = await createPageData();
  const api = await startApiProcess({ WEB_DIST_DIR: distDir });
  const chrome = await chromeLauncher.launch({ chromePath, chromeFlags });
  // The session goes into the browser's own cookie jar, where a phone keeps it, beside the cookies
  // the app itself writes (its reader format): Lighthouse leaves the jar as it is between runs.
  const jar = await chromium.connectOverCDP(`http://127.0.0.1:${chrome.port}`);
  const results: BenchResult[] = [];
  try {
    const pages = [
      { name: 'sign-in', slug: 'sign-in', url: `${api.url}/sign-in`, cookie: undefined },
      { name: "technician's order", slug: 'field-order', url: `${api.url}/field/orders/${orderId}`, cookie: await signIn(api.url, tech.email, tech.password) },
      { name: 'fleet dashboard', slug: 'fleet', url: `${api.url}/fleet`, cookie: await signIn(api.url, supervisor.email, supervisor.password) },
    ];
    // BENCH_WEB_PAGES=field-order,fleet audits only those (while working on one page).
    const only = process.env.BENCH_WEB_PAGES ? process.env.BENCH_WEB_PAGES.split(',') : undefined;
    for (const page of pages.filter((p) => !only || only.includes(p.slug))) {
      // Warm-up: the API's first answers to these routes (Lighthouse clears the browser's cache itself).
      for (const warm of [page.url, `${api.url}/api/auth/me`]) await (await fetch(warm, { headers: page.cookie ? { cookie: page.cookie } : {} })).arrayBuffer();
      const cookies = jar.contexts()[0]!;
      await cookies.clearCookies();
      if (page.cookie) await cookies.addCookies(cookiesOf(page.cookie, page.url));
      const runs: LighthouseFigures[] = [];
      for (let i = 0; i < runsPerPage; i++) runs.push(await audit(chrome.port, page.url));
      // The machine's load beside the figures: TBT and LCP grow with it (the CPU is shared).
      const load = os.loadavg().map((l) => l.toFixed(1)).join(' ');
      console.log(`web: Lighthouse ${page.name} (load average ${load}): ${runs.map((r) => `score ${r.score.toFixed(0)} LCP ${r.lcpS.toFixed(2)} s TBT ${r.tbtMs.toFixed(0)} ms CLS ${r.cls.toFixed(3)}`).join('; ')}`);
      const m = median(runs);
      if (m.cls > 0.05) await printLayoutShifts(page.url, page.cookie);
      // The median run's whole report, for its diagnostics (bench/ is not committed).
      const reports = path.join(repoRoot, 'bench', 'parts');
      mkdirSync(reports, { recursive: true });
      writeFileSync(path.join(reports, `lighthouse-${page.slug}.json`), m.report);
      results.push(
        atLeast(`Lighthouse mobile performance, ${page.name} (median of ${runsPerPage})`, m.score, 'points', 90),
        atMost(`Lighthouse mobile LCP, ${page.name}`, m.lcpS, 's', 2.0),
        atMost(`Lighthouse mobile TBT, ${page.name}`, m.tbtMs, 'ms', 150),
        atMost(`Lighthouse mobile CLS, ${page.name}`, m.cls, '', 0.05),
      );
    }
  } finally {
    await jar.close();
    chrome.kill();
    await api.stop();
  }
  return results;
}

async function main() {
  const distDir = copyOfBuild();
  const results = [...bundleResults(distDir), ...(await lighthouseResults(distDir))];
  writeResults(results);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
