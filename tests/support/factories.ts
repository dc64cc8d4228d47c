import type { Role, User } from '@varden/schemas';
import type { AppContext } from '../../apps/api/src/context';
import { startSession } from '../../apps/api/src/access/sessions';
import { sessionCookieName } from '../../apps/api/src/access/session-cookie';
import { hashPassword } from '../../apps/api/src/security/password-hashing';
import { findUserRecord, insertUser, replaceRoles, replaceSiteGrants } from '../../apps/api/src/modules/users/repository';
import { toUser } from '../../apps/api/src/modules/users/to-user';
import { sites } from '../../apps/api/src/db/schema/index';
import type { TestApp } from './test-app';
import { unique } from './test-app';

/** A passphrase the policy accepts; its Argon2id hash is computed once per test file. */
export const defaultPassword = 'copper busbar under the mezzanine';

const hashes = new Map<string, Promise<string>>();
const hashOnce = (password: string) => {
  let hash = hashes.get(password);
  if (!hash) {
    hash = hashPassword(password);
    hashes.set(password, hash);
  }
  return hash;
};

export interface CreatedUser {
  user: User;
  email: string;
  password: string;
}

/**
 * A person with a unique e-mail, written straight to the database (no invitation): active with
 * a password unless told otherwise, so it can sign in at once.
 */
export async function createUser(
  ctx: AppContext,
  options: { roles: Role[]; password?: string; siteIds?: number[]; name?: string; email?: string; active?: boolean },
): Promise<CreatedUser> {
  const password = options.password ?? defaultPassword;
  const email = (options.email ?? `${unique(options.roles.join('-') || 'nobody')}@example.test`).toLowerCase();
  const passwordHash = await hashOnce(password);
  const id = await ctx.db.transaction(async (tx) => {
    const userId = await insertUser(tx, {
      email,
      name: options.name ?? `Test ${options.roles.join(' and ') || 'person'}`,
      passwordHash,
      active: options.active ?? true,
      deactivatedAt: options.active === false ? new Date() : null,
      passwordChangedAt: new Date(),
    });
    await replaceRoles(tx, userId, options.roles);
    await replaceSiteGrants(tx, userId, options.siteIds ?? []);
    return userId;
  });
  const record = await findUserRecord(ctx.db, id);
  return { user: toUser(record!), email, password };
}

/** The session cookie from the Set-Cookie header of a response, as a Cookie header value. */
export function sessionCookieFrom(res: Response): string | undefined {
  for (const header of res.headers.getSetCookie()) {
    const [pair] = header.split(';');
    if (pair?.startsWith(`${sessionCookieName}=`) && pair.length > sessionCookieName.length + 1) return pair;
  }
  return undefined;
}

/** Signs in through the API and returns the Cookie header value for later requests. */
export async function signIn(app: TestApp, email: string, password: string): Promise<string> {
  const res = await app.request('/api/auth/sign-in', { json: { email, password } });
  const cookie = sessionCookieFrom(res);
  if (res.status !== 200 || !cookie) throw new Error(`sign-in of ${email} failed: ${res.status} ${await res.text()}`);
  return cookie;
}

/** A session opened directly, without a password check: for tests that need many sessions fast. */
export async function sessionCookieFor(ctx: AppContext, userId: number): Promise<string> {
  const { token } = await startSession(ctx.db, ctx.config, userId, { ip: '127.0.0.1', userAgent: 'varden-tests' });
  return `${sessionCookieName}=${token}`;
}

/** A site with a unique name and plausible 400 V 50 Hz supply, written straight to the database. */
export async function createSite(ctx: AppContext, values: Partial<typeof sites.$inferInsert> = {}): Promise<number> {
  const [created] = await ctx.db
    .insert(sites)
    .values({
      name: unique('Site'),
      voltageV: 400,
      frequencyHz: 50,
      transformerKva: 1000,
      transformerImpedancePct: 6,
      targetPf: 0.95,
      tariffBasis: 'pf-threshold',
      tariffLimit: 0.9,
      ...values,
    })
    .$returningId();
  return created!.id;
}
