import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { paths } from '../../config/paths';
import { isApiError } from '../../lib/api-client';

type Explained = { title: string; message: string; detail?: string };

function messageFromData(data: unknown): string | undefined {
  if (typeof data === 'string' && data !== '') return data;
  if (typeof data === 'object' && data !== null && 'message' in data && typeof data.message === 'string') {
    return data.message;
  }
  return undefined;
}

/** Turns whatever a route threw into words: `throw data(…, { status: 404 })`, an ApiError, a bug. */
export function explainRouteError(error: unknown): Explained {
  if (isRouteErrorResponse(error)) {
    if (error.status === 404) {
      return {
        title: 'Nothing here',
        message: messageFromData(error.data) ?? 'This page does not exist, or what it showed has been removed.',
      };
    }
    return {
      title: error.status === 403 ? 'Not allowed' : `Could not open this page (${error.status})`,
      message: messageFromData(error.data) ?? (error.statusText || 'The request was refused.'),
    };
  }
  if (isApiError(error)) {
    if (error.isUnreachable) return { title: 'Could not reach the server', message: error.message };
    if (error.status === 404) return { title: 'Nothing here', message: error.message };
    return { title: 'Could not load this page', message: error.message };
  }
  return {
    title: 'Something went wrong',
    message: 'This page stopped because of a fault in Varden. Reloading usually helps; if not, tell your administrator.',
    ...(import.meta.env.DEV && error instanceof Error ? { detail: error.stack ?? error.message } : {}),
  };
}

function ErrorMessage({ explained }: { explained: Explained }) {
  return (
    <div role="alert" className="max-w-measure">
      <title>{`${explained.title} · Varden`}</title>
      <h1 className="text-xl font-semibold desk:text-2xl">{explained.title}</h1>
      <p className="mt-2 text-ink-muted">{explained.message}</p>
      <p className="mt-4">
        <Link to={paths.home.getHref()}>Go to your start page</Link>
      </p>
      {explained.detail && (
        <details className="mt-6 text-sm">
          <summary className="cursor-pointer">Technical detail</summary>
          <pre className="mt-2 overflow-x-auto rounded bg-sunken p-3 font-mono text-xs">{explained.detail}</pre>
        </details>
      )}
    </div>
  );
}

/** Inside the shell: a section fails, the rail and the other sections stay usable. */
export function SectionErrorBoundary() {
  return <ErrorMessage explained={explainRouteError(useRouteError())} />;
}

/** Outside the shell: the last stop, when the shell itself could not render. */
export function RootErrorBoundary() {
  return (
    <main className="mx-auto min-h-dvh max-w-content px-4 py-10 desk:px-8">
      <p className="mb-6 text-lg font-semibold">Varden</p>
      <ErrorMessage explained={explainRouteError(useRouteError())} />
    </main>
  );
}
