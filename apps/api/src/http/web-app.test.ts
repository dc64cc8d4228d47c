import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { serveWebApp } from './web-app';

// A build as Vite makes it: index.html preloading the entry's own imports, the manifest, and the
// web's page table. The order page shares a chunk with the entry, has one of its own, and its
// loader starts a lazy one at once.
const manifest = {
  'index.html': { file: 'assets/index-E1.js', isEntry: true, imports: ['_common-C1.js'], dynamicImports: ['src/app/routes/field/order-page.tsx', 'src/app/routes/sign-in.tsx'] },
  '_common-C1.js': { file: 'assets/common-C1.js' },
  '_sync-state-S1.js': { file: 'assets/sync-state-S1.js', imports: ['_common-C1.js'] },
  'src/app/routes/field/order-page.tsx': { file: 'assets/order-page-O1.js', imports: ['_common-C1.js', '_sync-state-S1.js'], dynamicImports: ['_walk-W1.js'] },
  '_walk-W1.js': { file: 'assets/walk-W1.js', imports: ['_forms-F1.js', '_common-C1.js'] },
  '_forms-F1.js': { file: 'assets/forms-F1.js' },
  'src/app/routes/sign-in.tsx': { file: 'assets/sign-in-I1.js', imports: ['_common-C1.js'], css: ['assets/sign-in.css'] },
  'src/app/routes/work-orders/new-work-order-page.tsx': { file: 'assets/new-order-N1.js' },
  'src/app/routes/work-orders/work-order-page.tsx': { file: 'assets/order-D1.js' },
};
const pages = [
  { path: '/field/orders/:id', module: 'src/app/routes/field/order-page.tsx', lazy: ['_walk-W1.js'], data: ['/api/work-orders/:id'] },
  { path: '/sign-in', module: 'src/app/routes/sign-in.tsx' },
  { path: '/work-orders/:orderId', module: 'src/app/routes/work-orders/work-order-page.tsx' },
  { path: '/work-orders/new', module: 'src/app/routes/work-orders/new-work-order-page.tsx' },
];
const indexHtml = '<!doctype html><html><head><title>Varden</title>\n<script type="module" crossorigin src="/assets/index-E1.js"></script>\n</head><body><div id="root"></div></body></html>';

let distDir: string;
let url: string;
let close: () => void;

beforeAll(async () => {
  distDir = mkdtempSync(path.join(os.tmpdir(), 'varden-web-app-'));
  mkdirSync(path.join(distDir, '.vite'));
  writeFileSync(path.join(distDir, 'index.html'), indexHtml);
  writeFileSync(path.join(distDir, '.vite', 'manifest.json'), JSON.stringify(manifest));
  writeFileSync(path.join(distDir, 'page-modules.json'), JSON.stringify({ session: '/api/auth/me', pages }));
  const app = express();
  serveWebApp(app, distDir);
  const server = app.listen(0);
  await new Promise((resolve) => server.once('listening', resolve));
  url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  close = () => server.close();
});
afterAll(() => {
  close();
  rmSync(distDir, { recursive: true, force: true });
});

const pageOf = async (pathname: string) => {
  const res = await fetch(`${url}${pathname}`);
  expect(res.status).toBe(200);
  expect(res.headers.get('cache-control')).toBe('no-cache');
  const html = await res.text();
  expect(html).toContain('<div id="root">');
  return html;
};
const preloadsOf = async (pathname: string) => [...(await pageOf(pathname)).matchAll(/<link rel="modulepreload" crossorigin href="([^"]+)">/g)].map((m) => m[1]);
const fetchPreloadsOf = async (pathname: string) => [...(await pageOf(pathname)).matchAll(/<link rel="preload" as="fetch" crossorigin href="([^"]+)">/g)].map((m) => m[1]);

describe("index.html with the requested page's chunks preloaded", () => {
  it("preloads the page's chunk, those its loader starts at once, and their static imports, not the entry's own", async () => {
    expect(await preloadsOf('/field/orders/42')).toEqual(['/assets/order-page-O1.js', '/assets/sync-state-S1.js', '/assets/walk-W1.js', '/assets/forms-F1.js']);
    expect(await preloadsOf('/sign-in?next=%2Ftoday')).toEqual(['/assets/sign-in-I1.js']);
  });

  it('matches a static segment before a parameter, as the router does', async () => {
    expect(await preloadsOf('/work-orders/new')).toEqual(['/assets/new-order-N1.js']);
    expect(await preloadsOf('/work-orders/17')).toEqual(['/assets/order-D1.js']);
  });

  it('adds no chunks for a path that is no page', async () => {
    expect(await preloadsOf('/field/orders/42/extra')).toEqual([]);
    expect(await preloadsOf('/')).toEqual([]);
  });

  it("preloads the session on every page and the page's own data with its parameters", async () => {
    expect(await fetchPreloadsOf('/field/orders/42')).toEqual(['/api/auth/me', '/api/work-orders/42']);
    expect(await fetchPreloadsOf('/field/orders/4%222')).toEqual(['/api/auth/me', '/api/work-orders/4%222']);
    expect(await fetchPreloadsOf('/sign-in')).toEqual(['/api/auth/me']);
    expect(await fetchPreloadsOf('/no/such/page')).toEqual(['/api/auth/me']);
  });
});
