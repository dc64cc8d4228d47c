import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { get, type IncomingMessage } from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app';

/** A GET whose body comes as sent (fetch would unzip it). */
function rawGet(url: string, headers: Record<string, string>): Promise<{ res: IncomingMessage; body: Buffer }> {
  return new Promise((resolve, reject) => {
    get(url, { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => resolve({ res, body: Buffer.concat(chunks) }));
      res.on('error', reject);
    }).on('error', reject);
  });
}

let app: TestApp;
let distDir: string;
/** A script like the build's: hashed name, large and repetitive enough to be worth compressing. */
const script = `export const rows = [${Array.from({ length: 400 }, (_, i) => `{ step: ${i}, kvar: 50 }`).join(', ')}];\n`;

beforeAll(async () => {
  distDir = mkdtempSync(path.join(os.tmpdir(), 'varden-web-assets-'));
  mkdirSync(path.join(distDir, 'assets'));
  writeFileSync(path.join(distDir, 'index.html'), '<!doctype html><html><head><title>Varden</title></head><body><div id="root"></div></body></html>');
  writeFileSync(path.join(distDir, 'assets', 'index-AbC123xy.js'), script);
  app = await startTestApp({ WEB_DIST_DIR: distDir });
});
afterAll(async () => {
  await app.close();
  rmSync(distDir, { recursive: true, force: true });
});

describe('the built web app as the API serves it', () => {
  test('a hashed script goes gzipped to a browser that accepts it, cached for a year as immutable', async () => {
    const { res, body } = await rawGet(`${app.url}/assets/index-AbC123xy.js`, { 'accept-encoding': 'gzip' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(body.length).toBeLessThan(script.length / 3);
    expect(gunzipSync(body).toString()).toBe(script);
  });

  test('a client that asks for no compression gets the plain file', async () => {
    const { res, body } = await rawGet(`${app.url}/assets/index-AbC123xy.js`, { 'accept-encoding': 'identity' });
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(body.toString()).toBe(script);
  });

  test('index.html is revalidated on every visit, so a new build is picked up at once', async () => {
    const res = await fetch(`${app.url}/field/orders/1`, { headers: { 'accept-encoding': 'gzip' } });
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('no-cache');
    expect(await res.text()).toContain('<div id="root">');
  });
});
