import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { authTokens, outbox, sessions, users } from '../../apps/api/src/db/schema/index';
import { purgeStaleAccessRecords } from '../../apps/api/src/modules/auth/housekeeping';
import { hashSecretToken } from '../../apps/api/src/security/secret-token';
import { createSite, createUser, defaultPassword, sessionCookieFrom, signIn, type CreatedUser } from '../support/factories';
import { latestMailTo, setPasswordLinkIn } from '../support/mailbox';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;
let planner: CreatedUser;
let viewer: CreatedUser;
let admin: CreatedUser;
let adminCookie: string;
let siteA: number;
let siteB: number;

beforeAll(async () => {
  app = await startTestApp();
  [siteA, siteB] = await Promise.all([createSite(app.ctx), createSite(app.ctx)]);
  [planner, viewer, admin] = await Promise.all([
    createUser(app.ctx, { roles: ['planner'], name: 'Tamsin Oakhurst' }),
    createUser(app.ctx, { roles: ['viewer'], siteIds: [siteA, siteB] }),
    createUser(app.ctx, { roles: ['admin'], name: 'Avery Quillon' }),
  ]);
  adminCookie = await signIn(app, admin.email, admin.password);
});
afterAll(async () => {
  await app.close();
});

let addressCounter = 0;
/**
 * A client address of its own (the app trusts X-Forwarded-For from loopback, as behind a proxy),
 * so this file's failed sign-ins never throttle 127.0.0.1 for other test files.
 */
const freshAddress = () => `10.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${++addressCounter % 250}`;

const signInAs = (email: string, password: string, address = freshAddress(), cookie?: string) =>
  app.request('/api/auth/sign-in', { json: { email, password }, headers: { 'x-forwarded-for': address }, ...(cookie ? { cookie } : {}) });

const me = (cookie?: string) => app.request('/api/auth/me', cookie ? { cookie } : {});

describe('POST /api/auth/sign-in', () => {
  test('answers the user with roles and permissions and sets an HttpOnly, SameSite=Lax session cookie', async () => {
    const res = await signInAs(planner.email.toUpperCase(), planner.password);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toEqual({
      user: {
        id: planner.user.id,
        email: planner.email,
        name: 'Tamsin Oakhurst',
        active: true,
        status: 'active',
        roles: ['planner'],
        siteIds: [],
        createdAt: expect.any(String),
        lastSignInAt: expect.any(String),
      },
      permissions: ['public', 'signed-in', 'register:read', 'register:write', 'plans:manage', 'work-orders:read', 'work-orders:schedule', 'reports:read'],
    });
    const setCookie = res.headers.getSetCookie().find((c) => c.startsWith('varden_session='));
    expect(setCookie).toMatch(/^varden_session=[A-Za-z0-9]{40}; /);
    expect(setCookie).toContain('HttpOnly');
    expect(setCookie).toContain('SameSite=Lax');
    expect(setCookie).toContain('Path=/');
    expect(setCookie).not.toContain('Secure'); // served over http here
    expect(res.headers.get('cache-control')).toBe('no-store');
  });

  test('stores only the SHA-256 of the token', async () => {
    const res = await signInAs(planner.email, planner.password);
    const token = sessionCookieFrom(res)!.split('=')[1]!;
    const [byHash] = await app.ctx.db.select().from(sessions).where(eq(sessions.tokenHash, hashSecretToken(token)));
    expect(byHash?.userId).toBe(planner.user.id);
    const [byToken] = await app.ctx.db.select().from(sessions).where(eq(sessions.tokenHash, token));
    expect(byToken).toBeUndefined();
  });

  test('a wrong password and an unknown e-mail get the same 401 and message, in similar time', async () => {
    const timed = async (email: string) => {
      const started = performance.now();
      const res = await signInAs(email, 'not the right passphrase');
      return { status: res.status, body: await res.json(), ms: performance.now() - started };
    };
    const wrongPassword = await timed(planner.email);
    const unknownEmail = await timed(`${unique('nobody')}@example.test`);
    const expected = { error: { code: 'unauthenticated', message: 'The e-mail or password is not right.' } };
    expect(wrongPassword).toMatchObject({ status: 401, body: expected });
    expect(unknownEmail).toMatchObject({ status: 401, body: expected });
    // Both verify an Argon2id hash; without the dummy check the unknown e-mail would answer in ~1 ms.
    expect(unknownEmail.ms).toBeGreaterThan(wrongPassword.ms * 0.4);
  });

  test('a deactivated or invited person gets the same 401, even with the right password', async () => {
    const gone = await createUser(app.ctx, { roles: ['technician'], active: false });
    const res = await signInAs(gone.email, gone.password);
    expect(res.status).toBe(401);
    expect((await res.json()).error.message).toBe('The e-mail or password is not right.');
  });

  test('invalid input gets 400 with field messages', async () => {
    const res = await app.request('/api/auth/sign-in', { json: { email: 'not-an-address', password: '' } });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.code).toBe('invalid');
    expect(body.error.fields).toEqual({
      email: 'Enter an e-mail address such as name@example.com',
      password: 'Enter your password',
    });
  });

  test('every sign-in gets a new token, and the session the browser had before ends', async () => {
    const first = sessionCookieFrom(await signInAs(planner.email, planner.password))!;
    const secondRes = await signInAs(planner.email, planner.password, freshAddress(), first);
    const second = sessionCookieFrom(secondRes)!;
    expect(second).not.toBe(first);
    expect((await me(first)).status).toBe(401);
    expect((await me(second)).status).toBe(200);
  });
});

