import { AsyncLocalStorage } from 'node:async_hooks';
import { dehydrate, QueryClientProvider } from '@tanstack/react-query';
import { StrictMode } from 'react';
import { renderToString } from 'react-dom/server';
import { createStaticHandler, createStaticRouter, StaticRouterProvider } from 'react-router-dom';
import { createQueryClient } from './app/query-client';
import { appRoutes } from './app/router';
import type { FirstViewState } from './app/first-view-state';

/** The id of the element the API writes the state into, read back by main.tsx: one name for both sides. */
export { firstViewStateId } from './app/first-view-state';
import { setApiTransport } from './lib/api-client';
import { readerCookieName, setReaderFormatSource, type ReaderFormat } from './lib/reader-format';

/**
 * The first view of a page, rendered on the server (built with `vite build --ssr` into
 * apps/web/dist-server and called by the API for a page's HTML, apps/api/src/http/web-app.ts).
 * The page's own loaders run here exactly as in the browser, their API requests going to the
 * API itself with the visitor's cookie; the markup and the data it was drawn from go into
 * index.html, and main.tsx hydrates that markup instead of drawing the page again.
 */

export type RenderRequest = {
  /** The page's URL as the browser asked for it. */
  url: string;
  /** Where this process answers /api, e.g. http://127.0.0.1:3000. */
  apiOrigin: string;
  /** The visitor's Cookie header: the loaders' requests are theirs, with their permissions. */
  cookie: string | undefined;
  /** The visitor's Accept-Language header, for a visitor whose browser has not yet kept its locale. */
  acceptLanguage: string | undefined;
  signal: AbortSignal;
};

/** A page drawn on the server, or why not (the browser then draws it, as without this). */
export type RenderResult =
  | { kind: 'rendered'; html: string; state: FirstViewState }
  | { kind: 'not-rendered'; reason: string };

type Visit = { apiOrigin: string; cookie: string | undefined; signal: AbortSignal; reader: ReaderFormat };
const visit = new AsyncLocalStorage<Visit>();

// Numbers and dates as the visitor's browser writes them (lib/reader-format.ts).
setReaderFormatSource(() => visit.getStore()?.reader);

/** A locale and zone as Intl resolves them, or undefined when either is not one Intl knows. */
function resolved(locale: string | undefined, timeZone: string | undefined): ReaderFormat | undefined {
  try {
    const options = new Intl.DateTimeFormat(locale, { timeZone }).resolvedOptions();
    return { locale: options.locale, timeZone: options.timeZone };
  } catch {
    return undefined;
  }
}

/**
 * The locale and time zone the visitor's browser formats in: the ones it keeps in its
 * `varden_reader` cookie (src/app/start.tsx writes it at every start); before it has one, the first
 * language it accepts and this server's zone. The state tells the browser which were used, so
 * it hydrates only markup that reads as it would draw it (src/app/start.tsx).
 */
export function readerFormatFor(cookie: string | undefined, acceptLanguage: string | undefined): ReaderFormat {
  const kept = cookie
    ?.split(';')
    .map((part) => part.trim())
    .find((part) => part.startsWith(`${readerCookieName}=`));
  if (kept) {
    let text = '';
    try {
      text = decodeURIComponent(kept.slice(readerCookieName.length + 1));
    } catch {
      // Not a value the app wrote: as if there were none.
    }
    const [locale, timeZone, ...rest] = text.split(' ');
    const fromCookie = rest.length === 0 && locale && timeZone ? resolved(locale, timeZone) : undefined;
    if (fromCookie) return fromCookie;
  }
  const language = acceptLanguage?.split(',')[0]?.split(';')[0]?.trim();
  return (language && language !== '*' ? resolved(language, undefined) : undefined) ?? resolved(undefined, undefined)!;
}

// Each render's requests carry its own visitor's cookie (one render's store cannot reach another's).
setApiTransport((path, init) => {
  const current = visit.getStore();
  if (!current) throw new Error('An API request outside a server render');
  const headers = new Headers(init.headers);
  if (current.cookie) headers.set('cookie', current.cookie);
  return fetch(new URL(path, current.apiOrigin), { ...init, headers, signal: init.signal ?? current.signal });
});

export async function render({ url, apiOrigin, cookie, acceptLanguage, signal }: RenderRequest): Promise<RenderResult> {
  const reader = readerFormatFor(cookie, acceptLanguage);
  return visit.run({ apiOrigin, cookie, signal, reader }, async () => {
    const queryClient = createQueryClient();
    // One try: a page the server cannot draw at once is drawn by the browser instead.
    queryClient.setDefaultOptions({ ...queryClient.getDefaultOptions(), queries: { ...queryClient.getDefaultOptions().queries, retry: false } });
    try {
      const { query, dataRoutes } = createStaticHandler(appRoutes(queryClient));
      const context = await query(new Request(url, { signal }));
      // A redirect (signed out, signed in already) or a refusal is left to the browser's router,
      // which answers it as it does for a page opened from a link.
      if (context instanceof Response) return { kind: 'not-rendered', reason: `redirect ${context.status}` };
      if (context.errors || context.statusCode !== 200) return { kind: 'not-rendered', reason: `status ${context.statusCode}` };
      const router = createStaticRouter(dataRoutes, context);
      const html = renderToString(
        <StrictMode>
          <QueryClientProvider client={queryClient}>
            <StaticRouterProvider router={router} context={context} hydrate={false} />
          </QueryClientProvider>
        </StrictMode>,
      );
      const state: FirstViewState = {
        router: { loaderData: context.loaderData },
        queries: dehydrate(queryClient),
        reader,
      };
      return { kind: 'rendered', html, state };
    } finally {
      queryClient.clear();
    }
  });
}
