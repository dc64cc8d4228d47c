import { QueryClient } from '@tanstack/react-query';
import { matchRoutes, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { permissions } from '@varden/schemas';
import { afterEach, describe, expect, it, vi } from 'vitest';
import pageTable from '../../public/page-modules.json';
import { appRoutes, type RouteModule } from './router';

// The API preloads a page's chunks from this table (apps/api/src/http/web-app.ts): a path whose
// module is missing or wrong would preload nothing or the wrong page's code.

const routes = appRoutes(new QueryClient());

/** Someone signed in who may do everything, as GET /api/auth/me answers. */
const everyone = {
  user: { id: 1, email: 'a@example.com', name: 'A', active: true, status: 'active', roles: ['admin'], siteIds: [], createdAt: '2026-01-01T00:00:00.000Z', lastSignInAt: null },
  permissions,
};

/** The API paths a page's loaders request when it opens (first load: a fresh query client), answering the session and 404 to the rest. */
async function requestsOf(url: string, routesFor = appRoutes): Promise<string[]> {
  const requested: string[] = [];
  vi.stubGlobal('fetch', async (input: string) => {
    requested.push(input);
    return input === pageTable.session ? Response.json(everyone) : Response.json({ error: { code: 'not_found', message: 'No such record' } }, { status: 404 });
  });
  const matched = matchRoutes(routesFor(new QueryClient({ defaultOptions: { queries: { retry: false } } })), url) ?? [];
  const request = new Request(`http://localhost${url}`);
  await Promise.allSettled(
    matched.map(async ({ route, params }) => {
      const loader = route.lazy ? (await (route.lazy as () => Promise<Pick<RouteObject, 'loader'>>)()).loader : route.loader;
      if (typeof loader === 'function') await loader({ request, params, context: {} } as LoaderFunctionArgs);
    }),
  );
  return requested;
}

afterEach(() => {
  vi.unstubAllGlobals();
});

/** Every lazily loaded route: what the table has to cover. */
function lazyRoutes(list: RouteObject[]): RouteObject[] {
  return list.flatMap((route) => [...(route.lazy && route.path !== '*' ? [route] : []), ...lazyRoutes(route.children ?? [])]);
}

/** A URL the path pattern matches: each `:param` as 1. */
const sampleUrl = (pattern: string) => pattern.replace(/:\w+/g, '1');

describe('public/page-modules.json', () => {
  it('names every lazily loaded page of the router once', () => {
    const covered = pageTable.pages.map((page) => matchRoutes(routes, sampleUrl(page.path))?.at(-1)?.route);
    expect(new Set(covered).size).toBe(pageTable.pages.length);
    expect(new Set(covered)).toEqual(new Set(lazyRoutes(routes)));
  });

  it.each(pageTable.pages.filter((page) => 'data' in page))('$path requests $data at once', async ({ path, ...page }) => {
    const requested = await requestsOf(sampleUrl(path));
    expect(requested).toContain(pageTable.session);
    for (const template of (page as { data: string[] }).data) expect(requested).toContain(sampleUrl(template));
  });

  it.each(pageTable.pages.filter((page) => 'lazy' in page))('$path starts loading $lazy at once', async ({ path, ...page }) => {
    const lazy = (page as { lazy: string[] }).lazy;
    const started: string[] = [];
    vi.resetModules();
    for (const module of lazy) {
      vi.doMock(`../../${module}`, async (importOriginal) => {
        started.push(module);
        return importOriginal();
      });
    }
    // A router of its own, whose pages load afresh through the mocks.
    const fresh = (await import('./router')) as { appRoutes: typeof appRoutes };
    await requestsOf(sampleUrl(path), fresh.appRoutes);
    // Started, not awaited: the order this page asks for does not exist here.
    await vi.waitFor(() => expect(new Set(started)).toEqual(new Set(lazy)));
  });

  it('every page requests the session at once', async () => {
    expect(await requestsOf('/sign-in')).toEqual([pageTable.session]);
  });

  it.each(pageTable.pages)('$path loads $module', async ({ path, module }) => {
    const leaf = matchRoutes(routes, sampleUrl(path))?.at(-1)?.route;
    const lazy = leaf?.lazy;
    expect(typeof lazy).toBe('function');
    const loaded = await (lazy as () => Promise<Pick<RouteObject, 'Component'>>)();
    const pageModule = (await import(/* @vite-ignore */ `../../${module}`)) as RouteModule;
    expect(loaded.Component).toBe(pageModule.default);
  });
});
