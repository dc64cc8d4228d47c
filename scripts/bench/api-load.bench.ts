// API load (issue #8 parts 1–3): generates the one-tenth and the full fleet into databases of
// their own, then runs the production API against each in turn and loads it with autocannon,
// 32 connections for 10 s per endpoint, signed in. Every figure is also read as a share of the
// baseline route (SELECT 1 behind the same middleware), because the
// machine is shared and noisy: the baseline runs right before each endpoint, and the ratio is
// to that run. `BENCH_API_ROUNDS` (default 2) rounds per fleet; the median counts. Each run has a
// warm-up of `BENCH_API_WARM_UP_S` (default 3) seconds at the same load before it.
import { randomBytes } from 'node:crypto';
import autocannon from 'autocannon';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import mysql from 'mysql2/promise';
import { createDatabase } from '../../apps/api/src/db/client';
import { applyMigrations } from '../../apps/api/src/db/migrate';
import { fleetPassword, fullFleet, generateFleet, tenthFleet, type FleetSize, type GeneratedFleet } from './fleet-generator';
import { signIn, startApiProcess } from './lib/api-process';
import { processCpuMs } from './lib/process-cpu';
import { atLeast, atMost, writeResults, type BenchResult } from './lib/result';

const connections = 32;
const durationS = Number(process.env.BENCH_API_DURATION_S ?? 10);
const rounds = Number(process.env.BENCH_API_ROUNDS ?? 2);
/**
 * Each measured run follows a warm-up of its own at the same 32 connections, unmeasured, so the
 * figures are those of a server that has been running (the optimising compiler done with the
 * route's code, the heap's young generation grown to its working size, every pool connection
 * open), as in production. With 1 s at 8 connections, the reading's first round ran 20 % more
 * CPU per request than its second (docs/performance.md, seventh pass).
 */
const warmUpS = Number(process.env.BENCH_API_WARM_UP_S ?? 3);
/**
 * For working on one endpoint: `BENCH_API_ONLY="reading submission"` measures only the endpoints
 * named (comma-separated; the baseline always runs) and `BENCH_API_FLEETS=tenth` only the fleets
 * named (`tenth`, `full`). A narrowed run reports the budgets of what it measured; only the
 * whole part has them all.
 */
const onlyList = (name: string) => (process.env[name] ?? '').split(',').map((s) => s.trim()).filter(Boolean);
const onlyEndpoints = onlyList('BENCH_API_ONLY');
const onlyFleets = onlyList('BENCH_API_FLEETS');
const wantFleet = (name: 'tenth' | 'full') => onlyFleets.length === 0 || onlyFleets.includes(name);
const loadBudgetS = 120;
const readBudget = { ratioPct: 50, p99Ms: 40 };
const writeBudget = { ratioPct: 25, p99Ms: 60 };
const keptBudgetPct = 70;

const log = (message: string) => console.log(`  api: ${message}`);

/** A database of the bench MariaDB's own, created (the bench user may create varden%) and migrated. */
async function freshDatabase(name: string): Promise<string> {
  const url = new URL(process.env.DATABASE_URL!);
  const admin = await mysql.createConnection({ host: url.hostname, port: Number(url.port), user: decodeURIComponent(url.username), password: decodeURIComponent(url.password) });
  await admin.query(`DROP DATABASE IF EXISTS \`${name}\``);
  await admin.query(`CREATE DATABASE \`${name}\``);
  await admin.end();
  url.pathname = `/${name}`;
  const { db, pool } = createDatabase(url.toString(), 2);
  await applyMigrations(db);
  await pool.end();
  return url.toString();
}

async function loadFleet(name: string, size: FleetSize): Promise<{ url: string; fleet: GeneratedFleet }> {
  const url = await freshDatabase(name);
  const { db, pool } = createDatabase(url, 8);
  try {
    const fleet = await generateFleet(db, pool, size);
    log(`${name}: ${Object.entries(fleet.counts).map(([k, v]) => `${v} ${k}`).join(', ')} in ${fleet.seconds.toFixed(1)} s`);
    return { url, fleet };
  } finally {
    await pool.end();
  }
}

interface Endpoint {
  name: string;
  kind: 'baseline' | 'read' | 'write';
  options: (api: string, cookies: { planner: string; technician: string }) => autocannon.Options;
}

