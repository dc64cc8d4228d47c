import { existsSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import express from 'express';

// Serves the built web app (apps/web/dist): hashed files under /assets cached for a year, and
// index.html for every other path so the client router can answer. Into that index.html go
// preload hints for what the requested page needs before it can draw, from Vite's build manifest
// and the web's page table (apps/web/public/page-modules.json): the page's own chunks and those
// its loader starts at once (<link rel="modulepreload">), and the session and the page's data
// (<link rel="preload" as="fetch">, which the app's own fetch then takes over). The browser fetches them beside the
// entry chunk instead of after it has run and after one another: on a phone's slow link each
// round trip saved is 150 ms or more before the first render.

type ManifestChunk = { file: string; imports?: string[]; isEntry?: boolean };
type Manifest = Record<string, ManifestChunk>;
type PageModule = { path: string; module: string; lazy?: string[]; data?: string[]; firstView?: boolean };
type PageTable = { session?: string; start?: string; pages: PageModule[] };

/** A page's path pattern ("/field/orders/:id"), scored as React Router ranks routes: static segments first. */
type PagePattern = { segments: string[]; score: number; modules: string[]; data: string[]; firstView: boolean };

const segmentsOf = (pathname: string) => pathname.split('/').filter(Boolean);

function scoreOf(segments: string[]): number {
  return segments.reduce((score, segment) => score + (segment.startsWith(':') ? 3 : 10), segments.length === 0 ? 1 : 0);
}

const decoded = (segment: string) => {
  try {
    return decodeURIComponent(segment);
  } catch {
    return segment;
  }
};

/** The path's parameters (decoded, as the router gives them) when it matches the pattern, else undefined. */
function matchOf(pattern: string[], segments: string[]): Record<string, string> | undefined {
  if (pattern.length !== segments.length) return undefined;
  const params: Record<string, string> = {};
  for (const [i, part] of pattern.entries()) {
    const segment = segments[i]!;
    if (part.startsWith(':')) params[part.slice(1)] = decoded(segment);
    else if (part !== segment) return undefined;
  }
  return params;
}

/** "/api/work-orders/:id" with the page's own id. */
const withParams = (template: string, params: Record<string, string>) =>
  template.replace(/:(\w+)/g, (whole, name: string) => (params[name] === undefined ? whole : encodeURIComponent(params[name])));

const escapeAttribute = (value: string) => value.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;');

/** The files chunks load statically, each chunk first, leaving out those already in `skip`. */
function staticFiles(manifest: Manifest, keys: string[], skip: Set<string>): string[] {
  const files: string[] = [];
  const seen = new Set<string>();
  const visit = (k: string) => {
    if (seen.has(k)) return;
    seen.add(k);
    const chunk = manifest[k];
    if (!chunk) return;
    if (chunk.file.endsWith('.js') && !skip.has(chunk.file)) files.push(chunk.file);
    for (const imported of chunk.imports ?? []) visit(imported);
  };
  for (const key of keys) visit(key);
  return files;
}

type Preloads = { session: string | undefined; start: string[]; patterns: PagePattern[] };

/**
 * Each page's preloads, from the build manifest: the page module's chunk, the chunks its loader
 * starts at once, and every chunk these import statically that the entry does not (index.html
 * already preloads the entry's own); and the API requests its loaders make at once. Without a manifest or a page table (an older build,
 * a test's stand-in) there are none.
 */
export function pagePreloads(distDir: string): Preloads {
  const manifestPath = path.join(distDir, '.vite', 'manifest.json');
  const pagesPath = path.join(distDir, 'page-modules.json');
  if (!existsSync(manifestPath) || !existsSync(pagesPath)) return { session: undefined, start: [], patterns: [] };
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Manifest;
  const table = JSON.parse(readFileSync(pagesPath, 'utf8')) as PageTable;
  const entry = Object.keys(manifest).find((key) => manifest[key]?.isEntry);
  const entryFiles = new Set(entry ? staticFiles(manifest, [entry], new Set()) : []);
  // The app itself, which the small entry imports once it has let the first view paint (main.tsx).
  const start = table.start ? staticFiles(manifest, [table.start], entryFiles) : [];
  const loadedByEntry = new Set([...entryFiles, ...start]);
  const patterns = table.pages
    .filter((page) => manifest[page.module])
    .map((page) => {
      const segments = segmentsOf(page.path);
      const modules = staticFiles(manifest, [page.module, ...(page.lazy ?? [])], loadedByEntry);
      return { segments, score: scoreOf(segments), modules, data: page.data ?? [], firstView: page.firstView === true };
    })
    .sort((a, b) => b.score - a.score);
  return { session: table.session, start, patterns };
}

type PageMatch = { pattern: PagePattern; params: Record<string, string> };

/** The page table's entry for a path, with its parameters. */
function pageOf({ patterns }: Preloads, pathname: string): PageMatch | undefined {
  const segments = segmentsOf(pathname);
  for (const pattern of patterns) {
    const params = matchOf(pattern.segments, segments);
    if (params) return { pattern, params };
  }
  return undefined;
}

/** A page's first view drawn on the server: its markup for #root, the data it was drawn from, and the id main.tsx reads that data by. */
export type FirstView = { html: string; state: Record<string, unknown>; stateId: string };

/** The state as JSON that cannot end its script element early ("</script>" in a name) or be read as markup. */
const scriptJson = (value: unknown) => JSON.stringify(value).replace(/</g, '\\u003c').replace(/>/g, '\\u003e').replace(/&/g, '\\u0026');

/**
 * index.html for a path: the page's preload links at the end of its head and, when the server
 * drew its first view, that markup in #root and its data in a JSON script element (not run, so
 * the content security policy needs no exception) that the app hydrates from
 * (apps/web/src/app/first-view.ts). A page drawn on the server has its session and data with
 * it and preloads nothing from its head: its script files are listed in the state instead.
 */
export function indexFor(indexHtml: string, preloads: Preloads, pathname: string, firstView?: FirstView): string {
  const page = pageOf(preloads, pathname);
  const modules = [...preloads.start, ...(page?.pattern.modules ?? [])].map((file) => `/${file}`);
  // A page drawn on the server has its session and data with it, and shows without its script:
  // the script is requested once the first view is on screen (main.tsx), so on a slow link the
  // page's own styles and fonts are not held back by 150 KB of code that only makes it interactive.
  const links = firstView
    ? []
    : [
        ...modules.map((url) => `<link rel="modulepreload" crossorigin href="${url}">`),
        // A fetch preload in the fetch's own mode (cors, same-origin credentials), so the app's request takes it over.
        ...[...(preloads.session ? [preloads.session] : []), ...(page?.pattern.data ?? []).map((template) => withParams(template, page?.params ?? {}))].map(
          (url) => `<link rel="preload" as="fetch" crossorigin href="${escapeAttribute(url)}">`,
        ),
      ];
  let html = links.length === 0 ? indexHtml : indexHtml.replace('</head>', `  ${links.join('\n    ')}\n  </head>`);
  if (firstView) {
    const state = { ...firstView.state, modules };
    html = html.replace(
      '<div id="root"></div>',
      () => `<div id="root">${firstView.html}</div>\n    <script type="application/json" id="${firstView.stateId}">${scriptJson(state)}</script>`,
    );
  }
  return html;
}

type RenderResult = { kind: 'rendered'; html: string; state: Record<string, unknown> } | { kind: 'not-rendered'; reason: string };
type Renderer = {
  /** The id of the state's element, as the web app reads it (apps/web/src/app/first-view-state.ts). */
  firstViewStateId: string;
  render: (request: { url: string; apiOrigin: string; cookie: string | undefined; acceptLanguage: string | undefined; signal: AbortSignal }) => Promise<RenderResult>;
};

/** How long a first view may take on the server before the browser is left to draw the page. */
const firstViewTimeoutMs = 1500;

/** This process's own address for the request, for the server render's API requests (loopback, same port). */
function ownOrigin(req: express.Request): string {
  const address = req.socket.localAddress ?? '127.0.0.1';
  return `http://${address.includes(':') ? `[${address}]` : address}:${req.socket.localPort}`;
}

type Logger = { warn: (details: object, message: string) => void };

/**
 * Serves the built web app; unknown paths get index.html so the client router can answer. The
 * pages the page table marks `firstView` are drawn on the server first, when the build has the
 * server's entry (apps/web/dist/.server, vite.ssr.config.ts): whatever stops that (a redirect, a
 * refusal, an error, the time limit) leaves the page to the browser, as without it.
 */
export function serveWebApp(app: express.Express, distDir: string | undefined, log?: Logger): void {
  const indexPath = distDir && path.join(distDir, 'index.html');
  if (!distDir || !indexPath || !existsSync(indexPath)) return;
  const rendererPath = path.join(distDir, '.server', 'entry-server.js');
  // Read again only when the build changes (a rebuild under `npm run dev` renames every chunk).
  // The server's entry is a module, loaded once: its chunks import it by its own URL, so it
  // cannot be loaded afresh beside itself. After a rebuild the browser draws every page.
  let renderer: { mtimeMs: number; module: Promise<Renderer> } | undefined;
  let built: { mtimeMs: number; indexHtml: string; preloads: Preloads } | undefined;
  const current = () => {
    const { mtimeMs } = statSync(indexPath);
    if (built?.mtimeMs !== mtimeMs) {
      built = { mtimeMs, indexHtml: readFileSync(indexPath, 'utf8'), preloads: pagePreloads(distDir) };
      if (!renderer && existsSync(rendererPath)) renderer = { mtimeMs, module: import(pathToFileURL(rendererPath).href) as Promise<Renderer> };
      renderer?.module.catch(() => undefined);
    }
    return { ...built, renderer: renderer?.mtimeMs === mtimeMs ? renderer.module : undefined };
  };
  const firstViewOf = async (req: express.Request, renderer: Promise<Renderer>): Promise<FirstView | undefined> => {
    try {
      const { render, firstViewStateId } = await renderer;
      const result = await render({
        url: new URL(req.originalUrl, 'http://varden.invalid').href,
        apiOrigin: ownOrigin(req),
        cookie: req.headers.cookie,
        // Numbers and dates in the visitor's locale (apps/web/src/lib/reader-format.ts).
        acceptLanguage: req.headers['accept-language'],
        signal: AbortSignal.timeout(firstViewTimeoutMs),
      });
      return result.kind === 'rendered' ? { html: result.html, state: result.state, stateId: firstViewStateId } : undefined;
    } catch (error) {
      log?.warn({ err: error, path: req.path }, 'The first view could not be drawn on the server; the browser draws it');
      return undefined;
    }
  };
  app.use(
    '/assets',
    express.static(path.join(distDir, 'assets'), { immutable: true, maxAge: '365d', fallthrough: false }),
  );
  app.use(express.static(distDir, { index: false, maxAge: '1h' }));
  app.get(/^(?!\/api\/).*/, async (req, res) => {
    const { indexHtml, preloads, renderer } = current();
    const page = pageOf(preloads, req.path);
    const firstView = renderer && page?.pattern.firstView ? await firstViewOf(req, renderer) : undefined;
    // A page drawn on the server holds the visitor's own data: never kept by a shared cache.
    res.setHeader('Cache-Control', firstView ? 'private, no-cache' : 'no-cache');
    // Its data is the visitor's (the session cookie), and so are its numbers and dates (their locale cookie, or Accept-Language).
    res.setHeader('Vary', 'Cookie, Accept-Language');
    res.type('html').send(indexFor(indexHtml, preloads, req.path, firstView));
  });
}
