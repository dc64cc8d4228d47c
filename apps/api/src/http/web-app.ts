import { existsSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
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
type PageModule = { path: string; module: string; lazy?: string[]; data?: string[] };
type PageTable = { session?: string; pages: PageModule[] };

/** A page's path pattern ("/field/orders/:id"), scored as React Router ranks routes: static segments first. */
type PagePattern = { segments: string[]; score: number; modules: string[]; data: string[] };

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

type Preloads = { session: string | undefined; patterns: PagePattern[] };

/**
 * Each page's preloads, from the build manifest: the page module's chunk, the chunks its loader
 * starts at once, and every chunk these import statically that the entry does not (index.html
 * already preloads the entry's own); and the API requests its loaders make at once. Without a manifest or a page table (an older build,
 * a test's stand-in) there are none.
 */
export function pagePreloads(distDir: string): Preloads {
  const manifestPath = path.join(distDir, '.vite', 'manifest.json');
  const pagesPath = path.join(distDir, 'page-modules.json');
  if (!existsSync(manifestPath) || !existsSync(pagesPath)) return { session: undefined, patterns: [] };
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Manifest;
  const table = JSON.parse(readFileSync(pagesPath, 'utf8')) as PageTable;
  const entry = Object.keys(manifest).find((key) => manifest[key]?.isEntry);
  const loadedByEntry = new Set(entry ? staticFiles(manifest, [entry], new Set()) : []);
  const patterns = table.pages
    .filter((page) => manifest[page.module])
    .map((page) => {
      const segments = segmentsOf(page.path);
      const modules = staticFiles(manifest, [page.module, ...(page.lazy ?? [])], loadedByEntry);
      return { segments, score: scoreOf(segments), modules, data: page.data ?? [] };
    })
    .sort((a, b) => b.score - a.score);
  return { session: table.session, patterns };
}

/** index.html for a path: the session's and the page's preload links at the end of its head. */
export function indexFor(indexHtml: string, { session, patterns }: Preloads, pathname: string): string {
  const segments = segmentsOf(pathname);
  const page = patterns.map((pattern) => ({ pattern, params: matchOf(pattern.segments, segments) })).find((candidate) => candidate.params);
  const links = [
    ...(page?.pattern.modules ?? []).map((file) => `<link rel="modulepreload" crossorigin href="/${file}">`),
    // A fetch preload in the fetch's own mode (cors, same-origin credentials), so the app's request takes it over.
    ...[...(session ? [session] : []), ...(page?.pattern.data ?? []).map((template) => withParams(template, page?.params ?? {}))].map(
      (url) => `<link rel="preload" as="fetch" crossorigin href="${escapeAttribute(url)}">`,
    ),
  ];
  if (links.length === 0) return indexHtml;
  return indexHtml.replace('</head>', `  ${links.join('\n    ')}\n  </head>`);
}

/** Serves the built web app; unknown paths get index.html so the client router can answer. */
export function serveWebApp(app: express.Express, distDir: string | undefined): void {
  const indexPath = distDir && path.join(distDir, 'index.html');
  if (!distDir || !indexPath || !existsSync(indexPath)) return;
  // Read again only when the build changes (a rebuild under `npm run dev` renames every chunk).
  let built: { mtimeMs: number; indexHtml: string; preloads: Preloads } | undefined;
  const current = () => {
    const { mtimeMs } = statSync(indexPath);
    if (built?.mtimeMs !== mtimeMs) built = { mtimeMs, indexHtml: readFileSync(indexPath, 'utf8'), preloads: pagePreloads(distDir) };
    return built;
  };
  app.use(
    '/assets',
    express.static(path.join(distDir, 'assets'), { immutable: true, maxAge: '365d', fallthrough: false }),
  );
  app.use(express.static(distDir, { index: false, maxAge: '1h' }));
  app.get(/^(?!\/api\/).*/, (req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    const { indexHtml, preloads } = current();
    res.type('html').send(indexFor(indexHtml, preloads, req.path));
  });
}
