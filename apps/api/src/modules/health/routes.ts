import { Router } from 'express';
import type { AppContext } from '../../context';
import { allow } from '../../access/allow';
import { checkHealth } from './service';

export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/health', allow('public'), async (_req, res) => {
    const health = await checkHealth(ctx);
    res.status(health.status === 'up' ? 200 : 503).json(health);
  });
  return router;
}
