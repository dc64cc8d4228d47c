import { parseCookies, serializeCookie } from 'oslo/cookie';
import { appOrigin, type Config } from '../config';

export const sessionCookieName = 'varden_session';

const attributes = (config: Config) => ({
  httpOnly: true,
  sameSite: 'lax' as const,
  path: '/',
  // Read per request: the origin decides, so the same build works on http://127.0.0.1 and https.
  secure: appOrigin(config).startsWith('https:'),
});

export function sessionCookie(config: Config, token: string, expiresAt: Date): string {
  return serializeCookie(sessionCookieName, token, { ...attributes(config), expires: expiresAt });
}

export function clearedSessionCookie(config: Config): string {
  return serializeCookie(sessionCookieName, '', { ...attributes(config), maxAge: 0, expires: new Date(0) });
}

export function sessionTokenFrom(cookieHeader: string | undefined): string | undefined {
  if (!cookieHeader) return undefined;
  const token = parseCookies(cookieHeader).get(sessionCookieName);
  return token && /^[A-Za-z0-9]{20,100}$/.test(token) ? token : undefined;
}
