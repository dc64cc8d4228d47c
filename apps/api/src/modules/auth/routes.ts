import { Router, type Request } from 'express';
import {
  changePasswordRequest,
  invitationCreate,
  passwordResetRequest,
  setPasswordRequest,
  signInRequest,
  type MessageResponse,
} from '@varden/schemas';
import type { z } from 'zod';
import type { AppContext } from '../../context';
import { validate } from '../../http/validate';
import { allow } from '../../access/allow';
import { currentSession, signedInUser } from '../../access/current-user';
import { clearedSessionCookie, sessionCookie } from '../../access/session-cookie';
import type { ClientInfo } from '../../access/sessions';
import { invite } from './invitation.service';
import { changePassword, requestPasswordReset, setPasswordWithToken } from './password.service';
import { currentUserResponse, signIn, signOut } from './sign-in.service';

const clientInfo = (req: Request): ClientInfo => ({ ip: req.ip ?? null, userAgent: req.get('user-agent') ?? null });

const resetAccepted: MessageResponse = {
  message: 'If an account uses this e-mail, a link to set a new password is on its way. It works for 1 hour.',
};

export function authRoutes(ctx: AppContext): Router {
  const router = Router();

  router.post('/auth/sign-in', allow('public'), validate({ body: signInRequest }), async (req, res) => {
    const body = res.locals.body as z.output<typeof signInRequest>;
    const signedIn = await signIn(ctx, body, clientInfo(req), currentSession(res)?.sessionId);
    res.append('Set-Cookie', sessionCookie(ctx.config, signedIn.token, signedIn.expiresAt));
    res.json(signedIn.response);
  });

  router.post('/auth/sign-out', allow('signed-in'), async (_req, res) => {
    await signOut(ctx, currentSession(res)!.sessionId);
    res.append('Set-Cookie', clearedSessionCookie(ctx.config));
    res.status(204).end();
  });

  router.get('/auth/me', allow('signed-in'), async (_req, res) => {
    res.json(await currentUserResponse(ctx, signedInUser(res).id));
  });

  router.post('/auth/invitations', allow('users:manage'), validate({ body: invitationCreate }), async (_req, res) => {
    const body = res.locals.body as z.output<typeof invitationCreate>;
    res.status(201).json(await invite(ctx, signedInUser(res), body));
  });

  router.post('/auth/password-resets', allow('public'), validate({ body: passwordResetRequest }), async (_req, res) => {
    await requestPasswordReset(ctx, (res.locals.body as z.output<typeof passwordResetRequest>).email);
    res.status(202).json(resetAccepted);
  });

  router.post('/auth/set-password', allow('public'), validate({ body: setPasswordRequest }), async (req, res) => {
    const body = res.locals.body as z.output<typeof setPasswordRequest>;
    res.json(await setPasswordWithToken(ctx, body, clientInfo(req)));
  });

  router.post('/auth/change-password', allow('signed-in'), validate({ body: changePasswordRequest }), async (req, res) => {
    const body = res.locals.body as z.output<typeof changePasswordRequest>;
    const session = await changePassword(ctx, signedInUser(res), body, clientInfo(req));
    res.append('Set-Cookie', sessionCookie(ctx.config, session.token, session.expiresAt));
    res.status(204).end();
  });

  return router;
}
