/**
 * Build of the web client: a multi-page app (plan map at `/`, site view at `/site.html`) with
 * everything bundled — Leaflet, its CSS and images, the engine worker — so it runs with no
 * internet at all. `npm run build` writes `client/dist`, which the server serves at `/`.
 */
import { defineConfig } from 'vite';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('.', import.meta.url));

export default defineConfig({
  root,
  base: './',
  publicDir: false,
  build: {
    outDir: fileURLToPath(new URL('./dist', import.meta.url)),
    emptyOutDir: true,
    // Inline nothing as data: URLs so a strict Content-Security-Policy (img-src 'self') still works.
    assetsInlineLimit: 0,
    chunkSizeWarningLimit: 1500,
    rollupOptions: {
      input: {
        index: fileURLToPath(new URL('./index.html', import.meta.url)),
        site: fileURLToPath(new URL('./site.html', import.meta.url)),
      },
    },
  },
  worker: { format: 'es' },
  server: { host: '127.0.0.1' },
});
