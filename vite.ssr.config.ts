import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';

// The server's build of the web app: entry-server.tsx, which the API calls to draw a page's
// first view (apps/api/src/http/web-app.ts). It goes into apps/web/dist/.server after the
// browser's build (vite.config.ts), so a copy of dist carries it; a dot folder, which the API's
// static files never serve. Every dependency is bundled in, so it runs wherever dist is copied.
export default defineConfig({
  root: fileURLToPath(new URL('./apps/web', import.meta.url)),
  plugins: [react()],
  publicDir: false,
  ssr: { noExternal: true },
  build: {
    ssr: 'src/entry-server.tsx',
    outDir: fileURLToPath(new URL('./apps/web/dist/.server', import.meta.url)),
    emptyOutDir: true,
    sourcemap: false,
  },
});
