import type { RequestHandler } from 'express';
import { appOrigin, type Config } from '../config';
import { AppError } from '../http/app-error';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The origin a request says it comes from: Origin, else the origin of Referer. */
export function requestOrigin(origin: string | undefined, referer: string | undefined): string | undefined {
  if (origin) return origin;
  if (!referer) return undefined;
  try {
    return new URL(referer).origin;
  } catch {
    return undefined;
  }
}

/**
 * Cross-site request protection (OWASP's "verifying origin with standard headers"): a
 * state-changing request must come from a page of the app's own origin. Browsers always send
 * Origin on such requests, so a missing one is refused too. With SameSite=Lax cookies this
 * closes cross-site request forgery without a token.
 */
export function originCheck(config: Config): RequestHandler {
  return (req, _res, next) => {
    if (safeMethods.has(req.method)) return next();
    const claimed = requestOrigin(req.headers.origin, req.headers.referer);
    // Read per request, so a test app that learns its port after start checks the right origin.
    if (claimed !== appOrigin(config)) throw new AppError('forbidden', 'Cross-site request refused');
    next();
  };
}
