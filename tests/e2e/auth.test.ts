import type { Role } from '@varden/schemas';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { adoptSession, expectAccessible, launchBrowser, newContext, visit } from '../support/browser';
import { createUser, signIn } from '../support/factories';
import { latestMailTo, setPasswordLinkIn } from '../support/mailbox';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;
let browser: Browser;
beforeAll(async () => {
  app = await startTestApp();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await app?.close();
});

/** A client address of its own (the app trusts X-Forwarded-For from loopback), so throttling here touches no other test. */
const freshAddress = () => `10.77.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;

const heading = (page: Page) => page.getByRole('heading', { level: 1 }).innerText();
const pathOf = (page: Page) => new URL(page.url()).pathname;

async function fillSignIn(page: Page, email: string, password: string) {
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

async function siteNamed(cookie: string): Promise<{ id: number; name: string }> {
  const name = unique('Quay');
  const res = await app.request('/api/sites', {
    cookie,
    json: {
      name,
      address: '4 Harbour Row',
      voltageV: 400,
      frequencyHz: 50,
      transformerKva: 1600,
      transformerImpedancePct: 6,
      targetPf: 0.95,
      tariffBasis: 'tan-phi-limit',
      tariffLimit: 0.4,
      pricePerKvarh: 0.02,
    },
  });
  expect(res.status).toBe(201);
  const site = (await res.json()) as { id: number };
  return { id: site.id, name };
}

const homes: Record<Role, { path: string; heading: string }> = {
  admin: { path: '/people', heading: 'People' },
  planner: { path: '/planning', heading: 'Planning desk' },
  technician: { path: '/today', heading: 'Today’s orders' },
  supervisor: { path: '/review', heading: 'Review queue' },
  viewer: { path: '/site-health', heading: 'Site health' },
};

describe('each role signs in and lands on its own home', () => {
  for (const role of Object.keys(homes) as Role[]) {
    test(`${role} → ${homes[role].heading}`, async () => {
      const { user, email, password } = await createUser(app.ctx, { roles: [role], name: `Journey ${role}` });
      const context = await newContext(browser);
      const page = await context.newPage();

      await visit(page, app.url + '/');
      await page.waitForURL((url) => url.pathname === '/sign-in');
      await fillSignIn(page, email, password);

      await page.waitForURL((url) => url.pathname === homes[role].path);
      await expect.poll(() => heading(page)).toBe(homes[role].heading);
      await page.waitForLoadState('networkidle');
      await expectAccessible(page);
      // The user menu names the person; the rail offers their home and hides what they may not do.
      expect(await page.getByTestId('account-name').innerText()).toBe(user.name);
      const rail = page.getByRole('navigation', { name: 'Sections' });
      expect(await rail.getByRole('link', { name: homes[role].heading }).count()).toBe(1);
      expect(await rail.getByRole('link', { name: 'People' }).count()).toBe(role === 'admin' ? 1 : 0);
      await context.close();
    });
  }

  test('a technician on a 360 px phone finds the safety steps, the empty day and the menu with sign-out', async () => {
    const { user, email, password } = await createUser(app.ctx, { roles: ['technician'] });
    const context = await newContext(browser, { width: 360, height: 800 });
    const page = await context.newPage();
    await visit(page, app.url + '/today');
    await page.waitForURL((url) => url.pathname === '/sign-in' && url.searchParams.get('next') === '/today');
    await fillSignIn(page, email, password);
    await page.waitForURL((url) => url.pathname === '/today');
    await page.waitForLoadState('networkidle');
    await expectAccessible(page);
    expect(await page.getByText('Before any work on a bank').count()).toBe(1);
    expect(await page.getByRole('heading', { name: 'No orders assigned to you for today' }).count()).toBe(1);
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);

    // The user menu lives in the phone header's menu.
    expect(await page.getByTestId('account-name').isVisible()).toBe(false);
    await page.getByRole('button', { name: 'Menu' }).click();
    expect(await page.getByTestId('account-name').innerText()).toBe(user.name);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL((url) => url.pathname === '/sign-in');
    await expect.poll(() => page.getByText('You are signed out.').count()).toBe(1);

    // Signed out means signed out on the server too: the old page sends us back to sign in.
    await visit(page, app.url + '/today');
    await page.waitForURL((url) => url.pathname === '/sign-in');
    await context.close();
  });
});

test('a wrong password gets a clear message, and repeated failures say when to try again', async () => {
  const { email, password } = await createUser(app.ctx, { roles: ['planner'] });
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, extraHTTPHeaders: { 'x-forwarded-for': freshAddress() } });
  const page = await context.newPage();
  await visit(page, app.url + '/sign-in');

  await fillSignIn(page, email, 'not the right passphrase');
  const alert = page.getByRole('alert');
  await expect.poll(() => alert.innerText()).toBe('The e-mail or password is not right.');
  expect(pathOf(page)).toBe('/sign-in');
  expect(await page.getByLabel('Password', { exact: true }).inputValue()).toBe('');
  await expectAccessible(page);

  // Five failures within 15 minutes hold the account for 5 minutes, even for the right password.
  for (let attempt = 2; attempt <= 5; attempt++) {
    await fillSignIn(page, email, `wrong passphrase number ${attempt}`);
    await expect.poll(() => alert.innerText()).toBe('The e-mail or password is not right.');
  }
  await fillSignIn(page, email, password);
  await expect.poll(() => alert.innerText()).toMatch(/^Too many failed sign-ins\. Try again in 5 minutes\.$/);
  expect(pathOf(page)).toBe('/sign-in');
  await context.close();
});

test('the reset page confirms the same way whether or not the e-mail has an account', async () => {
  const { email } = await createUser(app.ctx, { roles: ['technician'] });
  const context = await newContext(browser);
  const page = await context.newPage();
  const confirmations: string[] = [];
  for (const address of [email, `${unique('nobody')}@example.test`]) {
    await visit(page, app.url + '/reset-password');
    await page.getByLabel('E-mail', { exact: true }).fill(address);
    await page.getByRole('button', { name: 'Send me a link' }).click();
    const status = page.getByRole('status').filter({ hasText: 'link' });
    await expect.poll(() => status.count()).toBe(1);
    confirmations.push(await status.innerText());
    await expectAccessible(page);
  }
  expect(confirmations[0]).toMatch(/If an account uses this e-mail/);
  expect(confirmations[1]).toBe(confirmations[0]);
  expect((await latestMailTo(app, email, 'Set a new Varden password'))?.text).toMatch(/set-password\?token=/);
  await context.close();
});

test('an administrator invites a viewer to one site; the mailed link sets a password that then signs in', async () => {
  const admin = await createUser(app.ctx, { roles: ['admin'] });
  const planner = await createUser(app.ctx, { roles: ['planner'] });
  const plannerCookie = await signIn(app, planner.email, planner.password);
  const [granted, other] = [await siteNamed(plannerCookie), await siteNamed(plannerCookie)];
  const invitee = { email: `${unique('facility')}@example.test`, name: 'Maren Quillfeather' };

  const adminContext = await newContext(browser);
  await adoptSession(adminContext, app.url, await signIn(app, admin.email, admin.password));
  const adminPage = await adminContext.newPage();
  await visit(adminPage, app.url + '/people');
  await adminPage.getByRole('link', { name: 'Invite someone' }).click();
  await adminPage.waitForURL((url) => url.pathname === '/people/invite');
  await adminPage.waitForLoadState('networkidle');
  await expectAccessible(adminPage);

  // The form refuses before asking the server: no role chosen.
  await adminPage.getByLabel('E-mail', { exact: true }).fill(invitee.email);
  await adminPage.getByLabel('Name', { exact: true }).fill(invitee.name);
  await adminPage.getByRole('button', { name: 'Send the invitation' }).click();
  await expect.poll(() => adminPage.getByText('Choose at least one role').count()).toBe(1);

  await adminPage.getByRole('checkbox', { name: /^Viewer/ }).check();
  await adminPage.getByRole('checkbox', { name: new RegExp(`^${granted.name}`) }).check();
  await adminPage.getByRole('button', { name: 'Send the invitation' }).click();
  await adminPage.waitForURL((url) => /^\/people\/\d+$/.test(url.pathname));
  await expect.poll(() => heading(adminPage)).toBe(invitee.name);
  expect(await adminPage.getByText(`The invitation is on its way to ${invitee.email}`).count()).toBe(1);
  expect(await adminPage.getByRole('checkbox', { name: new RegExp(`^${granted.name}`) }).isChecked()).toBe(true);
  await expectAccessible(adminPage);

  const link = setPasswordLinkIn(await latestMailTo(app, invitee.email, 'You are invited to Varden'));
  expect(link.purpose).toBe('invitation');
  expect(link.url.origin).toBe(app.url);

  const context = await newContext(browser);
  const page = await context.newPage();
  await visit(page, link.url.toString());
  await expect.poll(() => heading(page)).toBe('Choose your password');
  expect(await page.getByText('At least 12 characters').count()).toBeGreaterThan(0);

  // The server's refusal of a common password lands on the field.
  await page.getByLabel('New password', { exact: true }).fill('password1234');
  await page.getByLabel('The same password again', { exact: true }).fill('password1234');
  await page.getByRole('button', { name: 'Set my password' }).click();
  await expect.poll(() => page.getByText(/commonly used passwords/).count()).toBeGreaterThan(0);
  await expectAccessible(page);

  const chosen = 'kestrel lanterns over the quay';
  await page.getByLabel('New password', { exact: true }).fill(chosen);
  await page.getByLabel('The same password again', { exact: true }).fill(chosen);
  await page.getByRole('button', { name: 'Set my password' }).click();
  await page.waitForURL((url) => url.pathname === '/sign-in');
  await expect.poll(() => page.getByText('Your password is set').count()).toBe(1);
  expect(await page.getByLabel('E-mail', { exact: true }).inputValue()).toBe(invitee.email);
  await expectAccessible(page);

  await page.getByLabel('Password', { exact: true }).fill(chosen);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === '/site-health');
  await expect.poll(() => heading(page)).toBe('Site health');
  // A viewer sees the site granted and no other.
  await expect.poll(() => page.getByRole('heading', { name: granted.name }).count()).toBe(1);
  expect(await page.getByRole('heading', { name: other.name }).count()).toBe(0);
  await expectAccessible(page);

  // The administrator sees the invitation accepted in the audit log.
  await visit(adminPage, app.url + '/audit-log');
  expect(await adminPage.getByText('Accepted the invitation').count()).toBeGreaterThan(0);

  await context.close();
  await adminContext.close();
});

test('the people table searches, sorts and pages on the server, with its state in the URL', async () => {
  const tribe = unique('plover').replace(/-/g, '');
  const admin = await createUser(app.ctx, { roles: ['admin'], name: `Admin ${tribe}` });
  for (const name of ['Aino', 'Bertil', 'Cyrus']) await createUser(app.ctx, { roles: ['technician'], name: `${name} ${tribe}` });
  const context = await newContext(browser);
  await adoptSession(context, app.url, await signIn(app, admin.email, admin.password));
  const page = await context.newPage();
  await visit(page, app.url + '/people');

  await page.getByRole('searchbox', { name: 'Search' }).fill(tribe);
  await page.waitForURL((url) => url.searchParams.get('q') === tribe);
  const names = () => page.locator('tbody tr td:first-child a').allInnerTexts();
  await expect.poll(names).toEqual([`Admin ${tribe}`, `Aino ${tribe}`, `Bertil ${tribe}`, `Cyrus ${tribe}`]);

  await page.getByRole('button', { name: 'Name' }).click();
  await page.waitForURL((url) => url.searchParams.get('sort') === '-name');
  await expect.poll(names).toEqual([`Cyrus ${tribe}`, `Bertil ${tribe}`, `Aino ${tribe}`, `Admin ${tribe}`]);
  expect(await page.locator('th[aria-sort="descending"]').innerText()).toBe('Name');

  // A shared link opens the same view: the second page of two people each.
  await visit(page, `${app.url}/people?q=${tribe}&sort=-name&pageSize=2&page=2`);
  await expect.poll(names).toEqual([`Aino ${tribe}`, `Admin ${tribe}`]);
  expect(await page.getByText('3–4 of 4 people').count()).toBe(1);
  await context.close();
});

test('an administrator who removes their own administrator role is told why it is refused', async () => {
  const admin = await createUser(app.ctx, { roles: ['admin', 'planner'] });
  const context = await newContext(browser);
  await adoptSession(context, app.url, await signIn(app, admin.email, admin.password));
  const page = await context.newPage();
  await visit(page, `${app.url}/people/${admin.user.id}`);
  await page.getByRole('checkbox', { name: /^Administrator/ }).uncheck();
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect.poll(() => page.getByRole('alert').innerText()).toMatch(/cannot remove your own administrator role/);
  expect(await page.getByText('Keep your administrator role').count()).toBe(1);
  await expectAccessible(page);
  await context.close();
});

test('pages an administrator holds are refused, and hidden, for other roles', async () => {
  const technician = await createUser(app.ctx, { roles: ['technician'] });
  const context = await newContext(browser);
  await adoptSession(context, app.url, await signIn(app, technician.email, technician.password));
  const page = await context.newPage();
  await visit(page, app.url + '/people');
  await expect.poll(() => heading(page)).toBe('Not allowed');
  expect(await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'People' }).count()).toBe(0);
  await context.close();
});
