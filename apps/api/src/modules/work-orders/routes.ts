import { workOrderCreate, workOrderListQuery, workOrderTransitionRequest, workOrderUpdate, workloadQuery } from '@varden/schemas';
import { Router, type Response } from 'express';
import { z } from 'zod';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import type { AppContext } from '../../context';
import { validate } from '../../http/validate';
import { exportWorkOrdersCsv } from './export-csv';
import { getWorkOrderDetail, getWorkOrderReview } from './order-detail.service';
import { signedRecordPdf } from './record.service';
import { transitionWorkOrder } from './transitions.service';
import { sendJsonText } from '../../http/json-text';
import { createWorkOrder, updateWorkOrder, workOrderPage } from './work-orders.service';
import { assignableTechnicians, workloadOf } from './workload.service';

const idParams = z.object({ id: z.coerce.number().int().positive() });
const id = (res: Response) => (res.locals.params as z.output<typeof idParams>).id;

/** Work orders over HTTP: requests to service calls and back, nothing more. */
export function workOrderRoutes(ctx: AppContext): Router {
  const router = Router();
  const read = allow('work-orders:read');
  const schedule = allow('work-orders:schedule');
  const byId = validate({ params: idParams });

  router.get('/work-orders', read, validate({ query: workOrderListQuery }), async (_req, res) => {
    sendJsonText(res, await workOrderPage(ctx, signedInUser(res), res.locals.query));
  });
  router.get('/work-orders/export.csv', read, validate({ query: workOrderListQuery }), async (_req, res) => {
    const csv = await exportWorkOrdersCsv(ctx, signedInUser(res), res.locals.query);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="work-orders-${new Date().toISOString().slice(0, 10)}.csv"`);
    res.send(`\uFEFF${csv}`);
  });
  // Whom a planner may assign: active technicians with id, name and e-mail only.
  router.get('/technicians', schedule, async (_req, res) => {
    res.json(await assignableTechnicians(ctx));
  });
  router.get('/work-orders/workload', schedule, validate({ query: workloadQuery }), async (_req, res) => {
    res.json(await workloadOf(ctx, res.locals.query));
  });
  router.post('/work-orders', schedule, validate({ body: workOrderCreate }), async (_req, res) => {
    res.status(201).json(await createWorkOrder(ctx, signedInUser(res), res.locals.body));
  });
  router.get('/work-orders/:id', read, byId, async (_req, res) => {
    res.json(await getWorkOrderDetail(ctx, signedInUser(res), id(res)));
  });
  router.patch('/work-orders/:id', schedule, validate({ params: idParams, body: workOrderUpdate }), async (_req, res) => {
    res.json(await updateWorkOrder(ctx, signedInUser(res), id(res), res.locals.body));
  });
  // Each move checks its own mover (planner, assignee or supervisor) against the transition table.
  router.post('/work-orders/:id/transitions', read, validate({ params: idParams, body: workOrderTransitionRequest }), async (_req, res) => {
    res.json(await transitionWorkOrder(ctx, signedInUser(res), id(res), res.locals.body));
  });
  router.get('/work-orders/:id/review', read, byId, async (_req, res) => {
    res.json(await getWorkOrderReview(ctx, signedInUser(res), id(res)));
  });
  router.get('/work-orders/:id/record.pdf', read, byId, async (_req, res) => {
    const pdf = await signedRecordPdf(ctx, signedInUser(res), id(res));
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="work-order-${id(res)}-signed-record.pdf"`);
    res.send(pdf);
  });
  return router;
}
