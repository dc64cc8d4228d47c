import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import compression from 'compression';
import express from 'express';
import helmet from 'helmet';
import { pino } from 'pino';
import { pinoHttp } from 'pino-http';
import type { AppContext } from './context';
import { errorMiddleware, notFoundHandler } from './http/error-middleware';
import { readRevisionOnWrite } from './http/read-revision';
import { serveWebApp } from './http/web-app';
import { healthRoutes } from './modules/health/routes';
import { originCheck } from './access/origin-check';
import { sessionMiddleware } from './access/session-middleware';
import { authRoutes } from './modules/auth/routes';
import { userRoutes } from './modules/users/routes';
import { registerRoutes } from './modules/register/routes';
import { siteHealthRoutes } from './modules/site-health/routes';
import { fleetRoutes } from './modules/fleet/routes';
import { workOrderRoutes } from './modules/work-orders/routes';
import { planRoutes } from './modules/plans/routes';
import { flagRoutes } from './modules/flags/routes';
import { readingRoutes } from './modules/readings/routes';
import { photoRoutes } from './modules/photos/routes';
import { benchRoutes } from './modules/bench/routes';

export const jsonBodyLimitBytes = 1024 * 1024;

/** Builds the Express app without listening, so tests can run it on port 0. */
export function createApp(ctx: AppContext): express.Express {
  const app = express();
  app.disable('x-powered-by');
  // API answers are never cached (no-store), so no ETag is hashed over each body; static files keep theirs.
  app.set('etag', false);
  app.set('trust proxy', 'loopback');
  // First, so a stopping process waits for every answer, revision bumps included (shutdown.ts).
  app.use(ctx.inFlight.middleware);
  app.use(
    pinoHttp({
      logger: ctx.log,
      genReqId: (req, res) => {
        const incoming = req.headers['x-request-id'];
        const requestId = typeof incoming === 'string' && /^[\w-]{8,64}$/.test(incoming) ? incoming : randomUUID();
        res.setHeader('X-Request-Id', requestId);
        return requestId;
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // A request's log line says which request and how it ended, never its headers (its cookie
      // is the session). These see the request itself, not pino-std-serializers' copy of it with
      // every header, which pino-http would otherwise build and encode for every request, even
      // when nothing is logged at the level set (docs/performance.md, eighth pass).
      wrapSerializers: false,
      serializers: {
        req: (req: IncomingMessage & { id?: unknown; originalUrl?: string }) => ({ id: req.id, method: req.method, url: req.originalUrl ?? req.url, remoteAddress: req.socket?.remoteAddress }),
        res: (res: ServerResponse) => ({ statusCode: res.statusCode }),
        err: pino.stdSerializers.err,
      },
    }),
  );
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'upgrade-insecure-requests': null,
        },
      },
      crossOriginEmbedderPolicy: false,
      strictTransportSecurity: ctx.config.APP_ORIGIN?.startsWith('https:') ?? false,
    }),
  );

  // Before any parsing: a cross-site write is refused whatever its body.
  app.use(originCheck(ctx.config));
  // A phone on a weak signal gets scripts, styles, JSON and CSV gzipped (a third of their size
  // or less); photos, fonts and answers under 1 kB go as they are.
  app.use(compression());

  const api = express.Router();
  api.use(express.json({ limit: jsonBodyLimitBytes }));
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use(sessionMiddleware(ctx));
  // A write's answer leaves only after the data's revision has moved on (db/read-cache.ts).
  api.use(readRevisionOnWrite(ctx.db, ctx.log));
  // Every route declares its permission with allow() (access/policy.ts); the route table test
  // fails for one that does not.
  api.use(healthRoutes(ctx));
  api.use(authRoutes(ctx));
  api.use(userRoutes(ctx));
  api.use(registerRoutes(ctx));
  api.use(siteHealthRoutes(ctx));
  api.use(fleetRoutes(ctx));
  api.use(workOrderRoutes(ctx));
  api.use(planRoutes(ctx));
  api.use(flagRoutes(ctx));
  api.use(readingRoutes(ctx));
  api.use(photoRoutes(ctx));
  if (ctx.config.BENCH_ROUTES) api.use(benchRoutes(ctx));
  api.use(notFoundHandler);
  app.use('/api', api);

  serveWebApp(app, ctx.config.WEB_DIST_DIR, ctx.log);
  app.use(errorMiddleware);
  return app;
}
