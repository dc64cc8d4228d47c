import { sql } from 'drizzle-orm';
import { Router } from 'express';
import { allow } from '../../access/allow';
import type { AppContext } from '../../context';

/**
 * Mounted only when BENCH_ROUTES is true (npm run bench). The baseline answers after the same
 * middleware as every API route (request id and log, security headers, JSON parser, session
 * lookup, permission check) and one SELECT 1 through the same pool, so the other endpoints'
 * throughput can be read as a share of it on a noisy machine.
 */
export function benchRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/bench/baseline', allow('signed-in'), async (_req, res) => {
    await ctx.db.execute(sql`SELECT 1`);
    res.json({ ok: true });
  });
  return router;
}