function endpoints(fleet: GeneratedFleet): Endpoint[] {
  const siteId = fleet.siteIds[Math.floor(fleet.siteIds.length / 2)]!;
  let next = 0;
  return [
    { name: 'baseline', kind: 'baseline', options: (api, c) => ({ url: `${api}/api/bench/baseline`, headers: { cookie: c.planner } }) },
    {
      name: 'work-order list',
      kind: 'read',
      options: (api, c) => ({ url: `${api}/api/work-orders?state=sealed,awaiting-review&siteId=${siteId}&sort=dueOn&page=3&pageSize=25`, headers: { cookie: c.planner } }),
    },
    { name: 'unit history', kind: 'read', options: (api, c) => ({ url: `${api}/api/capacitor-units/${fleet.sampleUnitId}/readings`, headers: { cookie: c.planner } }) },
    { name: 'site health', kind: 'read', options: (api, c) => ({ url: `${api}/api/sites/${siteId}/health`, headers: { cookie: c.planner } }) },
    { name: 'fleet dashboard', kind: 'read', options: (api, c) => ({ url: `${api}/api/fleet`, headers: { cookie: c.planner } }) },
    {
      name: 'reading submission',
      kind: 'write',
      options: (api, c) => ({
        url: api,
        requests: [
          {
            method: 'POST',
            setupRequest: (request) => {
              // Round the orders on site (one per bank) so no bank's lock is a hot row.
              const order = fleet.openOrders[next % fleet.openOrders.length]!;
              const unit = order.units[Math.floor(next / fleet.openOrders.length) % order.units.length]!;
              next++;
              const legUF = Math.round(unit.legUF * 0.99 * 100) / 100;
              return {
                ...request,
                path: `/api/work-orders/${order.orderId}/readings`,
                headers: { ...request.headers, cookie: c.technician, origin: api, 'content-type': 'application/json' },
                body: JSON.stringify({
                  idempotencyKey: randomBytes(12).toString('base64url'),
                  target: 'capacitor-unit',
                  targetId: unit.id,
                  method: 'per-element',
                  elementsUF: [legUF, legUF, legUF],
                }),
              };
            },
          },
        ],
      }),
    },
  ];
}

interface Figures {
  rps: number;
  p50: number;
  p99: number;
}

/** The bench MariaDB's process, for the CPU its share of each request costs (log lines only). */
function mariadbPid(): number | undefined {
  const file = process.env.VARDEN_BENCH_DATA_DIR ? path.join(process.env.VARDEN_BENCH_DATA_DIR, 'mariadb', 'mariadb.pid') : '';
  return file && existsSync(file) ? Number(readFileSync(file, 'utf8').trim()) : undefined;
}

/** CPU per answered request in the API and in MariaDB, µs: steadier than requests/s on a shared machine. */
interface CpuPerRequest {
  apiUs: number;
  dbUs?: number;
}

async function hammer(options: autocannon.Options, seconds: number, apiPid: number): Promise<Figures & { failed: number; cpu: CpuPerRequest }> {
  const dbPid = mariadbPid();
  const before = { api: processCpuMs(apiPid), db: dbPid ? processCpuMs(dbPid) : 0 };
  const result = await autocannon({ ...options, connections, duration: seconds });
  const answered = Math.max(1, result.requests.total);
  const cpu = {
    apiUs: (1000 * (processCpuMs(apiPid) - before.api)) / answered,
    dbUs: dbPid ? (1000 * (processCpuMs(dbPid) - before.db)) / answered : undefined,
  };
  // A run that got no answer at all is a failure too (every request outlived the run).
  return {
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    failed: result.non2xx + result.errors + (result.requests.total === 0 ? 1 : 0),
    cpu,
  };
}

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
};

