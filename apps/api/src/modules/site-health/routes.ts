import { siteHealthQuery } from '@varden/schemas';
import { Router } from 'express';
import { z } from 'zod';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import { siteScope } from '../../access/site-scope';
import type { AppContext } from '../../context';
import { validate } from '../../http/validate';
import { siteHealthPdf } from './report-pdf';
import { siteHealth } from './service';

const params = z.object({ id: z.coerce.number().int().positive() });

export function siteHealthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/sites/:id/health', allow('reports:read'), validate({ params, query: siteHealthQuery }), async (_req, res) => {
    const { id } = res.locals.params as z.output<typeof params>;
    const { hoursPerMonth } = res.locals.query as z.output<typeof siteHealthQuery>;
    res.json(await siteHealth(ctx.db, siteScope(signedInUser(res)), id, hoursPerMonth));
  });
  router.get('/sites/:id/health/report.pdf', allow('reports:read'), validate({ params, query: siteHealthQuery }), async (_req, res) => {
    const { id } = res.locals.params as z.output<typeof params>;
    const { hoursPerMonth } = res.locals.query as z.output<typeof siteHealthQuery>;
    const health = await siteHealth(ctx.db, siteScope(signedInUser(res)), id, hoursPerMonth);
    const pdf = await siteHealthPdf(health, new Date());
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="varden-site-${id}-health.pdf"`);
    res.send(pdf);
  });
  return router;
}
