import fc from 'fast-check';
import mysql from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { createApp } from '../../apps/api/src/app';
import { loadConfig } from '../../apps/api/src/config';
import { closeContext, createContext } from '../../apps/api/src/context';
import { routeTable } from '../../apps/api/src/access/route-table';
import { applyMigrations } from '../../apps/api/src/db/migrate';
import { createUser, signIn } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

// Every POST, PUT and PATCH route gets at least 200 random and malformed bodies. None may answer
// 5xx, every refusal has the JSON error shape, and a route whose bodies were all refused leaves
// every table as it was. The test runs in a database of its own so that row counts are not
// disturbed by the other test files running at the same time.

const bodiesPerRoute = 200;
const skipped = new Set(['POST /api/auth/sign-out']); // ends the session the fuzzing runs on

const walkContext = createContext(loadConfig({ ...process.env, PORT: '0', JOBS_ENABLED: 'false' }));
const writeRoutes = routeTable(createApp(walkContext)).filter(
  (r) => r.path.startsWith('/api/') && ['POST', 'PUT', 'PATCH'].includes(r.method) && !skipped.has(`${r.method} ${r.path}`),
);

const fuzzDatabase = `varden_fuzz_${process.pid}`;
let app: TestApp;
let cookie: string;
let admin: mysql.Connection;

async function tableCounts(): Promise<Record<string, number>> {
  const [tables] = (await admin.query(
    'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = ? AND table_type = ?',
    [fuzzDatabase, 'BASE TABLE'],
  )) as unknown as [Array<{ name: string }>];
  const counts: Record<string, number> = {};
  for (const { name } of tables) {
    if (name === '__drizzle_migrations' || name === 'sign_in_attempts' || name === 'sessions') continue;
    const [rows] = (await admin.query(`SELECT COUNT(*) AS n FROM \`${fuzzDatabase}\`.\`${name}\``)) as unknown as [Array<{ n: number }>];
    counts[name] = Number(rows[0]!.n);
  }
  return counts;
}

beforeAll(async () => {
  const url = new URL(process.env.DATABASE_URL!);
  admin = await mysql.createConnection({ host: url.hostname, port: Number(url.port), user: url.username, password: decodeURIComponent(url.password) });
  await admin.query(`CREATE DATABASE IF NOT EXISTS \`${fuzzDatabase}\``);
  url.pathname = `/${fuzzDatabase}`;
  app = await startTestApp({ DATABASE_URL: url.toString() });
  await applyMigrations(app.ctx.db);
  // One person holding every role, so the body (not the permission) is what each route judges.
  const everyone = await createUser(app.ctx, { roles: ['admin', 'planner', 'technician', 'supervisor'] });
  cookie = await signIn(app, everyone.email, everyone.password);
}, 120_000);

afterAll(async () => {
  await app?.close();
  await admin?.query(`DROP DATABASE IF EXISTS \`${fuzzDatabase}\``);
  await admin?.end();
  await closeContext(walkContext);
});

const nasty = fc.oneof(
  fc.constant('1e999'), // parses to Infinity
  fc.constant('-1e999'),
  fc.constant('-0'),
  fc.constant('"\\u0000\\u0007\\u001b[31m"'), // control characters
  fc.constant(JSON.stringify('x'.repeat(200_000))), // a huge string
  fc.constant('{"__proto__":{"admin":true},"constructor":{"prototype":{"polluted":true}}}'),
  fc.constant('[]'),
  fc.constant('null'),
  fc.constant('true'),
  fc.constant('"just a string"'),
);
const fieldNames = [
  'name', 'email', 'password', 'roles', 'siteIds', 'version', 'siteId', 'bankId', 'stepId', 'number', 'position',
  'voltageV', 'frequencyHz', 'kvar', 'nameplateKvar', 'nameplateVoltageV', 'nameplateFrequencyHz', 'connection',
  'capacitanceUF', 'ratedKvar', 'detuned', 'detuningFactor', 'targetPf', 'tariffBasis', 'tariffLimit', 'csv', 'dryRun',
  'to', 'comment', 'dueOn', 'kind', 'title', 'checklist', 'target', 'targetId', 'method', 'readingsUF', 'currentsA',
  'idempotencyKey', 'token', 'currentPassword', 'newPassword', 'intervalMonths', 'nextDueOn', 'assigneeId',
];
const wrongValue = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.integer({ min: -1_000_000, max: 1_000_000 }),
  fc.double(),
  fc.constant(-1),
  fc.constant(0),
  fc.constant(null),
  fc.boolean(),
  fc.array(fc.oneof(fc.integer(), fc.string()), { maxLength: 4 }),
  fc.dictionary(fc.string({ maxLength: 8 }), fc.integer(), { maxKeys: 3 }),
);
/** Raw request bodies: valid JSON of the wrong shape, almost-right objects, and JSON traps. */
const body = fc.oneof(
  fc.jsonValue().map((v) => JSON.stringify(v)),
  fc.dictionary(fc.constantFrom(...fieldNames), wrongValue, { maxKeys: 8 }).map((v) => JSON.stringify(v)),
  fc
    .tuple(fc.constantFrom(...fieldNames), nasty)
    .map(([key, raw]) => `{"${key}":${raw}}`),
  nasty,
);

describe('input fuzzing of every write route', () => {
  test('there are write routes to fuzz', () => {
    expect(writeRoutes.length).toBeGreaterThan(10);
  });

  for (const route of writeRoutes) {
    test(`${route.method} ${route.path}: ${bodiesPerRoute} bad bodies, no 5xx, no rows`, async () => {
      const url = route.path.replace(/:(\w+)/g, '999999999');
      const before = await tableCounts();
      const samples = fc.sample(body, { numRuns: bodiesPerRoute, seed: 20261201 + route.path.length });
      let accepted = 0;
      for (const raw of samples) {
        const res = await app.request(url, { method: route.method, cookie, headers: { 'content-type': 'application/json' }, body: raw });
        const text = await res.text();
        expect(res.status, `${route.method} ${url} with ${raw.slice(0, 120)} answered ${res.status}: ${text.slice(0, 200)}`).toBeLessThan(500);
        if (res.status >= 400) {
          const json = JSON.parse(text) as { error?: { code?: unknown; message?: unknown } };
          expect(typeof json.error?.code, `error shape for ${raw.slice(0, 80)}`).toBe('string');
          expect(typeof json.error?.message).toBe('string');
        } else accepted++;
      }
      if (accepted === 0) expect(await tableCounts()).toEqual(before);
      expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    }, 120_000);
  }
});