/** Per endpoint, the median over rounds of req/s, p50, p99 and the ratio to that round's baseline. */
async function measureFleet(label: string, url: string, fleet: GeneratedFleet) {
  const api = await startApiProcess({ DATABASE_URL: url });
  const failures = new Map<string, number>();
  try {
    const cookies = { planner: await signIn(api.url, fleet.plannerEmail, fleetPassword), technician: await signIn(api.url, fleet.technicianEmail, fleetPassword) };
    const list = endpoints(fleet).filter((e) => e.kind === 'baseline' || onlyEndpoints.length === 0 || onlyEndpoints.includes(e.name));
    if (list.length === 1) throw new Error(`BENCH_API_ONLY names no endpoint; they are: ${endpoints(fleet).slice(1).map((e) => e.name).join(', ')}`);
    const samples = new Map<string, Array<Figures & { ratio: number }>>();
    const record = (round: number, endpoint: Endpoint, figures: Figures & { failed: number; cpu: CpuPerRequest }, baseline: number) => {
      if (figures.failed > 0) log(`${label} ${endpoint.name}: ${figures.failed} requests failed or were not answered 2xx`);
      const ratio = baseline > 0 ? (100 * figures.rps) / baseline : 0;
      samples.set(endpoint.name, [...(samples.get(endpoint.name) ?? []), { ...figures, ratio }]);
      failures.set(endpoint.name, (failures.get(endpoint.name) ?? 0) + figures.failed);
      log(`${label} round ${round}: ${endpoint.name.padEnd(18)} ${figures.rps.toFixed(0).padStart(6)} req/s  p50 ${figures.p50} ms  p99 ${figures.p99} ms  ${ratio.toFixed(0)} % of baseline  CPU/request: API ${figures.cpu.apiUs.toFixed(0)} µs${figures.cpu.dbUs === undefined ? '' : `, MariaDB ${figures.cpu.dbUs.toFixed(0)} µs`}`);
    };
    const [baselineEndpoint, ...measured] = list;
    const baselineOptions = baselineEndpoint!.options(api.url, cookies);
    for (let round = 1; round <= rounds; round++) {
      for (const endpoint of measured) {
        // The baseline runs right before each endpoint: the machine's load changes within a minute.
        await hammer(baselineOptions, warmUpS, api.pid);
        const baseline = await hammer(baselineOptions, durationS, api.pid);
        record(round, baselineEndpoint!, baseline, baseline.rps);
        const options = endpoint.options(api.url, cookies);
        await hammer(options, warmUpS, api.pid);
        record(round, endpoint, await hammer(options, durationS, api.pid), baseline.rps);
      }
    }
    return list.map((endpoint) => {
      const s = samples.get(endpoint.name)!;
      return {
        endpoint,
        rps: median(s.map((x) => x.rps)),
        p50: median(s.map((x) => x.p50)),
        p99: median(s.map((x) => x.p99)),
        ratio: median(s.map((x) => x.ratio)),
        failed: failures.get(endpoint.name) ?? 0,
      };
    });
  } finally {
    await api.stop();
  }
}

const info = (name: string, value: number, unit: string): BenchResult => ({ name, value: Number(value.toFixed(value < 10 ? 3 : 1)), unit, budget: '(figure)', pass: true });

async function main() {
  const results: BenchResult[] = [];
  if (!wantFleet('tenth') && !wantFleet('full')) throw new Error(`BENCH_API_FLEETS names no fleet; they are: tenth, full`);
  const measured: Partial<Record<'tenth' | 'full', Awaited<ReturnType<typeof measureFleet>>>> = {};
  if (wantFleet('tenth')) {
    const tenth = await loadFleet('varden_bench_tenth', tenthFleet);
    results.push(info('api tenth: fleet load time', tenth.fleet.seconds, 's'));
    measured.tenth = await measureFleet('tenth', tenth.url, tenth.fleet);
  }
  if (wantFleet('full')) {
    const full = await loadFleet('varden_bench_full', fullFleet);
    results.push(atMost('api full: fleet load time', full.fleet.seconds, 's', loadBudgetS));
    measured.full = await measureFleet('full', full.url, full.fleet);
  }
  for (const fleet of ['tenth', 'full'] as const) {
    for (const m of measured[fleet] ?? []) {
      const prefix = `api ${fleet}: ${m.endpoint.name}`;
      results.push(info(`${prefix} req/s`, m.rps, 'req/s'), info(`${prefix} p50`, m.p50, 'ms'));
      if (m.failed > 0) results.push(atMost(`${prefix} failed requests`, m.failed, 'requests', 0));
      if (m.endpoint.kind === 'baseline') {
        results.push(info(`${prefix} p99`, m.p99, 'ms'));
        continue;
      }
      const budget = m.endpoint.kind === 'read' ? readBudget : writeBudget;
      results.push(atMost(`${prefix} p99`, m.p99, 'ms', budget.p99Ms), atLeast(`${prefix} ratio to baseline`, m.ratio, '%', budget.ratioPct));
    }
  }
  // Throughput kept from the one-tenth to the full fleet, each as a share of its own baseline.
  for (const m of measured.full ?? []) {
    const small = measured.tenth?.find((t) => t.endpoint.name === m.endpoint.name);
    if (m.endpoint.kind === 'baseline' || !small) continue;
    results.push(atLeast(`api: ${m.endpoint.name} throughput kept, tenth → full fleet`, (100 * m.ratio) / small.ratio, '%', keptBudgetPct));
  }
  writeResults(results);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
