import { Router } from 'express';
import type { AppContext } from '../../context';
import { checkHealth } from './service';

export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const health = await checkHealth(ctx);
    res.status(health.status === 'up' ? 200 : 503).json(health);
  });
  return router;
}
