import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { demoAccounts, seedDemoAccounts } from '../../apps/api/src/modules/users/demo-accounts';
import { createSite, createUser, signIn, type CreatedUser } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;
let admin: CreatedUser;
let otherAdmin: CreatedUser;
let adminCookie: string;
/** A word no other test file uses, so searches and filters see only this file's people. */
const tribe = unique('kestrel').replace(/-/g, '');

beforeAll(async () => {
  app = await startTestApp();
  [admin, otherAdmin] = await Promise.all([
    createUser(app.ctx, { roles: ['admin'], name: `Admin ${tribe}` }),
    createUser(app.ctx, { roles: ['admin'], name: `Second admin ${tribe}` }),
  ]);
  adminCookie = await signIn(app, admin.email, admin.password);
});
afterAll(async () => {
  await app.close();
});

const get = (path: string, cookie = adminCookie) => app.request(path, { cookie });
const patch = (id: number, json: unknown, cookie = adminCookie) => app.request(`/api/users/${id}`, { method: 'PATCH', json, cookie });

describe('GET /api/users', () => {
  let people: CreatedUser[];
  beforeAll(async () => {
    people = [];
    // Created one after the other so createdAt sorts them in this order.
    for (const [name, roles] of [
      ['Bertil', ['planner']],
      ['Aino', ['technician']],
      ['Dagny', ['viewer']],
      ['Cyrus', ['technician', 'supervisor']],
      ['Eero', ['technician']],
    ] as const) {
      people.push(await createUser(app.ctx, { roles: [...roles], name: `${name} ${tribe}`, email: `${name.toLowerCase()}.${tribe}@example.test` }));
    }
    people.push(await createUser(app.ctx, { roles: ['planner'], name: `Fenna ${tribe}`, active: false }));
  });

  test('searches name and e-mail, sorts and pages on the server', async () => {
    const res = await get(`/api/users?q=${tribe}&sort=name&page=1&pageSize=3`);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.total).toBe(8);
    expect(body.items.map((u: { name: string }) => u.name)).toEqual([`Admin ${tribe}`, `Aino ${tribe}`, `Bertil ${tribe}`]);
    expect(body.items[1]).toEqual({
      id: people[1]!.user.id,
      email: `aino.${tribe}@example.test`,
      name: `Aino ${tribe}`,
      active: true,
      status: 'active',
      roles: ['technician'],
      siteIds: [],
      createdAt: expect.any(String),
      lastSignInAt: null,
    });

    const page3 = await (await get(`/api/users?q=${tribe}&sort=-name&page=3&pageSize=3`)).json();
    expect(page3.items.map((u: { name: string }) => u.name)).toEqual([`Aino ${tribe}`, `Admin ${tribe}`]);
    expect(page3.total).toBe(8);

    const byEmail = await (await get(`/api/users?q=dagny.${tribe}`)).json();
    expect(byEmail.items.map((u: { name: string }) => u.name)).toEqual([`Dagny ${tribe}`]);
  });

  test('filters by role and status', async () => {
    const technicians = await (await get(`/api/users?q=${tribe}&role=technician&sort=name`)).json();
    expect(technicians.items.map((u: { name: string }) => u.name)).toEqual([`Aino ${tribe}`, `Cyrus ${tribe}`, `Eero ${tribe}`]);
    const deactivated = await (await get(`/api/users?q=${tribe}&status=deactivated`)).json();
    expect(deactivated.items.map((u: { name: string }) => u.name)).toEqual([`Fenna ${tribe}`]);
    expect(deactivated.items[0].status).toBe('deactivated');
  });

  test('sorts by creation time both ways', async () => {
    const newest = await (await get(`/api/users?q=${tribe}&sort=-createdAt&pageSize=2`)).json();
    expect(newest.items.map((u: { name: string }) => u.name)).toEqual([`Fenna ${tribe}`, `Eero ${tribe}`]);
  });

  test('a search with LIKE wildcards matches them literally', async () => {
    const body = await (await get(`/api/users?q=${encodeURIComponent('%_')}`)).json();
    expect(body).toEqual({ items: [], total: 0 });
  });

  test('bad query parameters get 400 with field messages', async () => {
    const res = await get('/api/users?page=0&pageSize=1000&sort=password');
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).error.fields).sort()).toEqual(['page', 'pageSize', 'sort']);
  });

  test('is for administrators only', async () => {
    const planner = people[0]!;
    const cookie = await signIn(app, planner.email, planner.password);
    expect((await get('/api/users', cookie)).status).toBe(403);
    expect((await app.request('/api/users')).status).toBe(401);
  });
});

