import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { createBankWithUnits, createUser, createWorkOrder, signIn } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

// The pages marked `firstView` in apps/web/public/page-modules.json are drawn on the server
// (apps/api/src/http/web-app.ts with the build's apps/web/dist/.server/entry-server.js): the
// page's own loaders run with the visitor's cookie, the markup goes into #root and the data into a
// JSON script element. Whatever stops the drawing leaves the page to the browser. The browser's
// side (hydration keeps these nodes) is tests/e2e/first-view.test.ts.

let app: TestApp;
type Person = { cookie: string; name: string; email: string };
let technician: Person;
let otherTechnician: Person;
let viewer: Person;
let orderId: number;
const orderTitle = unique('Capacitance check </script><script>window.injected=1</script>');

beforeAll(async () => {
  if (!process.env.WEB_DIST_DIR) throw new Error('WEB_DIST_DIR is not set: run through npm test, which builds the web app');
  app = await startTestApp({ WEB_DIST_DIR: process.env.WEB_DIST_DIR });
  const makePerson = async (name: string, role: 'technician' | 'viewer') => {
    const person = await createUser(app.ctx, { roles: [role], name });
    return { user: person.user, name, email: person.email, cookie: await signIn(app, person.email, person.password) };
  };
  const first = await makePerson(unique('Ada Field'), 'technician');
  technician = first;
  otherTechnician = await makePerson(unique('Bo Switchroom'), 'technician');
  viewer = await makePerson(unique('Cy Client'), 'viewer');
  const bank = await createBankWithUnits(app.ctx, { steps: 1 });
  orderId = await createWorkOrder(app.ctx, { bank, state: 'on-site', assigneeId: first.user.id, title: orderTitle });
}, 60_000);

afterAll(async () => {
  await app?.close();
});

/** The page's HTML and what the server put into it. */
async function pageOf(path: string, cookie?: string) {
  const res = await app.request(path, cookie ? { cookie } : {});
  const html = await res.text();
  const root = /<div id="root">([\s\S]*?)<\/div>\s*(?:<script type="application\/json"|<noscript>)/.exec(html)?.[1] ?? '';
  const stateText = /<script type="application\/json" id="varden-first-view">([\s\S]*?)<\/script>/.exec(html)?.[1];
  return { res, html, root, stateText, state: stateText ? (JSON.parse(stateText) as Record<string, unknown>) : undefined };
}

