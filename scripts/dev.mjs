// `npm run dev`: the services as for `npm start`, the API in watch mode (tsx watch) and the
// Vite dev server with hot reload proxying /api to it. Ctrl-C stops everything started here.
import { spawn } from 'node:child_process';
import path from 'node:path';
import {
  assertPortFree,
  checkNodeVersion,
  ensureNpmDependencies,
  repoRoot,
  reportFatal,
  run,
  SetupError,
  startServices,
} from './lib/services.mjs';

const log = (message) => console.log(`varden dev: ${message}`);
const env = process.env;
const apiPort = Number(env.PORT ?? 3000);
const webPort = Number(env.WEB_DEV_PORT ?? 5173);
const children = [];
let services;

async function stop(code) {
  for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
  await Promise.all(children.map((c) => (c.exitCode === null ? new Promise((r) => c.once('exit', r)) : null)));
  await services?.stop();
  process.exit(code);
}

async function main() {
  checkNodeVersion();
  ensureNpmDependencies(log);
  await assertPortFree(apiPort, 'the API', 'PORT');
  await assertPortFree(webPort, 'the Vite dev server', 'WEB_DEV_PORT');
  let serviceEnv = {};
  if (!env.DATABASE_URL) {
    services = await startServices({
      dataDir: path.resolve(repoRoot, env.DATA_DIR ?? '.data'),
      ports: {
        db: Number(env.DB_PORT ?? 3307),
        s3: Number(env.S3_PORT ?? 4568),
        smtp: Number(env.SMTP_PORT ?? 1025),
        mailWeb: Number(env.MAIL_WEB_PORT ?? 1080),
      },
      log,
      quiet: true,
    });
    serviceEnv = services.env;
  }
  const apiEnv = {
    ...env,
    ...serviceEnv,
    NODE_ENV: 'development',
    PORT: String(apiPort),
    APP_ORIGIN: env.APP_ORIGIN ?? `http://127.0.0.1:${webPort}`,
    LOG_LEVEL: env.LOG_LEVEL ?? 'info',
  };
  if ((await run(process.execPath, ['--import', 'tsx', 'apps/api/src/cli/seed.ts'], { env: apiEnv })) !== 0) {
    throw new SetupError('Applying migrations or seeding the demo failed (see above).');
  }
  const bin = (name, ...rest) => path.join(repoRoot, 'node_modules', name, ...rest);
  children.push(
    spawn(process.execPath, [bin('tsx', 'dist', 'cli.mjs'), 'watch', '--clear-screen=false', 'apps/api/src/server.ts'], {
      cwd: repoRoot,
      env: apiEnv,
      stdio: 'inherit',
    }),
    spawn(process.execPath, [bin('vite', 'bin', 'vite.js')], { cwd: repoRoot, env: { ...env, API_PORT: String(apiPort) }, stdio: 'inherit' }),
  );
  log(`web with hot reload: http://127.0.0.1:${webPort} (API on ${apiPort}; mail inbox ${serviceEnv.MAIL_WEB_URL ?? 'external'})`);
}

process.on('SIGINT', () => void stop(0));
process.on('SIGTERM', () => void stop(0));
main().catch(async (error) => {
  reportFatal(error);
  await stop(1);
});
