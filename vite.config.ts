import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import { BaseSequencer, type TestSpecification } from 'vitest/node';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const repoRoot = fileURLToPath(new URL('.', import.meta.url));
const apiPort = process.env.API_PORT ?? process.env.PORT ?? '3000';

/**
 * Vitest's order, with the files that mostly wait on a clock (the 60 s field load test) first, so
 * they run beside the rest of the suite instead of after it.
 */
class ClockBoundFirst extends BaseSequencer {
  static readonly clockBound = ['tests/integration/field-load.test.ts'];
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const sorted = await super.sort(files);
    const isClockBound = (f: TestSpecification) => ClockBoundFirst.clockBound.some((name) => f.moduleId.endsWith(name));
    return [...sorted.filter(isClockBound), ...sorted.filter((f) => !isClockBound(f))];
  }
}

// One file for the web build (root apps/web, output apps/web/dist) and every vitest project.
export default defineConfig({
  root: fileURLToPath(new URL('./apps/web', import.meta.url)),
  plugins: [react(), tailwindcss()],
  build: {
    outDir: fileURLToPath(new URL('./apps/web/dist', import.meta.url)),
    emptyOutDir: true,
    sourcemap: false,
    // dist/.vite/manifest.json: which chunks each route loads, for the web size benchmark.
    manifest: true,
  },
  server: {
    port: Number(process.env.WEB_DEV_PORT ?? 5173),
    host: '127.0.0.1',
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  test: {
    // Vitest's default on this 2-core machine is one worker, so every file ran after the other.
    // Integration files mostly wait on MariaDB, S3 and the clock: two workers overlap them, and
    // the 60 s load test runs beside the rest instead of adding a minute to the suite.
    maxWorkers: 2,
    sequence: { sequencer: ClockBoundFirst },
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
          environment: 'node',
          testTimeout: 30_000,
          hookTimeout: 60_000,
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
