import { inspectionIntervalQuery, inspectionPlanCreate, inspectionPlanListQuery, inspectionPlanUpdate } from '@varden/schemas';
import { Router, type Response } from 'express';
import { z } from 'zod';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import type { AppContext } from '../../context';
import { validate } from '../../http/validate';
import { createPlan, deletePlan, getPlan, inspectionIntervalOf, listPlans, updatePlan } from './plans.service';

const idParams = z.object({ id: z.coerce.number().int().positive() });
const id = (res: Response) => (res.locals.params as z.output<typeof idParams>).id;

/** Inspection plans over HTTP. Reading them goes with reading work orders; writing needs plans:manage. */
export function planRoutes(ctx: AppContext): Router {
  const { db } = ctx;
  const router = Router();
  const read = allow('work-orders:read');
  const manage = allow('plans:manage');

  router.get('/inspection-plans', read, validate({ query: inspectionPlanListQuery }), async (_req, res) => {
    res.json(await listPlans(db, signedInUser(res), res.locals.query));
  });
  router.get('/inspection-plans/interval', read, validate({ query: inspectionIntervalQuery }), (_req, res) => {
    res.json(inspectionIntervalOf(res.locals.query));
  });
  router.post('/inspection-plans', manage, validate({ body: inspectionPlanCreate }), async (_req, res) => {
    res.status(201).json(await createPlan(db, res.locals.body));
  });
  router.get('/inspection-plans/:id', read, validate({ params: idParams }), async (_req, res) => {
    res.json(await getPlan(db, signedInUser(res), id(res)));
  });
  router.patch('/inspection-plans/:id', manage, validate({ params: idParams, body: inspectionPlanUpdate }), async (_req, res) => {
    res.json(await updatePlan(db, id(res), res.locals.body));
  });
  router.delete('/inspection-plans/:id', manage, validate({ params: idParams }), async (_req, res) => {
    await deletePlan(db, id(res));
    res.status(204).end();
  });
  return router;
}
