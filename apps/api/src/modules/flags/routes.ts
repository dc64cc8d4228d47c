import { correctiveOrderRequest, flagListQuery } from '@varden/schemas';
import { Router, type Response } from 'express';
import { z } from 'zod';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import type { AppContext } from '../../context';
import { validate } from '../../http/validate';
import { listFlags, raiseCorrectiveOrder } from './flags.service';

const idParams = z.object({ id: z.coerce.number().int().positive() });
const id = (res: Response) => (res.locals.params as z.output<typeof idParams>).id;

/** The flag queue over HTTP. Readings raise flags; here they are listed and turned into corrective orders. */
export function flagRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/flags', allow('work-orders:read'), validate({ query: flagListQuery }), async (_req, res) => {
    res.json(await listFlags(ctx.db, signedInUser(res), res.locals.query));
  });
  router.post(
    '/flags/:id/corrective-order',
    allow('work-orders:schedule'),
    validate({ params: idParams, body: correctiveOrderRequest }),
    async (_req, res) => {
      res.status(201).json(await raiseCorrectiveOrder(ctx, signedInUser(res), id(res), res.locals.body));
    },
  );
  return router;
}
