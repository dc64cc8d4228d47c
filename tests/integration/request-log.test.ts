import { afterAll, beforeAll, expect, test } from 'vitest';
import { createLogger } from '../../apps/api/src/logger';
import { createUser, signIn } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

// The request log (pino-http in apps/api/src/app.ts): one line per answered request at `info`,
// saying which request it was and how it ended, and never its headers: the cookie is the session.
let app: TestApp;
const lines: Array<Record<string, unknown>> = [];

beforeAll(async () => {
  const destination = { write: (line: string) => void lines.push(JSON.parse(line) as Record<string, unknown>) };
  app = await startTestApp({ LOG_LEVEL: 'info' }, { log: (config) => createLogger(config, destination) });
});

afterAll(async () => {
  await app.close();
});

const answerLine = async (requestId: string) => {
  // The line is written when the answer has been handed over, which may be just after fetch resolves.
  for (let i = 0; i < 50 && !lines.some((l) => (l.req as { id?: string } | undefined)?.id === requestId); i++) await new Promise((r) => setTimeout(r, 10));
  return lines.find((l) => (l.req as { id?: string } | undefined)?.id === requestId);
};

test('a request is logged with its id, method, URL, status and time, and without its headers', async () => {
  const planner = await createUser(app.ctx, { roles: ['planner'] });
  const cookie = await signIn(app, planner.email, planner.password);
  const res = await app.request('/api/work-orders?page=1&pageSize=5', { cookie, headers: { 'x-request-id': 'log-check-0001', 'user-agent': 'log-check' } });
  expect(res.status).toBe(200);
  expect(res.headers.get('x-request-id')).toBe('log-check-0001');

  const line = await answerLine('log-check-0001');
  expect(line).toMatchObject({
    level: 30,
    msg: 'request completed',
    req: { id: 'log-check-0001', method: 'GET', url: '/api/work-orders?page=1&pageSize=5' },
    res: { statusCode: 200 },
  });
  expect(typeof line!.responseTime).toBe('number');
  const text = JSON.stringify(line);
  // Neither the session's token nor any header reaches the log.
  expect(text).not.toContain(cookie.split('=')[1]!.split(';')[0]!);
  expect(text).not.toContain('log-check"');
  expect(text).not.toMatch(/headers|cookie/i);
});

test('a refused request is logged with its status', async () => {
  const res = await app.request('/api/work-orders', { headers: { 'x-request-id': 'log-check-0002' } });
  expect(res.status).toBe(401);
  expect(await answerLine('log-check-0002')).toMatchObject({ req: { method: 'GET', url: '/api/work-orders' }, res: { statusCode: 401 } });
});
