import type { RequestHandler } from 'express';
import type { AppContext } from '../context';
import { setCurrentSession } from './current-user';
import { clearedSessionCookie, sessionTokenFrom } from './session-cookie';
import { resumeSession } from './sessions';

/**
 * Loads the signed-in user from the session cookie for every API request. A cookie that no
 * longer stands for a session is cleared, so the browser stops sending it.
 */
export function sessionMiddleware(ctx: AppContext): RequestHandler {
  return async (req, res, next) => {
    const token = sessionTokenFrom(req.headers.cookie);
    if (!token) {
      setCurrentSession(res, undefined);
      return next();
    }
    const session = await resumeSession(ctx.db, ctx.config, token);
    setCurrentSession(res, session);
    if (!session) res.append('Set-Cookie', clearedSessionCookie(ctx.config));
    next();
  };
}
