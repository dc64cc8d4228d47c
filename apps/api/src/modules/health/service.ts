import { sql } from 'drizzle-orm';
import type { AppContext } from '../../context';

export type ServiceStatus = { status: 'up' | 'down'; latencyMs: number; detail?: string };

async function probe(check: () => Promise<unknown>, timeoutMs: number): Promise<ServiceStatus> {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      check(),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error(`no answer within ${timeoutMs} ms`)), timeoutMs);
      }),
    ]);
    return { status: 'up', latencyMs: Math.round(performance.now() - started) };
  } catch (error) {
    const detail = error instanceof Error ? error.message || error.name : String(error);
    return { status: 'down', latencyMs: Math.round(performance.now() - started), detail: detail.slice(0, 200) };
  } finally {
    clearTimeout(timer);
  }
}

/** Checks the database, the object store and the mail server, each with its own time limit. */
export async function checkHealth(ctx: AppContext) {
  const [database, storage, mail] = await Promise.all([
    probe(() => ctx.db.execute(sql`SELECT 1`), 2000),
    probe(() => ctx.store.ping(), 2000),
    probe(() => ctx.mail.ping(), 3000),
  ]);
  const allUp = database.status === 'up' && storage.status === 'up' && mail.status === 'up';
  return {
    status: allUp ? ('up' as const) : ('down' as const),
    services: { database, storage, mail },
    version: '0.1.0',
    time: new Date().toISOString(),
  };
}