describe('GET /api/users/:id', () => {
  test('answers one user, 404 for an unknown id, 400 for a malformed one', async () => {
    const [first, second] = [await createSite(app.ctx), await createSite(app.ctx)];
    const viewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [second, first] });
    const res = await get(`/api/users/${viewer.user.id}`);
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ ...viewer.user, siteIds: [first, second] });
    expect((await get('/api/users/999999999')).status).toBe(404);
    expect((await get('/api/users/abc')).status).toBe(400);
  });
});

describe('PATCH /api/users/:id', () => {
  test('changes name, roles and site grants, and writes each change to the audit log', async () => {
    const [s1, s2, s9] = [await createSite(app.ctx), await createSite(app.ctx), await createSite(app.ctx)];
    const person = await createUser(app.ctx, { roles: ['viewer'], siteIds: [s1], name: 'Ilse Warrender' });
    const res = await patch(person.user.id, { name: 'Ilse Warrender-Pike', siteIds: [s2, s9, s2] });
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ name: 'Ilse Warrender-Pike', roles: ['viewer'], siteIds: [s2, s9] });
    const unknownSite = await patch(person.user.id, { siteIds: [999_999_999] });
    expect(unknownSite.status).toBe(400);
    expect((await unknownSite.json()).error.fields).toHaveProperty('siteIds');

    const promoted = await (await patch(person.user.id, { roles: ['planner'] })).json();
    expect(promoted).toMatchObject({ roles: ['planner'], siteIds: [] }); // grants go with the viewer role

    const log = await (await get(`/api/audit-log?targetType=user&targetId=${person.user.id}`)).json();
    expect(log.total).toBe(2);
    expect(log.items[0]).toEqual({
      id: expect.any(Number),
      at: expect.any(String),
      actor: { id: admin.user.id, name: `Admin ${tribe}`, email: admin.email },
      action: 'user.updated',
      targetType: 'user',
      targetId: person.user.id,
      details: { changes: { roles: { from: ['viewer'], to: ['planner'] }, siteIds: { from: [s2, s9], to: [] } } },
    });
    expect(log.items[1].details).toEqual({
      changes: { name: { from: 'Ilse Warrender', to: 'Ilse Warrender-Pike' }, siteIds: { from: [s1], to: [s2, s9] } },
    });
  });

  test('a change to nothing writes nothing', async () => {
    const person = await createUser(app.ctx, { roles: ['planner'], name: 'Same Name' });
    expect((await patch(person.user.id, { name: 'Same Name', roles: ['planner'] })).status).toBe(200);
    const log = await (await get(`/api/audit-log?targetType=user&targetId=${person.user.id}`)).json();
    expect(log.total).toBe(0);
  });

  test('a role change takes effect on the very next request of a signed-in person', async () => {
    const person = await createUser(app.ctx, { roles: ['planner'] });
    const cookie = await signIn(app, person.email, person.password);
    expect((await get('/api/users', cookie)).status).toBe(403);
    await patch(person.user.id, { roles: ['planner', 'admin'] });
    expect((await get('/api/users', cookie)).status).toBe(200);
  });

  test('deactivates and reactivates; a deactivated person cannot sign in', async () => {
    const person = await createUser(app.ctx, { roles: ['technician'] });
    const off = await patch(person.user.id, { active: false });
    expect(await off.json()).toMatchObject({ active: false, status: 'deactivated' });
    expect((await app.request('/api/auth/sign-in', { json: { email: person.email, password: person.password } })).status).toBe(401);
    const on = await patch(person.user.id, { active: true });
    expect(await on.json()).toMatchObject({ active: true, status: 'active' });
    expect((await app.request('/api/auth/sign-in', { json: { email: person.email, password: person.password } })).status).toBe(200);
  });

  test('an administrator cannot deactivate themselves or drop their own admin role: 409', async () => {
    const selfOff = await patch(admin.user.id, { active: false });
    expect(selfOff.status).toBe(409);
    expect((await selfOff.json()).error).toEqual({
      code: 'conflict',
      message: 'You cannot deactivate your own account. Another administrator can.',
    });
    const selfDemote = await patch(admin.user.id, { roles: ['planner'] });
    expect(selfDemote.status).toBe(409);
    expect((await selfDemote.json()).error.message).toBe('You cannot remove your own administrator role. Another administrator can.');
    // Adding a role to oneself is fine; another administrator may demote.
    expect((await patch(admin.user.id, { roles: ['admin', 'viewer'] })).status).toBe(200);
    expect((await patch(otherAdmin.user.id, { roles: ['supervisor'] })).status).toBe(200);
  });

  test('an invitation not yet accepted cannot be activated by hand', async () => {
    const email = `${unique('pending')}@example.test`;
    const invited = await (await app.request('/api/auth/invitations', { json: { email, name: 'Pending Person', roles: ['planner'] }, cookie: adminCookie })).json();
    const res = await patch(invited.id, { active: true });
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toBe('Pending Person has not accepted the invitation yet. Invite them again instead.');
  });

  test('invalid changes get 400; unknown users 404', async () => {
    const person = await createUser(app.ctx, { roles: ['planner'] });
    const empty = await patch(person.user.id, {});
    expect(empty.status).toBe(400);
    const unknownField = await patch(person.user.id, { email: 'new@example.test' });
    expect(unknownField.status).toBe(400);
    const badRole = await patch(person.user.id, { roles: ['owner'] });
    expect((await badRole.json()).error.fields).toHaveProperty('roles.0');
    const sitesForPlanner = await patch(person.user.id, { siteIds: [3] });
    expect(sitesForPlanner.status).toBe(400);
    expect((await sitesForPlanner.json()).error.fields).toEqual({ siteIds: 'Sites are granted to viewers only' });
    expect((await patch(999999999, { name: 'Nobody' })).status).toBe(404);
  });
});

