import { siteHealthQuery } from '@varden/schemas';
import { Router } from 'express';
import { z } from 'zod';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import { siteScope } from '../../access/site-scope';
import type { AppContext } from '../../context';
import { validate } from '../../http/validate';
import { AppError } from '../../http/app-error';
import { cacheKey, readThrough } from '../../db/read-cache';
import { sendJsonText } from '../../http/json-text';
import { siteHealthPdf } from './report-pdf';
import { siteHealth } from './service';

const params = z.object({ id: z.coerce.number().int().positive() });

export function siteHealthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/sites/:id/health', allow('reports:read'), validate({ params, query: siteHealthQuery }), async (_req, res) => {
    const { id } = res.locals.params as z.output<typeof params>;
    const { hoursPerMonth } = res.locals.query as z.output<typeof siteHealthQuery>;
    const scope = siteScope(signedInUser(res));
    if (scope !== 'all' && !scope.includes(id)) throw new AppError('not_found', `Site ${id} does not exist.`);
    const answer = await readThrough(ctx.db, cacheKey('site-health', id, hoursPerMonth), async () => ({
      value: await siteHealth(ctx.db, scope, id, hoursPerMonth),
      siteId: id,
    }));
    sendJsonText(res, answer.body);
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
