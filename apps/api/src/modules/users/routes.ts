import { Router } from 'express';
import { auditLogQuery, userIdParams, userListQuery, userUpdate } from '@varden/schemas';
import type { z } from 'zod';
import type { AppContext } from '../../context';
import { validate } from '../../http/validate';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import { listAuditLog } from './audit-log.service';
import { getUser, listUsers, updateUser } from './service';

type Id = z.output<typeof userIdParams>;

export function userRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/users', allow('users:manage'), validate({ query: userListQuery }), async (_req, res) => {
    res.json(await listUsers(ctx.db, res.locals.query as z.output<typeof userListQuery>));
  });

  router.get('/users/:id', allow('users:manage'), validate({ params: userIdParams }), async (_req, res) => {
    res.json(await getUser(ctx.db, (res.locals.params as Id).id));
  });

  router.patch('/users/:id', allow('users:manage'), validate({ params: userIdParams, body: userUpdate }), async (_req, res) => {
    const body = res.locals.body as z.output<typeof userUpdate>;
    res.json(await updateUser(ctx.db, signedInUser(res), (res.locals.params as Id).id, body));
  });

  router.get('/audit-log', allow('audit-log:read'), validate({ query: auditLogQuery }), async (_req, res) => {
    res.json(await listAuditLog(ctx.db, res.locals.query as z.output<typeof auditLogQuery>));
  });

  return router;
}
