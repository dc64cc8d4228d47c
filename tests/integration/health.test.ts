import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app.close();
});

describe('GET /api/health', () => {
  test('reports the database, S3 and mail as up', async () => {
    const res = await app.request('/api/health');
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({
      status: 'up',
      services: {
        database: { status: 'up', latencyMs: expect.any(Number) },
        storage: { status: 'up', latencyMs: expect.any(Number) },
        mail: { status: 'up', latencyMs: expect.any(Number) },
      },
    });
    expect(res.headers.get('x-request-id')).toMatch(/^[\w-]{8,64}$/);
  });

  test('answers 503 and names the service that is down', async () => {
    // A second app whose S3 endpoint points at a closed port: the real fake stays up for others.
    const broken = await startTestApp({ S3_ENDPOINT: 'http://127.0.0.1:9' });
    try {
      const res = await broken.request('/api/health');
      expect(res.status).toBe(503);
      const body = await res.json();
      expect(body.status).toBe('down');
      expect(body.services.storage.status).toBe('down');
      expect(body.services.database.status).toBe('up');
      expect(body.services.mail.status).toBe('up');
    } finally {
      await broken.close();
    }
  });
});

describe('HTTP conventions', () => {
  test('an unknown API route gets the JSON error shape with 404', async () => {
    const res = await app.request('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(await res.json()).toEqual({
      error: { code: 'not_found', message: 'No API route GET /api/no-such-thing' },
    });
  });

  test('a body over the JSON limit gets 413 in the error shape', async () => {
    const res = await app.request('/api/no-such-thing', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ filler: 'x'.repeat(3 * 1024 * 1024) }),
    });
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe('too_large');
  });

  test('malformed JSON gets 400 in the error shape', async () => {
    const res = await app.request('/api/no-such-thing', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{"a":',
    });
    expect(res.status).toBe(400);
    expect((await res.json()).error.code).toBe('invalid');
  });

  test('security headers are set', async () => {
    const res = await app.request('/api/health');
    expect(res.headers.get('content-security-policy')).toContain("default-src 'self'");
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('x-powered-by')).toBeNull();
  });

  test('the built web app is served for client routes', async () => {
    const res = await app.request('/some/client/route');
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toContain('text/html');
    expect(await res.text()).toContain('<div id="root">');
  });
});
