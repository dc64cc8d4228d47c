// `npm start`: installs what is missing, starts MariaDB, the S3 fake and the mail fake on
// 127.0.0.1, migrates and seeds the demo, builds the web app when stale and serves it with the
// API. Ctrl-C stops everything this started. Only Node built-ins until `npm ci` has run.
import { spawn } from 'node:child_process';
import path from 'node:path';
import {
  checkNodeVersion,
  ensureNpmDependencies,
  repoRoot,
  reportFatal,
  run,
  SetupError,
  startServices,
  assertPortFree,
  waitForPort,
} from './lib/services.mjs';

const log = (message) => console.log(`varden: ${message}`);
const env = process.env;
const port = Number(env.PORT ?? 3000);
const dataDir = path.resolve(repoRoot, env.DATA_DIR ?? '.data');

let services;
let api;
let stopping = false;

async function stopEverything(code) {
  if (stopping) return;
  stopping = true;
  log('stopping …');
  if (api && api.exitCode === null) {
    const exited = new Promise((r) => api.once('exit', r));
    api.kill('SIGTERM');
    await exited;
  }
  await services?.stop();
  process.exit(code);
}

async function main() {
  checkNodeVersion();
  ensureNpmDependencies(log);
  const { ensureWebBuild, webDistDir } = await import('./lib/web-build.mjs');
  await assertPortFree(port, 'the Varden web app and API', 'PORT');

  let serviceEnv = {};
  let mailWebUrl = env.MAIL_WEB_URL;
  if (env.DATABASE_URL) {
    log('DATABASE_URL is set: using the services from the environment, starting none locally.');
  } else {
    log(`starting MariaDB, the S3 fake and the mail fake (data in ${dataDir}) …`);
    services = await startServices({
      dataDir,
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
    mailWebUrl = services.env.MAIL_WEB_URL;
  }
  await ensureWebBuild(log);

  const apiEnv = {
    ...env,
    ...serviceEnv,
    NODE_ENV: env.NODE_ENV ?? 'production',
    PORT: String(port),
    WEB_DIST_DIR: env.WEB_DIST_DIR ?? webDistDir,
    APP_ORIGIN: env.APP_ORIGIN ?? `http://127.0.0.1:${port}`,
    LOG_LEVEL: env.LOG_LEVEL ?? 'warn',
    // glibc keeps what libvips frees after each photo decode in one arena per thread; two arenas
    // keep the API's peak with four 12 MP uploads at once near 330 MB instead of 400–440 MB
    // (docs/performance.md, Photos).
    MALLOC_ARENA_MAX: env.MALLOC_ARENA_MAX ?? '2',
  };
  const tsx = ['--import', 'tsx'];
  const seeded = await run(process.execPath, [...tsx, 'apps/api/src/cli/seed.ts'], { env: apiEnv });
  if (seeded !== 0) throw new SetupError('Applying migrations or seeding the demo failed (see above).');

  api = spawn(process.execPath, [...tsx, 'apps/api/src/server.ts'], { cwd: repoRoot, env: apiEnv, stdio: 'inherit' });
  api.once('exit', (code) => {
    if (!stopping) {
      log(`the API stopped (exit ${code}).`);
      void stopEverything(code ?? 1);
    }
  });
  await waitForPort(port, 60_000, 'The Varden API', api);

  const password = apiEnv.DEMO_PASSWORD ?? 'switchroom-demo-2026';
  console.log(`
  Varden is running.

    App:          http://127.0.0.1:${port}
    Health:       http://127.0.0.1:${port}/api/health
    Mail inbox:   ${mailWebUrl ?? '(external SMTP server)'}

  Demo sign-ins (password: ${password}):
    admin@demo.varden.test        administrator
    planner@demo.varden.test      maintenance planner
    technician@demo.varden.test   technician
    supervisor@demo.varden.test   supervisor (responsible engineer)
    viewer@demo.varden.test       viewer (client facility manager)

  Press Ctrl-C to stop Varden and the services it started.
`);
}

process.on('SIGINT', () => void stopEverything(0));
process.on('SIGTERM', () => void stopEverything(0));
main().catch(async (error) => {
  reportFatal(error);
  await stopEverything(1);
});
