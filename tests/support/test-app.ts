import { once } from 'node:events';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from '../../apps/api/src/app';
import { loadConfig, type Config } from '../../apps/api/src/config';
import { closeContext, createContext, type AppContext } from '../../apps/api/src/context';
import type { Logger } from '../../apps/api/src/logger';

export interface TestApp {
  ctx: AppContext;
  /** The listening server, for a test that stops it as the process would (apps/api/src/shutdown.ts). */
  server: Server;
  url: string;
  /** fetch against the app, with JSON helpers and the app's own Origin on writes. */
  request: (path: string, init?: RequestInit & { json?: unknown; cookie?: string }) => Promise<Response>;
  close: () => Promise<void>;
}

/**
 * The real API on port 0 against the test MariaDB, S3 fake and mail fake that `npm test`
 * started (their addresses arrive in the environment). Jobs are off unless asked for.
 */
export async function startTestApp(overrides: Partial<Record<keyof Config, string>> = {}, options: { log?: (config: Config) => Logger } = {}): Promise<TestApp> {
  const config = loadConfig({ ...process.env, PORT: '0', JOBS_ENABLED: 'false', ...overrides });
  const ctx = createContext(config);
  // A logger of the test's own (one that writes where the test reads), set before the app takes it.
  if (options.log) ctx.log = options.log(config);
  const server = createApp(ctx).listen(0, '127.0.0.1');
  await once(server, 'listening');
  const { port } = server.address() as AddressInfo;
  const url = `http://127.0.0.1:${port}`;
  ctx.config.APP_ORIGIN = url;
  ctx.config.PORT = port;

  const request: TestApp['request'] = (path, init = {}) => {
    const { json, cookie, headers, ...rest } = init;
    const h = new Headers(headers);
    if (json !== undefined) h.set('content-type', 'application/json');
    if (cookie) h.set('cookie', cookie);
    const method = (rest.method ?? (json !== undefined ? 'POST' : 'GET')).toUpperCase();
    if (method !== 'GET' && method !== 'HEAD' && !h.has('origin')) h.set('origin', url);
    return fetch(url + path, { ...rest, method, headers: h, ...(json !== undefined ? { body: JSON.stringify(json) } : {}) });
  };

  return {
    ctx,
    server,
    url,
    request,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await closeContext(ctx);
    },
  };
}

/** A string no other test will pick, for e-mails and names that must be unique. */
export function unique(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;
}
