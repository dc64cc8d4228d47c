import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { repoRoot, run, SetupError } from './services.mjs';

function newestMtime(target) {
  if (!existsSync(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) {
    if (entry === 'node_modules' || entry === 'dist') continue;
    newest = Math.max(newest, newestMtime(path.join(target, entry)));
  }
  return newest;
}

export const webDistDir = path.join(repoRoot, 'apps', 'web', 'dist');

/** Builds the web app when apps/web/dist is missing or older than any of its sources. */
export async function ensureWebBuild(log, { force = false } = {}) {
  const built = path.join(webDistDir, 'index.html');
  const sources = ['apps/web', 'packages/engineering/src', 'packages/schemas/src', 'vite.config.ts', 'vite.ssr.config.ts', 'tailwind.config.ts', 'package-lock.json'];
  const newestSource = Math.max(...sources.map((s) => newestMtime(path.join(repoRoot, s))));
  if (!force && existsSync(built) && statSync(built).mtimeMs >= newestSource) return;
  log('Building the web app (vite build) …');
  const vite = path.join(repoRoot, 'node_modules', 'vite', 'bin', 'vite.js');
  const code = await run(process.execPath, [vite, 'build', '--logLevel', 'warn']);
  if (code !== 0) throw new SetupError(`The web build failed (exit ${code}).`);
  // The server's entry, which draws a page's first view, into dist/.server (after: the browser's build empties dist).
  const serverCode = await run(process.execPath, [vite, 'build', '--config', 'vite.ssr.config.ts', '--logLevel', 'warn']);
  if (serverCode !== 0) throw new SetupError(`The web build's server entry failed (exit ${serverCode}).`);
}
