import type { RequestHandler } from 'express';
import { AppError } from '../http/app-error';
import { currentSession } from './current-user';
import { can, needsSignIn, type Permission } from './policy';

const permissionMark = Symbol.for('varden.permission');

type MarkedHandler = RequestHandler & { [permissionMark]: Permission };

/**
 * The first handler of every API route: answers 401 when the permission needs a signed-in user
 * and there is none, 403 when the user's roles do not hold it. The handler carries the
 * permission so the route table test can check that no route goes without one.
 */
export function allow(permission: Permission): RequestHandler {
  const guard: RequestHandler = (_req, res, next) => {
    if (!needsSignIn(permission)) return next();
    const session = currentSession(res);
    if (!session) throw new AppError('unauthenticated', 'Sign in to continue.');
    if (!can(session.user.roles, permission)) {
      throw new AppError('forbidden', 'Your role does not allow this. Ask an administrator if you need it.');
    }
    next();
  };
  const marked: MarkedHandler = Object.assign(guard, { [permissionMark]: permission });
  return marked;
}

/** The permission a handler was made with by allow(), if it was. */
export function declaredPermission(handler: unknown): Permission | undefined {
  if (typeof handler !== 'function') return undefined;
  return (handler as Partial<MarkedHandler>)[permissionMark];
}
