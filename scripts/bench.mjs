// `npm run bench`: every benchmark with its budget, one table, and bench/results.json.
// Not part of `npm test`: speed targets are checked here, never in timed tests.
import { mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { checkNodeVersion, ensureNpmDependencies, repoRoot, reportFatal, run, SetupError } from './lib/services.mjs';

const log = (message) => console.log(`varden bench: ${message}`);

async function main() {
  checkNodeVersion();
  ensureNpmDependencies(log);
  const out = path.join(repoRoot, 'bench', 'parts');
  mkdirSync(out, { recursive: true });
  const parts = [{ name: 'engineering', script: 'packages/engineering/bench/assess.bench.ts' }];
  const results = [];
  for (const part of parts) {
    log(`${part.name} …`);
    const file = path.join(out, `${part.name}.json`);
    const code = await run(process.execPath, ['--import', 'tsx', part.script, '--json', file]);
    if (code !== 0) throw new SetupError(`benchmark ${part.name} failed (exit ${code}).`);
    const { readFileSync } = await import('node:fs');
    results.push(...JSON.parse(readFileSync(file, 'utf8')));
  }
  const machine = `${os.cpus()[0]?.model ?? 'cpu'} × ${os.cpus().length}, ${Math.round(os.totalmem() / 2 ** 30)} GiB, Node ${process.versions.node}`;
  writeFileSync(path.join(repoRoot, 'bench', 'results.json'), JSON.stringify({ machine, date: new Date().toISOString(), results }, null, 2));
  console.table(results.map((r) => ({ name: r.name, value: r.value, unit: r.unit, budget: r.budget, pass: r.pass ? 'yes' : 'NO' })));
  const failed = results.filter((r) => !r.pass);
  log(`${results.length - failed.length} of ${results.length} budgets met; written to bench/results.json`);
  if (failed.length) process.exitCode = 1;
}

main().catch(reportFatal);
