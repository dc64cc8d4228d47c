// `npm test`: installs what is missing (npm dependencies, Debian's mariadb-server and chromium),
// runs typecheck, lint and the migration check, builds the web app, starts a private MariaDB,
// S3 fake and mail fake on free ports in a temporary folder, runs every vitest project
// (units, integration, browser end-to-end) and stops everything. Exit code non-zero on any failure.
// Extra arguments go to vitest, e.g. `npm test -- --project integration`.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import {
  checkNodeVersion,
  ensureDebianPackage,
  ensureNpmDependencies,
  freePort,
  repoRoot,
  reportFatal,
  run,
  SetupError,
  startServices,
} from './lib/services.mjs';

const log = (message) => console.log(`varden test: ${message}`);
const bin = (name, ...rest) => path.join(repoRoot, 'node_modules', name, ...rest);
const extra = process.argv.slice(2);
const quick = extra.length > 0; // a narrowed run skips the whole-repo checks

let services;
let tmp;

async function step(name, command, args, options) {
  log(`${name} …`);
  const started = Date.now();
  const code = await run(command, args, options);
  if (code !== 0) throw new SetupError(`${name} failed (exit ${code}).`);
  log(`${name} passed in ${((Date.now() - started) / 1000).toFixed(1)} s`);
}

async function main() {
  const started = Date.now();
  checkNodeVersion();
  ensureNpmDependencies(log);
  ensureDebianPackage('mariadbd', 'mariadb-server', log);
  const chromium = ensureDebianPackage('chromium', 'chromium', log);
  const node = process.execPath;

  if (!quick) {
    await step('typecheck', node, [bin('typescript', 'bin', 'tsc'), '-p', 'tsconfig.json', '--noEmit']);
    await step('lint', node, [bin('eslint', 'bin', 'eslint.js'), '.', '--max-warnings=0']);
    await step('migrations check', node, [bin('drizzle-kit', 'bin.cjs'), 'check']);
  }
  const { ensureWebBuild, webDistDir } = await import('./lib/web-build.mjs');
  await ensureWebBuild(log, { force: !quick });

  tmp = mkdtempSync(path.join(os.tmpdir(), 'varden-test-'));
  log(`starting MariaDB, the S3 fake and the mail fake in ${tmp} …`);
  services = await startServices({
    dataDir: tmp,
    ports: { db: await freePort(), s3: await freePort(), smtp: await freePort(), mailWeb: await freePort() },
    log,
    quiet: true,
    database: 'varden_test',
  });
  const env = {
    ...process.env,
    ...services.env,
    NODE_ENV: 'test',
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'silent',
    WEB_DIST_DIR: webDistDir,
    CHROMIUM_PATH: chromium,
    VARDEN_TEST_DATA_DIR: tmp,
    VARDEN_TEST_DB_SOCKET: services.dbSocket,
    VARDEN_TEST_MARIADB_PID: String(services.processes.mariadb.pid),
    VARDEN_TEST_S3_PID: String(services.processes.s3rver.pid),
    VARDEN_TEST_MAIL_PID: String(services.processes.maildev.pid),
  };
  await step('migrate the test database', node, ['--import', 'tsx', 'apps/api/src/cli/migrate.ts'], { env });
  const vitest = bin('vitest', 'vitest.mjs');
  if (quick) {
    await step('vitest', node, [vitest, 'run', ...extra], { env });
  } else {
    // The field load and database outage tests (project "standalone", each on a database of its
    // own) run in a vitest process of their own beside the rest, so their two minutes overlap the
    // suite instead of adding to it; the other projects keep vitest's one worker on this machine.
    const others = ['engineering', 'schemas', 'api', 'web', 'integration', 'e2e'].flatMap((name) => ['--project', name]);
    const results = await Promise.allSettled([
      step('vitest (unit, integration, end-to-end)', node, [vitest, 'run', ...others], { env }),
      step('vitest field load and database outage (beside the rest)', node, [vitest, 'run', '--project', 'standalone'], { env }),
    ]);
    const failed = results.find((r) => r.status === 'rejected');
    if (failed) throw failed.reason;
  }
  log(`all passed in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}

async function cleanup() {
  await services?.stop();
  if (tmp) rmSync(tmp, { recursive: true, force: true });
}

let interrupted = false;
process.on('SIGINT', () => {
  interrupted = true;
  void cleanup().then(() => process.exit(130));
});
main()
  .catch((error) => reportFatal(error))
  .finally(async () => {
    if (!interrupted) await cleanup();
  });
