import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { roles, type Role } from '@varden/schemas';
import { createApp } from '../../apps/api/src/app';
import { loadConfig } from '../../apps/api/src/config';
import { closeContext, createContext } from '../../apps/api/src/context';
import { can, needsSignIn } from '../../apps/api/src/access/policy';
import { routeTable, type RouteEntry } from '../../apps/api/src/access/route-table';
import { createUser, sessionCookieFor } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

// The route table is read from the app itself, so a route added later is in this matrix the
// moment it is mounted: it either declares a permission and meets the policy for every role, or
// this file fails.
const walkContext = createContext(loadConfig({ ...process.env, PORT: '0', JOBS_ENABLED: 'false' }));
const allRoutes = routeTable(createApp(walkContext));
const apiRoutes = allRoutes.filter((r) => r.path.startsWith('/api/'));

let app: TestApp;
const userIds = new Map<Role, number>();

beforeAll(async () => {
  app = await startTestApp();
  for (const role of roles) userIds.set(role, (await createUser(app.ctx, { roles: [role] })).user.id);
});
afterAll(async () => {
  await app.close();
  await closeContext(walkContext);
});

describe('the route table', () => {
  test('is read from the nested routers', () => {
    const seen = apiRoutes.map((r) => `${r.method} ${r.path}`);
    expect(seen).toContain('GET /api/health');
    expect(seen).toContain('POST /api/auth/sign-in');
    expect(seen).toContain('PATCH /api/users/:id');
  });

  test('every API route declares its permission with allow()', () => {
    const undeclared = apiRoutes.filter((r) => r.permission === undefined).map((r) => `${r.method} ${r.path}`);
    expect(undeclared).toEqual([]);
  });

  test('outside /api there are only the web app’s page reads', () => {
    const others = allRoutes.filter((r) => !r.path.startsWith('/api/'));
    expect(others.every((r) => r.method === 'GET' || r.method === 'HEAD')).toBe(true);
  });
});

/** A concrete URL for a route: every :param gets an id that does not exist. */
const urlOf = (route: RouteEntry) => route.path.replace(/:(\w+)/g, '999999999');

async function call(route: RouteEntry, cookie: string | undefined): Promise<number> {
  const method = route.method === 'ALL' ? 'GET' : route.method;
  const hasBody = method !== 'GET' && method !== 'HEAD';
  const res = await app.request(urlOf(route), {
    method,
    ...(cookie ? { cookie } : {}),
    ...(hasBody ? { json: {} } : {}),
  });
  await res.body?.cancel();
  return res.status;
}

const cases = apiRoutes.flatMap((route) =>
  (['anonymous', ...roles] as const).map((who) => ({ route, who, name: `${route.method} ${route.path} as ${who}` })),
);

describe('route × role matrix', () => {
  test.each(cases)('$name', async ({ route, who }) => {
    const permission = route.permission;
    expect(permission, 'the route declares a permission').toBeDefined();
    if (!permission) return;
    // A fresh session per call: a route such as sign-out must not end the session of the next one.
    const cookie = who === 'anonymous' ? undefined : await sessionCookieFor(app.ctx, userIds.get(who)!);
    const status = await call(route, cookie);
    if (who === 'anonymous') {
      if (needsSignIn(permission)) expect(status, `${permission} needs a signed-in user`).toBe(401);
      else expect([401, 403], `${permission} is open to anyone`).not.toContain(status);
    } else if (can([who], permission)) {
      expect([401, 403], `${who} holds ${permission}`).not.toContain(status);
    } else {
      expect(status, `${who} does not hold ${permission}`).toBe(403);
    }
  });
});

// The bench's baseline route exists only with BENCH_ROUTES=true (npm run bench). The matrix above
// walks the app as it runs in production, without it; here it is walked on its own.
describe('the bench baseline route', () => {
  test('is not mounted by default', () => {
    expect(apiRoutes.filter((r) => r.path.startsWith('/api/bench'))).toEqual([]);
  });

  test('with BENCH_ROUTES on, it declares signed-in and answers only signed-in users', async () => {
    const bench = await startTestApp({ BENCH_ROUTES: 'true' });
    try {
      const added = routeTable(createApp(bench.ctx)).filter((r) => r.path.startsWith('/api/bench'));
      expect(added.map((r) => ({ method: r.method, path: r.path, permission: r.permission }))).toEqual([
        { method: 'GET', path: '/api/bench/baseline', permission: 'signed-in' },
      ]);
      expect((await bench.request('/api/bench/baseline')).status).toBe(401);
      const res = await bench.request('/api/bench/baseline', { cookie: await sessionCookieFor(bench.ctx, userIds.get('viewer')!) });
      expect(res.status).toBe(200);
      expect(await res.json()).toEqual({ ok: true });
    } finally {
      await bench.close();
    }
  });
});
