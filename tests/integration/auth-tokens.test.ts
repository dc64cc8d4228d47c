import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { authTokens, users } from '../../apps/api/src/db/schema/index';
import { hashSecretToken } from '../../apps/api/src/security/secret-token';
import { createUser, signIn, type CreatedUser } from '../support/factories';
import { latestMailTo, setPasswordLinkIn } from '../support/mailbox';
import { startTestApp, unique, type TestApp } from '../support/test-app';

// Invitation and reset links are single-use and expire, also when two tabs use one link at once;
// the session cookie is Secure wherever Varden is served over https.
let app: TestApp;
let adminCookie: string;

beforeAll(async () => {
  app = await startTestApp();
  const admin: CreatedUser = await createUser(app.ctx, { roles: ['admin'], name: 'Ilse Marrow' });
  adminCookie = await signIn(app, admin.email, admin.password);
});
afterAll(async () => {
  await app.close();
});

let addressCounter = 0;
/** A client address of its own, so sign-ins here never throttle 127.0.0.1 for other files. */
const freshAddress = () => `10.77.${Math.floor(Math.random() * 250)}.${++addressCounter % 250}`;
const signInAs = (email: string, password: string) =>
  app.request('/api/auth/sign-in', { json: { email, password }, headers: { 'x-forwarded-for': freshAddress() } });
const setPassword = (token: string, password: string) => app.request('/api/auth/set-password', { json: { token, password } });

async function invitationLink(): Promise<{ email: string; token: string }> {
  const email = `${unique('invitee')}@example.test`;
  const res = await app.request('/api/auth/invitations', { json: { email, name: 'Oren Halloway', roles: ['technician'] }, cookie: adminCookie });
  expect(res.status).toBe(201);
  const link = setPasswordLinkIn(await latestMailTo(app, email, 'You are invited to Varden'));
  expect(link.purpose).toBe('invitation');
  return { email, token: link.token };
}

const noLongerValid = { token: 'The link is no longer valid' };

describe('invitation links', () => {
  test('work once: a second use is refused and the password set first stays', async () => {
    const { email, token } = await invitationLink();
    expect((await setPassword(token, 'gravel path by the substation')).status).toBe(200);
    const again = await setPassword(token, 'someone else chose this one');
    expect(again.status).toBe(400);
    expect((await again.json()).error.fields).toEqual(noLongerValid);
    expect((await signInAs(email, 'someone else chose this one')).status).toBe(401);
    expect((await signInAs(email, 'gravel path by the substation')).status).toBe(200);
  });

  test('expire: an expired link is refused and the account stays invited, unable to sign in', async () => {
    const { email, token } = await invitationLink();
    await app.ctx.db.update(authTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(authTokens.tokenHash, hashSecretToken(token)));
    const res = await setPassword(token, 'gravel path by the substation');
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields).toEqual(noLongerValid);
    const [row] = await app.ctx.db.select({ active: users.active }).from(users).where(eq(users.email, email));
    expect(row).toEqual({ active: false });
    expect((await signInAs(email, 'gravel path by the substation')).status).toBe(401);
  });

  test('one link used in two tabs at once: exactly one sets the password', async () => {
    const { email, token } = await invitationLink();
    const answers = await Promise.all([setPassword(token, 'first tab passphrase here'), setPassword(token, 'second tab passphrase here')]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 400]);
    const winner = answers[0]!.status === 200 ? 'first tab passphrase here' : 'second tab passphrase here';
    const loser = winner.startsWith('first') ? 'second tab passphrase here' : 'first tab passphrase here';
    expect((await signInAs(email, winner)).status).toBe(200);
    expect((await signInAs(email, loser)).status).toBe(401);
  });
});

describe('reset links', () => {
  test('one link used twice at once: exactly one sets the password', async () => {
    const person = await createUser(app.ctx, { roles: ['planner'] });
    expect((await app.request('/api/auth/password-resets', { json: { email: person.email } })).status).toBe(202);
    const { token } = setPasswordLinkIn(await latestMailTo(app, person.email, 'Set a new Varden password'));
    const answers = await Promise.all([setPassword(token, 'lantern over the cable tray'), setPassword(token, 'ladder against the panel')]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 400]);
    const [stored] = await app.ctx.db.select().from(authTokens).where(eq(authTokens.tokenHash, hashSecretToken(token)));
    expect(stored!.usedAt).toBeInstanceOf(Date);
  });
});

describe('the session cookie over https', () => {
  test('is Secure, HttpOnly and SameSite=Lax when Varden is served from an https origin', async () => {
    const https = await startTestApp();
    try {
      const person = await createUser(https.ctx, { roles: ['viewer'] });
      https.ctx.config.APP_ORIGIN = 'https://varden.example.test';
      const res = await https.request('/api/auth/sign-in', {
        json: { email: person.email, password: person.password },
        headers: { origin: 'https://varden.example.test', 'x-forwarded-for': freshAddress() },
      });
      expect(res.status).toBe(200);
      const cookie = res.headers.getSetCookie().find((c) => c.startsWith('varden_session='));
      expect(cookie).toMatch(/; Secure/i);
      expect(cookie).toMatch(/; HttpOnly/i);
      expect(cookie).toMatch(/; SameSite=Lax/i);
    } finally {
      await https.close();
    }
  });
});
