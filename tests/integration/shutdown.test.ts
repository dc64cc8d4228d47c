import { randomUUID } from 'node:crypto';
import { afterAll, expect, test, vi } from 'vitest';
import { shutDown } from '../../apps/api/src/shutdown';
import { createBankWithUnits, createUser, createWorkOrder, signIn } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

// Stopping the API (SIGTERM, SIGINT: apps/api/src/server.ts) lets the requests it is answering
// finish before its database pools close: each write gets its answer with the read revision moved
// on (http/read-revision.ts), none fails with "Pool is closed", and nothing new is accepted.
let app: TestApp | undefined;

afterAll(async () => {
  // Stopped by the test itself; closed here only if the test failed before stopping it.
  if (app?.server.listening) await app.close();
});

test('readings in flight when the API stops are stored and answered, their revision bumps included', async () => {
  app = await startTestApp();
  const technician = await createUser(app.ctx, { roles: ['technician'] });
  const cookie = await signIn(app, technician.email, technician.password);
  const bank = await createBankWithUnits(app.ctx, { steps: 4 });
  const orderId = await createWorkOrder(app.ctx, { bank, state: 'on-site', assigneeId: technician.user.id });
  // The factory's units are 50 kvar at 400 V in delta: 331.57 µF per leg (Q = 3·ω·C·V², the readings tests' check value).
  const legUF = 331.57 * 0.99;
  const errors = vi.spyOn(app.ctx.log, 'error');

  const sent = bank.unitIds.flatMap((unitId) =>
    [1, 2].map(() =>
      app!.request(`/api/work-orders/${orderId}/readings`, {
        method: 'POST',
        cookie,
        json: { idempotencyKey: `r${randomUUID().replace(/-/g, '')}`, target: 'capacitor-unit', targetId: unitId, method: 'per-element', elementsUF: [legUF, legUF, legUF] },
      }),
    ),
  );
  let answered = 0;
  for (const answer of sent) void answer.then(() => (answered += 1), () => undefined);
  // Stop once every request has reached the API and some are still being answered (a connection
  // not yet accepted when the server stops listening is refused, as for any stopped server).
  await vi.waitFor(() => expect(app!.ctx.inFlight.count + answered).toBe(sent.length), { interval: 1, timeout: 5_000 });
  expect(app.ctx.inFlight.count).toBeGreaterThan(0);
  const stopping = shutDown(app.server, app.ctx, 15_000);
  const answers = await Promise.all(sent);

  expect(answers.map((answer) => answer.status)).toEqual(sent.map(() => 201));
  await stopping;
  expect(app.ctx.inFlight.count).toBe(0);
  expect(errors.mock.calls.map((call) => JSON.stringify(call))).toEqual([]);
  // Stopped: no new request is answered.
  await expect(app.request('/api/health')).rejects.toThrow();
});
