import type { Server } from 'node:http';
import { closeContext, type AppContext } from './context';

/** How long a stopping process waits for the requests it is answering. */
export const shutdownGraceMs = 10_000;

/**
 * Stops a listening API: no new connections, the requests being answered finish (their writes'
 * revision bumps included, http/in-flight.ts) for up to `graceMs`, then every connection and
 * the database pools, the object store and the mail transport close.
 */
export async function shutDown(server: Server, ctx: AppContext, graceMs = shutdownGraceMs): Promise<void> {
  server.close();
  server.closeIdleConnections();
  const finished = await ctx.inFlight.drained(graceMs);
  if (!finished) ctx.log.warn({ stillAnswering: ctx.inFlight.count, graceMs }, 'Stopping with requests still being answered');
  server.closeAllConnections();
  await closeContext(ctx);
}