describe('GET /api/auth/me', () => {
  test('is 401 when signed out', async () => {
    const res = await me();
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: { code: 'unauthenticated', message: 'Sign in to continue.' } });
  });

  test('answers a viewer with the granted site ids', async () => {
    const cookie = await signIn(app, viewer.email, viewer.password);
    const res = await me(cookie);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.user).toMatchObject({ id: viewer.user.id, roles: ['viewer'], siteIds: [siteA, siteB].sort((a, b) => a - b) });
    expect(body.permissions).toEqual(['public', 'signed-in', 'register:read', 'work-orders:read', 'reports:read']);
  });

  test('an unknown cookie is treated as signed out and cleared', async () => {
    const res = await me('varden_session=' + 'x'.repeat(40));
    expect(res.status).toBe(401);
    expect(res.headers.getSetCookie().some((c) => c.startsWith('varden_session=;') && c.includes('Max-Age=0'))).toBe(true);
  });
});

describe('session expiry', () => {
  const sessionOf = (cookie: string) => eq(sessions.tokenHash, hashSecretToken(cookie.split('=')[1]!));

  test('a session idle longer than SESSION_IDLE_MINUTES ends', async () => {
    const cookie = await signIn(app, planner.email, planner.password);
    const idle = new Date(Date.now() - (app.ctx.config.SESSION_IDLE_MINUTES + 1) * 60_000);
    await app.ctx.db.update(sessions).set({ lastSeenAt: idle }).where(sessionOf(cookie));
    expect((await me(cookie)).status).toBe(401);
    expect(await app.ctx.db.select().from(sessions).where(sessionOf(cookie))).toEqual([]);
  });

  test('a session past its absolute expiry ends, however active', async () => {
    const cookie = await signIn(app, planner.email, planner.password);
    await app.ctx.db.update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(sessionOf(cookie));
    expect((await me(cookie)).status).toBe(401);
  });

  test('housekeeping deletes expired sessions and keeps live ones', async () => {
    const [stale, live] = [await signIn(app, planner.email, planner.password), await signIn(app, planner.email, planner.password)];
    await app.ctx.db.update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(sessionOf(stale));
    await purgeStaleAccessRecords(app.ctx);
    expect(await app.ctx.db.select().from(sessions).where(sessionOf(stale))).toEqual([]);
    expect(await app.ctx.db.select().from(sessions).where(sessionOf(live))).toHaveLength(1);
  });

  test('activity moves the idle expiry, writing at most once a minute', async () => {
    const cookie = await signIn(app, planner.email, planner.password);
    const [created] = await app.ctx.db.select().from(sessions).where(sessionOf(cookie));
    await me(cookie);
    const [unchanged] = await app.ctx.db.select().from(sessions).where(sessionOf(cookie));
    expect(unchanged!.lastSeenAt).toEqual(created!.lastSeenAt);

    const twoMinutesAgo = new Date(Date.now() - 120_000);
    await app.ctx.db.update(sessions).set({ lastSeenAt: twoMinutesAgo }).where(sessionOf(cookie));
    await me(cookie);
    const [touched] = await app.ctx.db.select().from(sessions).where(sessionOf(cookie));
    expect(touched!.lastSeenAt.getTime()).toBeGreaterThan(Date.now() - 10_000);
  });
});

