import { readingInput, unitReadingListQuery } from '@varden/schemas';
import { Router, type Response } from 'express';
import { z } from 'zod';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import type { AppContext } from '../../context';
import { validate } from '../../http/validate';
import { sendJsonText } from '../../http/json-text';
import { listUnitReadings, readingsOfVisibleOrder, recordReading } from './readings.service';

const idParams = z.object({ id: z.coerce.number().int().positive() });
const id = (res: Response) => (res.locals.params as z.output<typeof idParams>).id;

/** Readings: record one on an order (the phone), list an order's, a unit's history. */
export function readingRoutes(ctx: AppContext): Router {
  const router = Router();

  router.post('/work-orders/:id/readings', allow('work-orders:perform'), validate({ params: idParams, body: readingInput }), async (_req, res) => {
    const { reading, created } = await recordReading(ctx, signedInUser(res), id(res), res.locals.body as z.output<typeof readingInput>);
    res.status(created ? 201 : 200).json(reading);
  });

  router.get('/work-orders/:id/readings', allow('work-orders:read'), validate({ params: idParams }), async (_req, res) => {
    const items = await readingsOfVisibleOrder(ctx.db, signedInUser(res), id(res));
    res.json({ items, total: items.length });
  });

  router.get(
    '/capacitor-units/:id/readings',
    allow('register:read'),
    validate({ params: idParams, query: unitReadingListQuery }),
    async (_req, res) => {
      sendJsonText(res, await listUnitReadings(ctx.db, signedInUser(res), id(res), res.locals.query as z.output<typeof unitReadingListQuery>));
    },
  );

  return router;
}
