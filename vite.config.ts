import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const repoRoot = fileURLToPath(new URL('.', import.meta.url));
const apiPort = process.env.API_PORT ?? process.env.PORT ?? '3000';

// One file for the web build (root apps/web, output apps/web/dist) and every vitest project.
export default defineConfig({
  root: fileURLToPath(new URL('./apps/web', import.meta.url)),
  plugins: [react(), tailwindcss()],
  build: {
    outDir: fileURLToPath(new URL('./apps/web/dist', import.meta.url)),
    emptyOutDir: true,
    sourcemap: false,
    // dist/.vite/manifest.json: which chunks each route loads, for the web size benchmark and the
    // API's preload hints.
    manifest: true,
    rolldownOptions: {
      output: {
        codeSplitting: {
          // React, React Router, TanStack Query and zod, which every page runs before it draws, in
          // one chunk: one request instead of six on a phone's link (and one file for the browser
          // to keep across releases of Varden's own code).
          groups: [
            {
              name: 'framework',
              test: /node_modules[\\/](react|react-dom|scheduler|react-router|react-router-dom|@tanstack[\\/]query-core|@tanstack[\\/]react-query|zod)[\\/]/,
            },
            {
              // Vite's preload helper and lib/next-task, which the small entry (main.tsx) uses to import
              // the app: their own chunk, or they would land in the app's and the entry would load the
              // framework with it, ahead of the first paint.
              name: 'boot',
              test: /vite[\\/]preload-helper|apps[\\/]web[\\/]src[\\/]lib[\\/]next-task\.ts$/,
              priority: 2,
            },
            {
              // The app's own modules every page runs (start, router, shell, session, paths, the API
              // client): one chunk beside the framework rather than a dozen files of a few hundred bytes.
              name: 'app',
              test: /apps[\\/]web[\\/]src[\\/](config[\\/]|lib[\\/](api-client|class-names|date-format|notices|server-table)\.ts$|features[\\/]auth[\\/](api|lib)[\\/]|app[\\/](router|provider|query-client|first-view)\.tsx?$|app[\\/]routes[\\/](app-shell|signed-in-pages|current-section)\.tsx?$)|packages[\\/]schemas[\\/]src[\\/](common|readings|work-orders|auth|session)[^\\/]*\.ts$/,
            },
          ],
        },
      },
    },
  },
  server: {
    port: Number(process.env.WEB_DEV_PORT ?? 5173),
    host: '127.0.0.1',
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  test: {
    projects: [
      {
        root: repoRoot,
        test: { name: 'engineering', include: ['packages/engineering/src/**/*.test.ts'], environment: 'node' },
      },
      {
        root: repoRoot,
        test: { name: 'schemas', include: ['packages/schemas/src/**/*.test.ts'], environment: 'node' },
      },
      {
        root: repoRoot,
        test: { name: 'api', include: ['apps/api/src/**/*.test.ts'], environment: 'node' },
      },
      {
        root: repoRoot,
        test: { name: 'web', include: ['apps/web/src/**/*.test.{ts,tsx}'], environment: 'node' },
      },
      {
        root: repoRoot,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          exclude: ['tests/integration/field-load.test.ts', 'tests/integration/database-outage.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        // Integration files that bring their own database and mostly wait on clocks: the 60 s field
        // load test and the database outage (a MariaDB of its own). `npm test` runs this project in
        // a vitest process of its own beside the others, so their minutes overlap the suite's.
        root: repoRoot,
        test: {
          name: 'standalone',
          include: ['tests/integration/field-load.test.ts', 'tests/integration/database-outage.test.ts'],
          environment: 'node',
          testTimeout: 150_000,
          hookTimeout: 120_000,
        },
      },
      {
        root: repoRoot,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
          hookTimeout: 90_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
