// `npm run bench`: every benchmark with its budget, one table, and bench/results.json.
// Not part of `npm test`: speed targets are checked here, never in timed tests.
// Builds the web app for production, starts a MariaDB, S3 fake and mail fake of its own in a
// temporary folder, migrates, then runs each part as its own process with that environment.
// `npm run bench -- api web` runs only the parts named.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
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

const log = (message) => console.log(`varden bench: ${message}`);

/** Each part writes an array of { name, value, unit, budget, pass } to the file after --json. */
const allParts = [
  { name: 'engineering', script: 'packages/engineering/bench/assess.bench.ts', services: false },
  { name: 'api', script: 'scripts/bench/api-load.bench.ts', services: true },
  { name: 'web', script: 'scripts/bench/web.bench.ts', services: true },
  { name: 'photos', script: 'scripts/bench/photos.bench.ts', services: true },
];

let services;
let tmp;

async function main() {
  checkNodeVersion();
  ensureNpmDependencies(log);
  const wanted = process.argv.slice(2);
  const parts = wanted.length ? allParts.filter((p) => wanted.includes(p.name)) : allParts;
  if (wanted.length && parts.length !== wanted.length) {
    throw new SetupError(`unknown bench part in ${wanted.join(', ')}; the parts are ${allParts.map((p) => p.name).join(', ')}.`);
  }
  const out = path.join(repoRoot, 'bench', 'parts');
  mkdirSync(out, { recursive: true });

  let env = { ...process.env };
  if (parts.some((p) => p.services)) {
    ensureDebianPackage('mariadbd', 'mariadb-server', log);
    const chromium = ensureDebianPackage('chromium', 'chromium', log);
    const { ensureWebBuild, webDistDir } = await import('./lib/web-build.mjs');
    await ensureWebBuild(log, { force: true });
    tmp = mkdtempSync(path.join(os.tmpdir(), 'varden-bench-'));
    log(`starting MariaDB, the S3 fake and the mail fake in ${tmp} …`);
    services = await startServices({
      dataDir: tmp,
      ports: { db: await freePort(), s3: await freePort(), smtp: await freePort(), mailWeb: await freePort() },
      log,
      quiet: true,
      database: 'varden_bench',
    });
    env = { ...env, ...services.env, WEB_DIST_DIR: webDistDir, CHROMIUM_PATH: chromium, LOG_LEVEL: 'warn', VARDEN_BENCH_DATA_DIR: tmp };
    const migrated = await run(process.execPath, ['--import', 'tsx', 'apps/api/src/cli/migrate.ts'], { env });
    if (migrated !== 0) throw new SetupError('migrating the bench database failed (see above).');
  }

  const results = [];
  for (const part of parts) {
    log(`${part.name} …`);
    const file = path.join(out, `${part.name}.json`);
    rmSync(file, { force: true });
    const started = Date.now();
    const code = await run(process.execPath, ['--import', 'tsx', part.script, '--json', file], { env });
    if (code !== 0) throw new SetupError(`benchmark ${part.name} failed (exit ${code}).`);
    results.push(...JSON.parse(readFileSync(file, 'utf8')));
    log(`${part.name} done in ${((Date.now() - started) / 1000).toFixed(0)} s`);
  }
  const machine = `${os.cpus()[0]?.model ?? 'cpu'} × ${os.cpus().length}, ${Math.round(os.totalmem() / 2 ** 30)} GiB, Node ${process.versions.node}`;
  writeFileSync(path.join(repoRoot, 'bench', 'results.json'), JSON.stringify({ machine, date: new Date().toISOString(), results }, null, 2));
  console.table(results.map((r) => ({ name: r.name, value: r.value, unit: r.unit, budget: r.budget, pass: r.pass ? 'yes' : 'NO' })));
  const failed = results.filter((r) => !r.pass);
  // Figures reported beside the budgets (requests/s, p50, load time of the one-tenth fleet) have none.
  const budgeted = results.filter((r) => r.budget !== '(figure)');
  log(`${budgeted.length - failed.length} of ${budgeted.length} budgets met (${results.length - budgeted.length} figures beside them); written to bench/results.json`);
  if (failed.length) process.exitCode = 1;
}

async function cleanup() {
  await services?.stop?.();
  if (tmp) rmSync(tmp, { recursive: true, force: true });
}

main()
  .catch(reportFatal)
  .finally(() => cleanup());