describe('a page drawn on the server', () => {
  test('sign-in comes drawn, with its data and its script files for after the first paint', async () => {
    const { res, root, state, html } = await pageOf('/sign-in');
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('private, no-cache');
    expect(root).toContain('<h1');
    expect(root).toContain('Sign in');
    expect(root).toMatch(/<input[^>]+type="password"/);
    expect(state).toMatchObject({ router: { loaderData: expect.any(Object) }, queries: { queries: expect.any(Array) } });
    // The app's scripts are not preloaded by the HTML (only the small entry's own helper is):
    // main.tsx asks for them once the page is on screen.
    const modules = state!.modules as string[];
    expect(modules.length).toBeGreaterThan(1);
    expect(modules.every((file) => file.startsWith('/assets/') && file.endsWith('.js'))).toBe(true);
    for (const file of modules) expect(html).not.toContain(`rel="modulepreload" crossorigin href="${file}"`);
  });

  test("the technician's order is drawn with the order, for its assignee, and its text cannot end the script element", async () => {
    const { res, root, stateText, state } = await pageOf(`/field/orders/${orderId}`, technician.cookie);
    expect(res.status).toBe(200);
    // React escapes the title in the markup; the JSON escapes < and > so "</script>" stays inside it.
    expect(root).toContain('Capacitance check &lt;/script&gt;');
    expect(stateText).not.toContain('</script>');
    expect(stateText).toContain('\\u003c/script\\u003e');
    const queries = (state!.queries as { queries: Array<{ queryKey: unknown[]; state: { data: unknown } }> }).queries;
    const order = queries.find((query) => JSON.stringify(query.state.data).includes('Capacitance check'));
    expect(order, 'the order is in the cache the browser starts from').toBeDefined();
    expect(JSON.stringify(order!.state.data)).toContain(orderTitle.replace(/"/g, '\\"'));
    // The session in the state is the visitor's own.
    expect(JSON.stringify(queries.find((query) => query.queryKey[0] === 'session')?.state.data)).toContain(technician.name);
  });

  test("numbers and dates are the visitor's: the locale and zone their browser kept, else their language", async () => {
    // The app keeps the browser's own in this cookie (apps/web/src/lib/reader-format.ts).
    const reader = `varden_reader=${encodeURIComponent('de-DE America/New_York')}`;
    const { res, root, state } = await pageOf(`/field/orders/${orderId}`, `${technician.cookie}; ${reader}`);
    expect(res.headers.get('vary')).toMatch(/^Cookie, Accept-Language\b/);
    expect(state!.reader).toEqual({ locale: 'de-DE', timeZone: 'America/New_York' });
    const queries = (state!.queries as { queries: Array<{ state: { data: unknown } }> }).queries;
    const dueOn = (queries.map((query) => query.state.data).find((data) => (data as { title?: string } | null)?.title === orderTitle) as { dueOn: string }).dueOn;
    // German dates read DD.MM.YYYY (ICU's medium style); a due date stays its own day in New York, west of UTC.
    const [year, month, day] = dueOn.slice(0, 10).split('-');
    // (React writes a comment between the two text nodes.)
    expect(root).toMatch(new RegExp(`Due (<!-- -->)?${day}\\.${month}\\.${year}<`));

    // No cookie yet (the first visit): the first language the browser accepts, in the server's zone.
    const first = await app.request('/sign-in', { headers: { 'accept-language': 'fr-CA,fr;q=0.8' } });
    const firstState = /<script type="application\/json" id="varden-first-view">([\s\S]*?)<\/script>/.exec(await first.text())?.[1];
    expect((JSON.parse(firstState!) as { reader: unknown }).reader).toEqual({ locale: 'fr-CA', timeZone: new Intl.DateTimeFormat().resolvedOptions().timeZone });
  });

  test('renders at once for different visitors each carry only their own session', async () => {
    const sessionIn = (state: Record<string, unknown> | undefined) =>
      JSON.stringify((state?.queries as { queries: Array<{ queryKey: unknown[]; state: { data: unknown } }> } | undefined)?.queries.find((query) => query.queryKey[0] === 'session')?.state.data);
    const [mine, theirs, again] = await Promise.all([
      pageOf(`/field/orders/${orderId}`, technician.cookie),
      pageOf(`/field/orders/${orderId}`, otherTechnician.cookie),
      pageOf('/sign-in', technician.cookie),
    ]);
    expect(sessionIn(mine.state)).toContain(technician.email);
    expect(sessionIn(mine.state)).not.toContain(otherTechnician.email);
    // Another technician may read the order (recording on it is refused): drawn with their own session.
    expect(sessionIn(theirs.state)).toContain(otherTechnician.email);
    expect(theirs.html).not.toContain(technician.email);
    // Signed in already, sign-in redirects in the browser: nothing drawn, nothing of the session in the page.
    expect(again.state).toBeUndefined();
    expect(again.html).not.toContain(technician.email);
  });

  test('a signed-out visitor to a signed-in page gets the plain page, which sends them to sign in', async () => {
    const { res, root, state, html } = await pageOf('/fleet');
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('no-cache');
    expect(root).toBe('');
    expect(state).toBeUndefined();
    expect(html).toContain('rel="modulepreload"');
  });

  test('a page the role does not include is left to the browser, which shows the refusal', async () => {
    // A viewer (a client's facility manager) does not record readings: the order page refuses them.
    const { root, state } = await pageOf(`/field/orders/${orderId}`, viewer.cookie);
    expect(root).toBe('');
    expect(state).toBeUndefined();
  });

  test('pages not marked for it are never drawn on the server', async () => {
    const { root, state } = await pageOf('/work-orders', technician.cookie);
    expect(root).toBe('');
    expect(state).toBeUndefined();
  });
});
