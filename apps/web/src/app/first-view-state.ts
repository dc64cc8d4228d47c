import type { DehydratedState } from '@tanstack/react-query';
import type { HydrationState } from 'react-router-dom';

// Read by the app's small entry (main.tsx) before the framework loads: types only from the framework.

/**
 * The first view drawn on the server: the data its markup was drawn from, written into
 * index.html as JSON (a `<script type="application/json">`, which the content security policy
 * lets through because it never runs) so the browser starts from the same data and keeps the
 * markup instead of drawing it again.
 */
export type FirstViewState = {
  /** React Router's loader answers, by route id. */
  router: Pick<HydrationState, 'loaderData'>;
  /** TanStack Query's cache after the loaders ran: the session and the page's data. */
  queries: DehydratedState;
  /** The locale and time zone the server wrote numbers and dates in (lib/reader-format.ts). */
  reader?: { locale: string; timeZone: string };
  /** The app's and the page's script files, preloaded once the first view is on screen (added by the API). */
  modules?: string[];
};

/** The id of the element that carries the state; the API writes it (apps/api/src/http/web-app.ts). */
export const firstViewStateId = 'varden-first-view';

/** The state the server wrote into this page, if it drew the page. */
export function readFirstViewState(doc: Document): FirstViewState | undefined {
  const text = doc.getElementById(firstViewStateId)?.textContent;
  if (!text) return undefined;
  try {
    return JSON.parse(text) as FirstViewState;
  } catch {
    return undefined;
  }
}