describe('POST /api/auth/sign-out', () => {
  test('ends the session and clears the cookie', async () => {
    const cookie = await signIn(app, planner.email, planner.password);
    const res = await app.request('/api/auth/sign-out', { method: 'POST', cookie });
    expect(res.status).toBe(204);
    expect(res.headers.getSetCookie().some((c) => c.startsWith('varden_session=;'))).toBe(true);
    expect((await me(cookie)).status).toBe(401);
  });

  test('is 401 when not signed in', async () => {
    expect((await app.request('/api/auth/sign-out', { method: 'POST' })).status).toBe(401);
  });
});

describe('cross-site request protection', () => {
  const refused = { error: { code: 'forbidden', message: 'Cross-site request refused' } };

  test('a write from another origin is refused with 403, before anything else runs', async () => {
    const cookie = await signIn(app, planner.email, planner.password);
    const res = await app.request('/api/auth/sign-out', { method: 'POST', cookie, headers: { origin: 'https://evil.example' } });
    expect(res.status).toBe(403);
    expect(await res.json()).toEqual(refused);
    expect((await me(cookie)).status).toBe(200); // the session survived
  });

  test('every state-changing method is checked, on routes that exist and routes that do not', async () => {
    for (const [method, path] of [
      ['POST', '/api/auth/sign-in'],
      ['PATCH', `/api/users/${planner.user.id}`],
      ['PUT', '/api/anything'],
      ['DELETE', '/api/anything'],
    ] as const) {
      const res = await app.request(path, { method, headers: { origin: 'http://127.0.0.1:1', 'content-type': 'application/json' }, body: '{}' });
      expect(res.status, `${method} ${path}`).toBe(403);
      expect(await res.json()).toEqual(refused);
    }
  });

  test('without Origin, Referer decides; without either, the write is refused', async () => {
    const viaReferer = await fetch(`${app.url}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', referer: `${app.url}/sign-in`, 'x-forwarded-for': freshAddress() },
      body: JSON.stringify({ email: planner.email, password: planner.password }),
    });
    expect(viaReferer.status).toBe(200);
    const foreignReferer = await fetch(`${app.url}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', referer: 'https://evil.example/page' },
      body: '{}',
    });
    expect(foreignReferer.status).toBe(403);
    const bare = await fetch(`${app.url}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' });
    expect(bare.status).toBe(403);
    expect(await bare.json()).toEqual(refused);
  });

  test('reads from another origin are not refused (they cannot change anything)', async () => {
    const res = await app.request('/api/health', { headers: { origin: 'https://evil.example' } });
    expect(res.status).not.toBe(403);
  });
});

describe('sign-in throttling', () => {
  test('five failures lock the account: 429 with Retry-After and when to try again, even with the right password', async () => {
    const person = await createUser(app.ctx, { roles: ['technician'] });
    for (let i = 0; i < 5; i++) expect((await signInAs(person.email, 'wrong passphrase here')).status).toBe(401);
    const res = await signInAs(person.email, person.password);
    expect(res.status).toBe(429);
    expect(await res.json()).toEqual({
      error: { code: 'throttled', message: 'Too many failed sign-ins. Try again in 5 minutes.' },
    });
    const retryAfter = Number(res.headers.get('retry-after'));
    expect(retryAfter).toBeGreaterThan(290);
    expect(retryAfter).toBeLessThanOrEqual(300);
  });

  test('an e-mail without an account is throttled the same way, so throttling reveals nothing', async () => {
    const nobody = `${unique('nobody')}@example.test`;
    for (let i = 0; i < 5; i++) expect((await signInAs(nobody, 'wrong passphrase here')).status).toBe(401);
    const res = await signInAs(nobody, 'wrong passphrase here');
    expect(res.status).toBe(429);
    expect((await res.json()).error.message).toBe('Too many failed sign-ins. Try again in 5 minutes.');
  });

  test('parallel guesses cannot slip past the limit', async () => {
    const person = await createUser(app.ctx, { roles: ['technician'] });
    const results = await Promise.all(Array.from({ length: 12 }, () => signInAs(person.email, 'wrong passphrase here')));
    const statuses = results.map((r) => r.status);
    expect(statuses.filter((s) => s === 401).length).toBeLessThanOrEqual(5);
    expect(statuses.filter((s) => s === 429).length).toBeGreaterThanOrEqual(7);
  });

  test('twenty failures from one address hold that address for every account; other addresses go on', async () => {
    const address = freshAddress();
    for (let i = 0; i < 20; i++) {
      expect((await signInAs(`${unique('spray')}@example.test`, 'wrong passphrase here', address)).status).toBe(401);
    }
    const fromThere = await signInAs(planner.email, planner.password, address);
    expect(fromThere.status).toBe(429);
    expect(Number(fromThere.headers.get('retry-after'))).toBeGreaterThan(800);
    expect((await fromThere.json()).error.message).toMatch(/^Too many failed sign-ins\. Try again in 1[45] minutes\.$/);
    expect((await signInAs(planner.email, planner.password, freshAddress())).status).toBe(200);
  });
});

describe('password reset', () => {
  const requestReset = (email: string) => app.request('/api/auth/password-resets', { json: { email } });

  test('mails a single-use link that sets a new password and ends every session', async () => {
    const person = await createUser(app.ctx, { roles: ['supervisor'] });
    const oldCookie = await signIn(app, person.email, person.password);
    const res = await requestReset(person.email);
    expect(res.status).toBe(202);
    expect((await res.json()).message).toMatch(/If an account uses this e-mail/);

    const mail = await latestMailTo(app, person.email, 'Set a new Varden password');
    const link = setPasswordLinkIn(mail);
    expect(link.url.origin).toBe(app.url);
    expect(link.purpose).toBe('reset');
    const [stored] = await app.ctx.db.select().from(authTokens).where(eq(authTokens.tokenHash, hashSecretToken(link.token)));
    expect(stored).toMatchObject({ userId: person.user.id, purpose: 'reset', usedAt: null });
    expect(stored!.expiresAt.getTime() - stored!.createdAt.getTime()).toBe(3_600_000);

    const newPassword = 'lantern over the cable tray';
    const set = await app.request('/api/auth/set-password', { json: { token: link.token, password: newPassword } });
    expect(set.status).toBe(200);
    expect(await set.json()).toEqual({ email: person.email, purpose: 'reset' });

    expect((await me(oldCookie)).status).toBe(401);
    expect((await signInAs(person.email, person.password)).status).toBe(401);
    expect((await signInAs(person.email, newPassword)).status).toBe(200);

    const again = await app.request('/api/auth/set-password', { json: { token: link.token, password: 'another fine passphrase' } });
    expect(again.status).toBe(400);
    expect((await again.json()).error).toEqual({
      code: 'invalid',
      message: 'This link has expired or was already used. Ask for a new link to set your password.',
      fields: { token: 'The link is no longer valid' },
    });
  });

  test('answers 202 alike for an unknown e-mail and a deactivated account, and mails neither', async () => {
    const nobody = `${unique('nobody')}@example.test`;
    const gone = await createUser(app.ctx, { roles: ['viewer'], active: false });
    for (const email of [nobody, gone.email]) {
      const res = await requestReset(email);
      expect(res.status).toBe(202);
      expect((await res.json()).message).toMatch(/If an account uses this e-mail/);
      expect(await app.ctx.db.select().from(outbox).where(eq(outbox.toAddress, email))).toEqual([]);
    }
  });

  test('an expired link is refused', async () => {
    const person = await createUser(app.ctx, { roles: ['planner'] });
    await requestReset(person.email);
    const { token } = setPasswordLinkIn(await latestMailTo(app, person.email));
    await app.ctx.db.update(authTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(authTokens.tokenHash, hashSecretToken(token)));
    const res = await app.request('/api/auth/set-password', { json: { token, password: 'lantern over the cable tray' } });
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields).toEqual({ token: 'The link is no longer valid' });
    expect((await signInAs(person.email, person.password)).status).toBe(200);
  });

  test('an unknown token is refused', async () => {
    const res = await app.request('/api/auth/set-password', { json: { token: 'A'.repeat(40), password: 'lantern over the cable tray' } });
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields).toEqual({ token: 'The link is no longer valid' });
  });

  test('the new password must meet the policy, with a message on the field; the link stays usable', async () => {
    const person = await createUser(app.ctx, { roles: ['planner'] });
    await requestReset(person.email);
    const { token } = setPasswordLinkIn(await latestMailTo(app, person.email));
    const cases: Array<[string, RegExp]> = [
      ['too short', /at least 12 characters/],
      ['Password1234', /commonly used passwords/],
      [person.email.toUpperCase(), /e-mail address/],
    ];
    for (const [password, message] of cases) {
      const res = await app.request('/api/auth/set-password', { json: { token, password } });
      expect(res.status).toBe(400);
      expect((await res.json()).error.fields.password).toMatch(message);
    }
    const ok = await app.request('/api/auth/set-password', { json: { token, password: 'a long walk to the substation' } });
    expect(ok.status).toBe(200);
  });

  test('a used reset link unlocks an account locked by failed sign-ins', async () => {
    const person = await createUser(app.ctx, { roles: ['planner'] });
    for (let i = 0; i < 5; i++) await signInAs(person.email, 'wrong passphrase here');
    expect((await signInAs(person.email, person.password)).status).toBe(429);
    await requestReset(person.email);
    const { token } = setPasswordLinkIn(await latestMailTo(app, person.email));
    expect((await app.request('/api/auth/set-password', { json: { token, password: 'quiet hum of the reactor' } })).status).toBe(200);
    expect((await signInAs(person.email, 'quiet hum of the reactor')).status).toBe(200);
  });
});

describe('POST /api/auth/invitations', () => {
  const invite = (json: unknown, cookie = adminCookie) => app.request('/api/auth/invitations', { json, cookie });

  test('an administrator invites; the mailed link sets a password, activates the account and signs in', async () => {
    const email = `${unique('invitee')}@Example.test`;
    const res = await invite({ email, name: 'Mireille Dunstan', roles: ['viewer'], siteIds: [siteA] });
    expect(res.status).toBe(201);
    const invited = await res.json();
    expect(invited).toEqual({
      id: expect.any(Number),
      email: email.toLowerCase(),
      name: 'Mireille Dunstan',
      active: false,
      status: 'invited',
      roles: ['viewer'],
      siteIds: [siteA],
      createdAt: expect.any(String),
      lastSignInAt: null,
    });
    expect((await signInAs(email, 'anything at all here')).status).toBe(401);

    const mail = await latestMailTo(app, email, 'You are invited to Varden');
    expect(mail!.text).toContain('Avery Quillon has invited you');
    const link = setPasswordLinkIn(mail);
    expect(link.purpose).toBe('invitation');
    const [stored] = await app.ctx.db.select().from(authTokens).where(eq(authTokens.tokenHash, hashSecretToken(link.token)));
    expect(stored!.expiresAt.getTime() - stored!.createdAt.getTime()).toBe(7 * 24 * 3_600_000);

    const set = await app.request('/api/auth/set-password', { json: { token: link.token, password: 'the kettle by the switchboard' } });
    expect(set.status).toBe(200);
    expect(await set.json()).toEqual({ email: email.toLowerCase(), purpose: 'invitation' });
    const signedIn = await signInAs(email, 'the kettle by the switchboard');
    expect(signedIn.status).toBe(200);
    expect((await signedIn.json()).user).toMatchObject({ status: 'active', active: true, siteIds: [siteA] });

    const log = await app.request(`/api/audit-log?targetType=user&targetId=${invited.id}`, { cookie: adminCookie });
    const actions = (await log.json()).items.map((e: { action: string }) => e.action);
    expect(actions).toEqual(['user.invitation-accepted', 'user.invited']);
  });

  test('inviting again before acceptance replaces the pending link', async () => {
    const email = `${unique('twice')}@example.test`;
    await invite({ email, name: 'First Try', roles: ['technician'] });
    const first = setPasswordLinkIn(await latestMailTo(app, email));
    const again = await invite({ email, name: 'Second Try', roles: ['technician', 'supervisor'] });
    expect(again.status).toBe(201);
    expect(await again.json()).toMatchObject({ name: 'Second Try', roles: ['technician', 'supervisor'], status: 'invited' });
    const [firstRow] = await app.ctx.db.select().from(authTokens).where(eq(authTokens.tokenHash, hashSecretToken(first.token)));
    expect(firstRow).toBeUndefined();
    const refused = await app.request('/api/auth/set-password', { json: { token: first.token, password: 'the kettle by the switchboard' } });
    expect(refused.status).toBe(400);
  });

  test('an e-mail that already has an account is a 409', async () => {
    const res = await invite({ email: planner.email, name: 'Someone', roles: ['planner'] });
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatchObject({ code: 'conflict', fields: { email: 'Someone with this e-mail already has an account' } });
  });

  test('invalid input gets field messages', async () => {
    const res = await invite({ email: 'nope', name: '', roles: [], siteIds: [1] });
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields).toMatchObject({
      email: expect.any(String),
      name: 'Enter a name',
      roles: 'Choose at least one role',
    });
    const sitesForPlanner = await invite({ email: `${unique('p')}@example.test`, name: 'P', roles: ['planner'], siteIds: [1] });
    expect((await sitesForPlanner.json()).error.fields).toEqual({ siteIds: 'Sites are granted to viewers only' });
  });

  test('only administrators invite', async () => {
    const cookie = await signIn(app, planner.email, planner.password);
    const res = await invite({ email: `${unique('x')}@example.test`, name: 'X', roles: ['planner'] }, cookie);
    expect(res.status).toBe(403);
    expect((await app.request('/api/auth/invitations', { json: {} })).status).toBe(401);
  });
});

describe('POST /api/auth/change-password', () => {
  const change = (cookie: string, json: unknown, address = freshAddress()) =>
    app.request('/api/auth/change-password', { json, cookie, headers: { 'x-forwarded-for': address } });

  test('checks the current password, keeps this browser signed in and signs out every other', async () => {
    const person = await createUser(app.ctx, { roles: ['technician'] });
    const here = await signIn(app, person.email, person.password);
    const elsewhere = await signIn(app, person.email, person.password);
    const res = await change(here, { currentPassword: person.password, newPassword: 'rain on the transformer yard' });
    expect(res.status).toBe(204);
    const renewed = sessionCookieFrom(res)!;
    expect(renewed).toBeDefined();
    expect((await me(renewed)).status).toBe(200);
    expect((await me(here)).status).toBe(401);
    expect((await me(elsewhere)).status).toBe(401);
    expect((await signInAs(person.email, 'rain on the transformer yard')).status).toBe(200);
    const [row] = await app.ctx.db.select().from(users).where(eq(users.id, person.user.id));
    expect(row!.passwordChangedAt!.getTime()).toBeGreaterThan(Date.now() - 10_000);
  });

  test('a wrong current password or a weak new one is a 400 on its field', async () => {
    const person = await createUser(app.ctx, { roles: ['technician'] });
    const cookie = await signIn(app, person.email, person.password);
    const wrong = await change(cookie, { currentPassword: 'not my password at all', newPassword: 'rain on the transformer yard' });
    expect(wrong.status).toBe(400);
    expect((await wrong.json()).error.fields).toEqual({ currentPassword: 'This is not your current password.' });
    const weak = await change(cookie, { currentPassword: person.password, newPassword: 'qwertyuiop123' });
    expect(weak.status).toBe(400);
    expect((await weak.json()).error.fields.newPassword).toMatch(/commonly used/);
    expect((await me(cookie)).status).toBe(200);
  });

  test('needs a signed-in user', async () => {
    const res = await app.request('/api/auth/change-password', { json: { currentPassword: defaultPassword, newPassword: 'x'.repeat(20) } });
    expect(res.status).toBe(401);
  });
});

describe('deactivation', () => {
  test('ends every session of the person at once', async () => {
    const person = await createUser(app.ctx, { roles: ['technician'] });
    const cookie = await signIn(app, person.email, person.password);
    const res = await app.request(`/api/users/${person.user.id}`, { method: 'PATCH', json: { active: false }, cookie: adminCookie });
    expect(res.status).toBe(200);
    expect((await me(cookie)).status).toBe(401);
    expect(await app.ctx.db.select().from(sessions).where(and(eq(sessions.userId, person.user.id)))).toEqual([]);
  });
});
