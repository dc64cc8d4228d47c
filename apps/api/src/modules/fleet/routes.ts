import { Router } from 'express';
import Papa from 'papaparse';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import { siteScope } from '../../access/site-scope';
import type { AppContext } from '../../context';
import { cacheKey, readThrough } from '../../db/read-cache';
import { sendJsonText } from '../../http/json-text';
import { fleetOverview } from './service';

export function fleetRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/fleet', allow('reports:read'), async (_req, res) => {
    const scope = siteScope(signedInUser(res));
    const answer = await readThrough(ctx.db, cacheKey('fleet', scope === 'all' ? 'all' : scope.join(',')), async () => ({
      value: await fleetOverview(ctx.db, scope),
      siteId: null,
    }));
    sendJsonText(res, answer.body);
  });
  router.get('/fleet/export.csv', allow('reports:read'), async (_req, res) => {
    const fleet = await fleetOverview(ctx.db, siteScope(signedInUser(res)));
    const csv = Papa.unparse(
      fleet.sites.map((s) => ({
        site: s.siteName,
        risk: s.risk,
        replace: s.bands.replace,
        watch: s.bands.watch,
        remeasure: s.bands.remeasure,
        healthy: s.bands.healthy,
        no_reading: s.bands.noReading,
        open_action_flags: s.openActionFlags,
        steps_near_harmonic: s.stepsNearHarmonic,
        overdue_orders: s.overdueOrders,
        projected_replacements_12_months: s.projectedReplacements,
      })),
    );
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', 'attachment; filename="varden-fleet.csv"');
    res.send(csv);
  });
  return router;
}