describe('GET /api/audit-log', () => {
  test('pages newest first and filters by actor', async () => {
    const person = await createUser(app.ctx, { roles: ['planner'] });
    for (const name of ['One', 'Two', 'Three']) await patch(person.user.id, { name: `${name} ${tribe}` });
    const res = await get(`/api/audit-log?targetType=user&targetId=${person.user.id}&pageSize=2&page=1`);
    const body = await res.json();
    expect(body.total).toBe(3);
    expect(body.items.map((e: { details: { changes: { name: { to: string } } } }) => e.details.changes.name.to)).toEqual([
      `Three ${tribe}`,
      `Two ${tribe}`,
    ]);
    const byActor = await (await get(`/api/audit-log?actorId=${admin.user.id}&pageSize=200`)).json();
    expect(byActor.items.every((e: { actor: { id: number } }) => e.actor.id === admin.user.id)).toBe(true);
  });

  test('is for administrators only', async () => {
    const person = await createUser(app.ctx, { roles: ['supervisor'] });
    const cookie = await signIn(app, person.email, person.password);
    expect((await get('/api/audit-log', cookie)).status).toBe(403);
  });
});

describe('demo accounts', () => {
  test('one per role plus Korvel staff, signing in with DEMO_PASSWORD; seeding again is harmless', async () => {
    await seedDemoAccounts(app.ctx);
    await seedDemoAccounts(app.ctx);
    const count = (role: string) => demoAccounts.filter((a) => a.roles.includes(role as never)).length;
    expect([count('admin'), count('planner'), count('technician'), count('supervisor')]).toEqual([1, 2, 4, 2]);
    for (const role of ['admin', 'planner', 'technician', 'supervisor', 'viewer']) {
      const res = await app.request('/api/auth/sign-in', {
        json: { email: `${role}@demo.varden.test`, password: app.ctx.config.DEMO_PASSWORD },
      });
      expect(res.status, role).toBe(200);
      expect((await res.json()).user.roles).toEqual([role]);
    }
  });
});
