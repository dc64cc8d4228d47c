import type { Response } from 'express';
import { AppError } from '../http/app-error';
import type { Role } from './policy';

/** The signed-in person as the session middleware loaded them for this request. */
export interface SessionUser {
  id: number;
  email: string;
  name: string;
  roles: Role[];
  /** Sites granted to a viewer; see siteScope. */
  siteIds: number[];
}

export interface CurrentSession {
  sessionId: number;
  user: SessionUser;
}

// res.locals is loosely typed by Express; these accessors keep the one key and its type together.
const key = 'varden.session';

export function setCurrentSession(res: Response, session: CurrentSession | undefined): void {
  res.locals[key] = session;
}

export function currentSession(res: Response): CurrentSession | undefined {
  return res.locals[key] as CurrentSession | undefined;
}

/** The user behind a route that allow() already guarded; throws if the route forgot to. */
export function signedInUser(res: Response): SessionUser {
  const session = currentSession(res);
  if (!session) throw new AppError('unauthenticated', 'Sign in to continue.');
  return session.user;
}
