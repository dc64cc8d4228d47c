import {
  bankCreate,
  bankListQuery,
  bankUpdate,
  componentListQuery,
  registerImportRequest,
  siteCreate,
  siteListQuery,
  siteUpdate,
  stepCreate,
  stepListQuery,
  stepUpdate,
  unitCreate,
  unitListQuery,
  unitReplace,
  unitUpdate,
} from '@varden/schemas';
import { Router, type Response } from 'express';
import { z } from 'zod';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import { siteScope } from '../../access/site-scope';
import type { AppContext } from '../../context';
import { validate } from '../../http/validate';
import { createBank, deleteBank, getBank, listBanks, updateBank } from './banks.service';
import {
  componentKinds,
  createComponent,
  deleteComponent,
  getComponent,
  listComponents,
  updateComponent,
  type ComponentKindName,
} from './components.service';
import { importBankRegister } from './register-import.service';
import { createSite, deleteSite, getSite, listSitesFor, updateSite } from './sites.service';
import { createStep, deleteStep, getStep, listSteps, updateStep } from './steps.service';
import { createUnit, deleteUnit, getUnit, listUnits, replaceUnit, updateUnit } from './units.service';

const idParams = z.object({ id: z.coerce.number().int().positive() });
const scopeOf = (res: Response) => siteScope(signedInUser(res));
const id = (res: Response) => (res.locals.params as z.output<typeof idParams>).id;

/** The register's HTTP surface: translate requests to service calls and back, nothing more. */
export function registerRoutes(ctx: AppContext): Router {
  const { db } = ctx;
  const router = Router();
  const read = allow('register:read');
  const write = allow('register:write');
  const byId = validate({ params: idParams });

  router.get('/sites', read, validate({ query: siteListQuery }), async (_req, res) => {
    res.json(await listSitesFor(db, scopeOf(res), res.locals.query));
  });
  router.post('/sites', write, validate({ body: siteCreate }), async (_req, res) => {
    res.status(201).json(await createSite(db, res.locals.body));
  });
  router.get('/sites/:id', read, byId, async (_req, res) => {
    res.json(await getSite(db, scopeOf(res), id(res)));
  });
  router.patch('/sites/:id', write, validate({ params: idParams, body: siteUpdate }), async (_req, res) => {
    res.json(await updateSite(db, id(res), res.locals.body));
  });
  router.delete('/sites/:id', write, byId, async (_req, res) => {
    await deleteSite(db, id(res));
    res.status(204).end();
  });

  router.get('/banks', read, validate({ query: bankListQuery }), async (_req, res) => {
    res.json(await listBanks(db, scopeOf(res), res.locals.query));
  });
  router.post('/banks', write, validate({ body: bankCreate }), async (_req, res) => {
    res.status(201).json(await createBank(db, res.locals.body));
  });
  router.get('/banks/:id', read, byId, async (_req, res) => {
    res.json(await getBank(db, scopeOf(res), id(res)));
  });
  router.patch('/banks/:id', write, validate({ params: idParams, body: bankUpdate }), async (_req, res) => {
    res.json(await updateBank(db, id(res), res.locals.body));
  });
  router.delete('/banks/:id', write, byId, async (_req, res) => {
    await deleteBank(db, id(res));
    res.status(204).end();
  });

  router.post('/banks/:id/register-import', write, validate({ params: idParams, body: registerImportRequest }), async (_req, res) => {
    res.json(await importBankRegister(db, id(res), res.locals.body.csv, res.locals.body.dryRun));
  });

  router.get('/steps', read, validate({ query: stepListQuery }), async (_req, res) => {
    res.json(await listSteps(db, scopeOf(res), res.locals.query));
  });
  router.post('/steps', write, validate({ body: stepCreate }), async (_req, res) => {
    res.status(201).json(await createStep(db, res.locals.body));
  });
  router.get('/steps/:id', read, byId, async (_req, res) => {
    res.json(await getStep(db, scopeOf(res), id(res)));
  });
  router.patch('/steps/:id', write, validate({ params: idParams, body: stepUpdate }), async (_req, res) => {
    res.json(await updateStep(db, id(res), res.locals.body));
  });
  router.delete('/steps/:id', write, byId, async (_req, res) => {
    await deleteStep(db, id(res));
    res.status(204).end();
  });

  router.get('/capacitor-units', read, validate({ query: unitListQuery }), async (_req, res) => {
    res.json(await listUnits(db, scopeOf(res), res.locals.query));
  });
  router.post('/capacitor-units', write, validate({ body: unitCreate }), async (_req, res) => {
    res.status(201).json(await createUnit(db, res.locals.body));
  });
  router.get('/capacitor-units/:id', read, byId, async (_req, res) => {
    res.json(await getUnit(db, scopeOf(res), id(res)));
  });
  router.patch('/capacitor-units/:id', write, validate({ params: idParams, body: unitUpdate }), async (_req, res) => {
    res.json(await updateUnit(db, id(res), res.locals.body));
  });
  router.post('/capacitor-units/:id/replacement', write, validate({ params: idParams, body: unitReplace }), async (_req, res) => {
    res.status(201).json(await replaceUnit(db, id(res), res.locals.body));
  });
  router.delete('/capacitor-units/:id', write, byId, async (_req, res) => {
    await deleteUnit(db, id(res));
    res.status(204).end();
  });

  for (const kind of Object.keys(componentKinds) as ComponentKindName[]) {
    const { create, update } = componentKinds[kind];
    router.get(`/${kind}`, read, validate({ query: componentListQuery }), async (_req, res) => {
      res.json(await listComponents(db, kind, scopeOf(res), res.locals.query));
    });
    router.post(`/${kind}`, write, validate({ body: create }), async (_req, res) => {
      res.status(201).json(await createComponent(db, kind, res.locals.body));
    });
    router.get(`/${kind}/:id`, read, byId, async (_req, res) => {
      res.json(await getComponent(db, kind, scopeOf(res), id(res)));
    });
    router.patch(`/${kind}/:id`, write, validate({ params: idParams, body: update }), async (_req, res) => {
      res.json(await updateComponent(db, kind, id(res), res.locals.body));
    });
    router.delete(`/${kind}/:id`, write, byId, async (_req, res) => {
      await deleteComponent(db, kind, id(res));
      res.status(204).end();
    });
  }
  return router;
}
