import type { Server } from 'node:http';
import { createApp } from './app';
import { loadConfig } from './config';
import { createContext } from './context';
import { applyMigrations } from './db/migrate';
import { startJobs } from './jobs/scheduler';
import { shutDown } from './shutdown';

/** The process entry: migrate, listen, run jobs, and stop cleanly on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  const config = loadConfig();
  const ctx = createContext(config);
  await applyMigrations(ctx.db);
  const app = createApp(ctx);
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
    s.once('error', reject);
  });
  const jobs = config.JOBS_ENABLED ? startJobs(ctx) : { stop: () => {} };
  const address = server.address();
  ctx.log.info({ port: typeof address === 'object' && address ? address.port : config.PORT }, 'Varden API listening');

  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    jobs.stop();
    await shutDown(server, ctx);
    process.exit(0);
  };
  process.on('SIGINT', () => void stop());
  process.on('SIGTERM', () => void stop());
}

main().catch((error: unknown) => {
  const code = (error as { code?: string }).code;
  if (code === 'EADDRINUSE') {
    process.stderr.write(`The HTTP port is already taken by another program. Choose another with PORT=<port>.\n`);
  } else {
    process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  }
  process.exit(1);
});
